import { describe, expect, it } from 'vitest';
import { provenanceView } from '../../../src/report/data/provenance-view.js';
import { provenanceSection } from '../../../src/report/html/provenance-section.js';
import { manifestFixture } from '../report-fixtures.js';

describe('provenanceView', () => {
  it('shows each input with the column map it was read with, from the study file as recorded', () => {
    const manifest = { ...manifestFixture(), parameters: { seed: 20261201, study: { name: 'x', inputs: [{ path: 'messages.csv', columns: { person: 'who', time: 'when', text: 'note' }, format: 'csv' }], series: { bin: '1d' } } } };
    const v = provenanceView(manifest);
    expect(v.inputs).toEqual([{ path: 'messages.csv', readWith: 'columns person=who,time=when,text=note; format csv', rows: '120', bytes: '', sha256: 'ab'.repeat(32) }]);
    expect(v.run).toContainEqual(['Seed of every random step', '20261201']);
    expect(v.settings).toContainEqual(['series.bin', '1d']);
  });

  it('shows the output of `lexichron score` from its sidecar: the inputs named input-1, input-2 with their --file-columns maps', () => {
    const sidecar = {
      tool: { name: 'lexichron', version: '0.1.0' },
      lexicons: [{ name: 'afinn-165', version: '165', sha256: 'ef'.repeat(32) }],
      columns: [{ name: 'afinn-165.valence', aggregation: 'sum' }],
      inputs: [
        { path: 'input-1', bytes: 120, sha256: 'aa'.repeat(32), rows: 2, columns: { person: 'who', time: 'when', text: 'note' } },
        { path: 'input-2', bytes: 90, sha256: 'bb'.repeat(32), rows: 1 },
      ],
      reconciliation: { read: 3, scored: 3, rejected: {}, dropped: {} },
      options: { keepText: false, pseudonymized: true },
    };
    const v = provenanceView(sidecar);
    expect(v.inputs.map((i) => [i.path, i.readWith])).toEqual([
      ['input-1', 'columns person=who,time=when,text=note'],
      ['input-2', ''],
    ]);
    expect(v.run).toContainEqual(['Person ids', 'pseudonyms (keyed hash); input files named by position']);
    expect(v.columns).toEqual([{ name: 'afinn-165.valence', scoredAs: 'sum', binnedAs: '' }]);
    const html = provenanceSection({ ok: true, value: { manifest: sidecar } });
    expect(html).toContain('<code>columns person=who,time=when,text=note</code>');
    expect(html).toContain('default column names');
  });

  it('sums up each stage in words and leaves nothing of the manifest as JSON', () => {
    const manifest = { ...manifestFixture(), stages: { series: { persons: 3, bins: 30, observed: 25, missing: { no_text: 5 }, entries: 90, excludedEntries: 0, rejected: {} }, validation: { reconciliation: { read: 9, kept: 9, rejected: {} }, pairs: [{ score: 'a', rating: 'b' }] }, custom: { itemsSeen: 4 } } };
    const v = provenanceView(manifest);
    expect(v.stages).toEqual([
      ['series', '3 persons, 30 bins, 25 with a score (bins without: no text 5); 90 entries binned, 0 excluded by hour, 0 scores rows left out.'],
      ['validation', '1 text score × self-report pairs; the statistics and how the self-reports were read and paired are in section 3.'],
      ['custom', 'items seen: 4.'],
    ]);
    const html = provenanceSection({ ok: true, value: { manifest } });
    expect(html).not.toMatch(/[{[]&quot;|[{[]"|&quot;\w+&quot;:/);
  });
});
