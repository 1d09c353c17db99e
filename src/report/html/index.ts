export { renderReport } from './render-report.js';
export { CAUTIONS } from './cautions.js';
