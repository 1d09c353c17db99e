import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { defaultStudyStages } from '../../src/io/study-stages.js';
import { runStudy } from '../../src/pipeline.js';
import { syntacticNames } from '../../src/report/syntactic-names.js';
import { parseCsvRows } from '../support/csv.js';
import { tempFolder } from '../support/temp-files.js';

// A name R's make.names and a Python identifier both accept (R Language Definition §10.3.2; Python
// reference §2.3 identifiers); pandas attribute access needs the latter.
const BARE = /^[A-Za-z][A-Za-z0-9_]*$/;

describe('syntacticNames', () => {
  it('turns dots, hyphens and @ into _, keeps names unique and avoids R reserved words', () => {
    expect(syntacticNames(['afinn-165.valence', 'vader.compound.within_lag1', 'vader.compound@3', 'person', '1st', 'if', 'a.b', 'a_b'])).toEqual([
      'afinn_165_valence', 'vader_compound_within_lag1', 'vader_compound_3', 'person', 'x1st', 'if_', 'a_b', 'a_b_2',
    ]);
  });
});

const tmp = tempFolder('lexichron-names-');

beforeAll(async () => {
  const text = ['person,time,text'];
  const ratings = ['person,time,mood'];
  for (let d = 1; d <= 9; d++) {
    for (const p of ['ana', 'ben']) {
      text.push(`${p},2026-06-0${d}T09:00:00Z,${d % 2 ? 'a glad calm day' : 'a sad worried tired day'}`);
      ratings.push(`${p},2026-06-0${d}T20:00:00Z,${(d % 4) + 1}`);
    }
  }
  tmp.write('texts.csv', text.join('\n') + '\n');
  tmp.write('ratings.csv', ratings.join('\n') + '\n');
  tmp.write('study.json', JSON.stringify({ inputs: [{ path: 'texts.csv' }], timeZone: 'UTC', lexicons: ['afinn-165', 'vader', 'daily-constructs'], ratings: { path: 'ratings.csv', scales: { mood: [1, 5] } }, names: 'syntactic', dynamics: false, out: 'out' }));
  await runStudy(tmp.path('study.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1, stages: defaultStudyStages() });
}, 60_000);

describe('run with names: syntactic', () => {
  const pkg = () => JSON.parse(readFileSync(tmp.path('out/datapackage.json'), 'utf8')) as { names: { style: string }; resources: Array<{ path: string; schema: { fields: Array<{ name: string; title?: string }> } }> };

  it('every CSV header holds only bare names, the same as datapackage.json\'s field names', () => {
    const resources = pkg().resources.filter((r) => r.path.endsWith('.csv'));
    expect(resources.length).toBeGreaterThan(4);
    for (const r of resources) {
      const header = parseCsvRows(readFileSync(tmp.path(`out/${r.path}`), 'utf8'))[0] ?? [];
      expect(header, r.path).toEqual(r.schema.fields.map((f) => f.name));
      for (const name of header) expect(name, r.path).toMatch(BARE);
    }
    expect(parseCsvRows(readFileSync(tmp.path('out/scores.csv'), 'utf8'))[0]).toContain('afinn_165_valence');
  });

  it('datapackage.json keeps each original name as the field title, and notes the style', () => {
    const scores = pkg().resources.find((r) => r.path === 'scores.csv');
    expect(scores?.schema.fields.find((f) => f.name === 'daily_constructs_worry_per100w')?.title).toBe('daily-constructs.worry_per100w');
    expect(pkg().names.style).toBe('syntactic');
  });

  it('manifest.json\'s digests match the renamed files', () => {
    const manifest = JSON.parse(readFileSync(tmp.path('out/manifest.json'), 'utf8')) as { outputs: Array<{ path: string; sha256?: string }> };
    for (const o of manifest.outputs.filter((x) => x.sha256)) {
      expect(createHash('sha256').update(readFileSync(tmp.path(`out/${o.path}`))).digest('hex'), o.path).toBe(o.sha256);
    }
  });
});
