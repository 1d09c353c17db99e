import type { Part, ProvenanceData } from '../report-data.js';
import { absentNote } from './absent-note.js';
import { cautions } from './cautions.js';
import { jsonView } from './json-view.js';
import { sectionFrame } from './section-frame.js';

/** Keys whose text the report shows in its own sections: verdicts (validation) and the cautions (above). */
const SHOWN_ELSEWHERE = new Set(['verdict', 'cautions']);

/** The manifest without the prose the page already shows, so each paragraph appears once. */
function withoutShownText(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(withoutShownText);
  if (typeof value !== 'object' || value === null) return value;
  return Object.fromEntries(Object.entries(value).filter(([k]) => !SHOWN_ELSEWHERE.has(k)).map(([k, v]) => [k, withoutShownText(v)]));
}

/** Section 6: the run's manifest in readable form (inputs with hashes, lexicons, parameters), then the cautions. */
export function provenanceSection(provenance: Part<ProvenanceData>): string {
  const parts: string[] = ['<h3>Before you use these numbers</h3>', cautions(), '<h3>How this output was made</h3>'];
  if (provenance.ok) parts.push(`<div class="manifest">${jsonView(withoutShownText(provenance.value.manifest))}</div>`);
  else parts.push(absentNote('The manifest is', provenance.reason));
  return sectionFrame('provenance', 6, 'Provenance and cautions', 'What went in, with which settings and versions, and the limits of what comes out.', parts.join(''));
}
