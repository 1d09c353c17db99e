export { renderReport } from './render-report.js';
export { REPORT_CAUTIONS } from './cautions.js';
