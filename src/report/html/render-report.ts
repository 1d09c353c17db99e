import type { ReportData } from '../report-data.js';
import { coverageSection } from './coverage-section.js';
import { escapeHtml } from './escape-html.js';
import { lexiconSection } from './lexicon-section.js';
import { provenanceSection } from './provenance-section.js';
import { readinessSection } from './readiness-section.js';
import { reportStyles } from './report-styles.js';
import { seriesSection } from './series-section.js';
import { validationSection } from './validation-section.js';

const SECTIONS: [string, string][] = [
  ['coverage', 'Coverage'],
  ['series', 'Per-person series'],
  ['validation', 'Validation'],
  ['lexicons', 'Lexicons'],
  ['dynamics', 'Dynamics readiness'],
  ['provenance', 'Provenance and cautions'],
];

/**
 * The whole report as one self-contained HTML document: inline CSS and inline SVG charts, no
 * script, no font, image or stylesheet from anywhere else, so it opens from disk with the network
 * off. Pure: the same data always gives the same bytes (no clock is read; the manifest supplies
 * the run time).
 */
export function renderReport(data: ReportData): string {
  const toc = SECTIONS.map(([id, label], i) => `<li><a href="#${id}">${i + 1}. ${escapeHtml(label)}</a></li>`).join('');
  const body = [
    coverageSection(data.coverage, data.reconciliation),
    seriesSection(data.series),
    validationSection(data.validation, data.ratingsReconciliation),
    lexiconSection(data.lexicons),
    readinessSection(data.readiness, data.dynamics),
    provenanceSection(data.provenance),
  ].join('\n');
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">
<meta name="generator" content="${escapeHtml(`${data.tool.name} ${data.tool.version}`)}">
<title>${escapeHtml(data.title)}</title>
<style>${reportStyles()}</style>
</head>
<body>
<div class="page">
<nav class="toc" aria-label="Sections"><strong>${escapeHtml(data.tool.name)} report</strong><ol>${toc}</ol></nav>
<main>
<header class="masthead"><h1>${escapeHtml(data.title)}</h1><div class="meta">Built by ${escapeHtml(`${data.tool.name} ${data.tool.version}`)} from the output folder <code>${escapeHtml(data.source)}</code>.</div></header>
<p class="banner"><strong>Research measures, not clinical assessments.</strong> The scores below come from word lists and describe groups and trends; they must not be used to judge any one person's mental health or risk. See section 6 for the cautions and the provenance of every number.</p>
${body}
<footer>Self-contained page: every chart is inline SVG and nothing is loaded from the network. Colours follow the Okabe–Ito palette, readable with common colour-vision deficiencies.</footer>
</main>
</div>
</body>
</html>
`;
}
