import type { Part, ProvenanceData } from '../report-data.js';
import { absentNote } from './absent-note.js';
import { cautions } from './cautions.js';
import { jsonView } from './json-view.js';
import { sectionFrame } from './section-frame.js';

/** Section 6: the run's manifest in readable form (inputs with hashes, lexicons, parameters), then the cautions. */
export function provenanceSection(provenance: Part<ProvenanceData>): string {
  const parts: string[] = ['<h3>Before you use these numbers</h3>', cautions(), '<h3>How this output was made</h3>'];
  if (provenance.ok) parts.push(`<div class="manifest">${jsonView(provenance.value.manifest)}</div>`);
  else parts.push(absentNote('The manifest is', provenance.reason));
  return sectionFrame('provenance', 6, 'Provenance and cautions', 'What went in, with which settings and versions, and the limits of what comes out.', parts.join(''));
}
