import { provenanceView } from '../data/provenance-view.js';
import type { Part, ProvenanceData } from '../report-data.js';
import { absentNote } from './absent-note.js';
import { cautions } from './cautions.js';
import { escapeHtml } from './escape-html.js';
import { htmlTable } from './html-table.js';
import { sectionFrame } from './section-frame.js';

/** Label–value rows as a two-column table with the labels as row headers. */
function labelledTable(rows: ReadonlyArray<readonly [string, string]>, caption: string, labelHead: string, valueHead: string, codeLabels = false): string {
  const body = rows.map(([label, value]) => `<tr><th scope="row">${codeLabels ? `<code>${escapeHtml(label)}</code>` : escapeHtml(label)}</th><td>${escapeHtml(value)}</td></tr>`).join('');
  return `<table class="provenance"><caption>${escapeHtml(caption)}</caption><thead><tr><th>${escapeHtml(labelHead)}</th><th>${escapeHtml(valueHead)}</th></tr></thead><tbody>${body}</tbody></table>`;
}

/** A SHA-256 digest shortened for the page, the whole digest in its tooltip. */
const digest = (sha256: string): string => (sha256 ? `<code title="${escapeHtml(sha256)}">${escapeHtml(sha256.slice(0, 12))}…</code>` : '–');

function filesTable(rows: ReadonlyArray<{ path: string; bytes: string; sha256: string; rows?: string; readWith?: string }>, caption: string, withReading: boolean): string {
  const head = `<tr><th>File</th>${withReading ? '<th>Read with</th><th class="num">Rows</th>' : ''}<th class="num">Bytes</th><th>SHA-256</th></tr>`;
  const body = rows
    .map((f) => `<tr><td><code>${escapeHtml(f.path)}</code></td>${withReading ? `<td>${f.readWith ? `<code>${escapeHtml(f.readWith)}</code>` : '<span class="muted">default column names</span>'}</td><td class="num">${escapeHtml(f.rows || '–')}</td>` : ''}<td class="num">${escapeHtml(f.bytes || '–')}</td><td>${digest(f.sha256)}</td></tr>`)
    .join('');
  return `<table class="provenance"><caption>${escapeHtml(caption)}</caption><thead>${head}</thead><tbody>${body}</tbody></table>`;
}

/**
 * Section 6: the cautions, then how the output was made, each part a table with labels in words:
 * the run (program, time, command, seed, privacy), the input files with how each was read (column
 * map) and its digest, the word lists, the study settings as keys of the study file, the score
 * columns, one line per stage, the files written and persons removed later. No JSON is shown.
 */
export function provenanceSection(provenance: Part<ProvenanceData>): string {
  const parts: string[] = ['<h3>Before you use these numbers</h3>', cautions(), '<h3>How this output was made</h3>'];
  if (provenance.ok) {
    const v = provenanceView(provenance.value.manifest);
    if (v.run.length) parts.push(labelledTable(v.run, 'The run', 'What', 'Value'));
    if (v.inputs.length) parts.push(filesTable(v.inputs, 'Files read, with how each was read and its digest (hover for the whole SHA-256)', true));
    if (v.lexicons.length)
      parts.push(
        `<table class="provenance"><caption>Word lists</caption><thead><tr><th>Lexicon</th><th>Version</th><th>Licence</th><th>Source</th><th>SHA-256</th></tr></thead><tbody>${v.lexicons
          .map((l) => `<tr><td><code>${escapeHtml(l.name)}</code></td><td>${escapeHtml(l.version)}</td><td>${escapeHtml(l.license || '–')}</td><td>${escapeHtml(l.source || '–')}</td><td>${digest(l.sha256)}</td></tr>`)
          .join('')}</tbody></table>`,
      );
    if (v.settings.length) parts.push(labelledTable(v.settings, 'Study settings as recorded (keys of the study file, defaults filled in)', 'Setting', 'Value', true));
    if (v.columns.length) parts.push(htmlTable([{ label: 'Score column' }, { label: 'Scored as' }, { label: 'Bin value' }], v.columns.map((c) => [c.name, c.scoredAs || '–', c.binnedAs || '–']), 'Score columns, how each entry was scored and how a bin combines its entries'));
    if (v.stages.length) parts.push(labelledTable(v.stages, 'What each stage did', 'Stage', 'Summary'));
    if (v.outputs.length) parts.push(filesTable(v.outputs, 'Files written, with their digests', false));
    if (v.forgotten.length) parts.push(htmlTable([{ label: 'Person (pseudonymous)' }, { label: 'Removed at' }, { label: 'Files changed' }], v.forgotten, 'Persons removed after the run (withdrawal of consent)'));
  } else parts.push(absentNote('The manifest is', provenance.reason));
  return sectionFrame('provenance', 6, 'Provenance and cautions', 'What went in, with which settings and versions, and the limits of what comes out.', parts.join(''));
}
