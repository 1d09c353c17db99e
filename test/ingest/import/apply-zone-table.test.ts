import { describe, expect, it } from 'vitest';
import { applyZoneTable } from '../../../src/ingest/import/apply-zone-table.js';
import type { ImportItem } from '../../../src/ingest/import/import-item.js';
import { buildZoneTable } from '../../../src/ingest/zone-table.js';
import { collect } from '../../support/temp-files.js';

// A person who moves from Europe/Berlin to America/Chicago, taking effect on the local date 2026-11-05.
// Offsets from the IANA tz database: Berlin +01:00 (CET) and Chicago -06:00 (CST) in November 2026.
const table = buildZoneTable([
  { person: 'p04', zone: 'Europe/Berlin', line: 2 },
  { person: 'p04', zone: 'America/Chicago', from: '2026-11-05', line: 3 },
], 'zones.csv');
const DST = { gap: 'reject', overlap: 'reject' } as const;

async function* items(...list: ImportItem[]): AsyncGenerator<ImportItem> {
  yield* list;
}
/** An entry as an importer that read it in Europe/Berlin gives it. */
const berlin = (line: number, localIso: string, wallClock: boolean): ImportItem => {
  const instant = Date.parse(`${localIso}+01:00`);
  return { kind: 'entry', entry: { id: `x:${line}`, person: 'p04', instant, zone: 'Europe/Berlin', offsetMinutes: 60, text: 'words', source: { file: 'x', line } }, ...(wallClock ? { wallClock: true } : {}) };
};
const placed = (list: ImportItem[]) => list.map((i) => (i.kind === 'entry' ? [i.entry.zone, new Date(i.entry.instant).toISOString(), i.entry.offsetMinutes] : [i.kind]));

describe('applyZoneTable places imported entries of a person who moves in the zone in force (zone file with effective dates)', () => {
  it('reads a wall-clock time (diary, chat log) on or after the move date in the new zone: 2026-11-06 09:00 in Chicago is 15:00 UTC', async () => {
    const out = await collect(applyZoneTable(items(berlin(1, '2026-11-04T09:00:00', true), berlin(2, '2026-11-06T09:00:00', true)), table, 'p04', DST));
    expect(placed(out)).toEqual([
      ['Europe/Berlin', '2026-11-04T08:00:00.000Z', 60],
      ['America/Chicago', '2026-11-06T15:00:00.000Z', -360],
    ]);
  });

  it('keeps a time written with its offset (a mail Date header) as the same instant and gives it the zone in force then', async () => {
    const out = await collect(applyZoneTable(items(berlin(1, '2026-11-06T09:00:00', false)), table, 'p04', DST));
    expect(placed(out)).toEqual([['America/Chicago', '2026-11-06T08:00:00.000Z', 60]]);
  });

  it('passes rejects and drops through, and leaves a person without moves untouched', async () => {
    const reject: ImportItem = { kind: 'reject', diagnostic: { code: 'diary_bad_date', message: 'm', source: { file: 'x', line: 9 }, stage: 'ingest' } };
    const drop: ImportItem = { kind: 'drop', reason: 'third_party', source: { file: 'x', line: 10 } };
    const single = buildZoneTable([{ person: 'p04', zone: 'Europe/Berlin', line: 2 }], 'zones.csv');
    const entry = berlin(1, '2026-11-06T09:00:00', true);
    expect(await collect(applyZoneTable(items(reject, drop, entry), single, 'p04', DST))).toEqual([reject, drop, entry]);
  });

  it('rejects a wall-clock time that the new zone skips (IANA tz: America/Chicago springs forward at 02:00 on 2027-03-14) under the dstGap policy', async () => {
    const out = await collect(applyZoneTable(items(berlin(1, '2027-03-14T02:30:00', true)), table, 'p04', DST));
    expect(out[0]?.kind === 'reject' && out[0].diagnostic).toMatchObject({ code: 'time_in_gap', source: { file: 'x', line: 1 } });
  });
});
