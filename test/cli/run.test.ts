import { execFileSync, spawnSync } from 'node:child_process';
import { cpSync, existsSync, readdirSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { parseCsvRows, readCsv } from '../support/csv.js';
import { tempFolder } from '../support/temp-files.js';

// End to end: `lexichron run demo-data/study.json` on a temporary copy of demo-data (the study
// writes to ../out, so the output lands in the temporary folder).
const root = resolve(__dirname, '../..');
const bin = resolve(root, 'bin/lexichron.js');
const tmp = tempFolder('lexichron-run-');

function run(tz: string): { status: number | null; stderr: string } {
  const r = spawnSync(process.execPath, [bin, 'run', 'demo-data/study.json'], { cwd: tmp.dir, encoding: 'utf8', env: { ...process.env, TZ: tz } });
  return { status: r.status, stderr: r.stderr };
}

function snapshot(dir: string): Map<string, string> {
  const files = new Map<string, string>();
  const walk = (sub: string): void => {
    for (const e of readdirSync(resolve(dir, sub), { withFileTypes: true })) {
      const rel = sub ? `${sub}/${e.name}` : e.name;
      if (e.isDirectory()) walk(rel);
      else files.set(rel, readFileSync(resolve(dir, rel), 'utf8'));
    }
  };
  walk('');
  return files;
}

/** Splits a CSV header line (RFC 4180; lexichron headers hold no quotes or commas in names). */
const headerOf = (csv: string): string[] => parseCsvRows(csv)[0] ?? [];

let first: Map<string, string>;
let second: Map<string, string>;

beforeAll(() => {
  if (!existsSync(resolve(root, 'dist/cli/main.js'))) execFileSync('npx', ['tsc', '-p', 'tsconfig.json'], { cwd: root, stdio: 'inherit' });
  cpSync(resolve(root, 'demo-data'), tmp.path('demo-data'), { recursive: true });
  const a = run('UTC');
  expect(a.status, a.stderr).toBe(0);
  first = snapshot(tmp.path('out'));
  // Second run in another machine zone: outputs must not depend on it either.
  const b = run('America/New_York');
  expect(b.status, b.stderr).toBe(0);
  second = snapshot(tmp.path('out'));
}, 240_000);

describe('lexichron run demo-data/study.json (end to end)', () => {
  it('writes scores, the series files, datapackage.json and manifest.json', () => {
    for (const f of ['scores.csv', 'scores.rejects.csv', 'scores.csv.meta.json', 'series-long.csv', 'series-long.wide.csv', 'series-long.events.csv', 'series-long.rejects.csv', 'datapackage.json', 'manifest.json']) {
      expect(first.has(f), f).toBe(true);
    }
  });

  it('datapackage.json (Frictionless Tabular Data Package) lists every CSV with a field for every column, in order', () => {
    const pkg = JSON.parse(first.get('datapackage.json') as string) as { profile: string; resources: Array<{ path: string; profile: string; schema: { fields: Array<{ name: string; type: string; description: string }> } }> };
    expect(pkg.profile).toBe('tabular-data-package');
    const csvs = [...first.keys()].filter((f) => f.endsWith('.csv')).sort();
    expect(pkg.resources.map((r) => r.path).sort()).toEqual(csvs);
    for (const r of pkg.resources) {
      expect(r.profile).toBe('tabular-data-resource');
      expect(r.schema.fields.map((f) => f.name), r.path).toEqual(headerOf(first.get(r.path) as string));
      for (const f of r.schema.fields) {
        expect(['string', 'integer', 'number', 'boolean', 'date', 'datetime'], `${r.path} ${f.name}`).toContain(f.type);
        expect(f.description.length, `${r.path} ${f.name}`).toBeGreaterThan(3);
      }
    }
  });

  it('manifest.json records every input with SHA-256 and rows, lexicons with SHA-256, and a reconciliation where read = scored + rejected', () => {
    const m = JSON.parse(first.get('manifest.json') as string) as {
      inputs: Array<{ path: string; sha256: string; rows: number }>;
      lexicons: Array<{ name: string; version: string; sha256: string }>;
      reconciliation: { read: number; scored: number; rejected: Record<string, number>; dropped: Record<string, number> };
      outputs: Array<{ path: string; sha256: string }>;
    };
    expect(m.inputs.map((i) => i.path)).toEqual(expect.arrayContaining(['messages.csv', 'zones.csv']));
    for (const input of m.inputs) {
      expect(input.sha256, input.path).toMatch(/^[0-9a-f]{64}$/);
      expect(Number.isInteger(input.rows) && input.rows > 0, `${input.path} rows`).toBe(true);
    }
    const messages = m.inputs.find((i) => i.path === 'messages.csv');
    // Records counted independently with papaparse (texts hold quoted line breaks, so lines ≠ rows).
    expect(messages?.rows).toBe(readCsv(tmp.path('demo-data/messages.csv')).length);
    expect(m.lexicons.map((l) => l.name)).toEqual(['afinn-165', 'vader', 'daily-constructs']);
    for (const l of m.lexicons) expect(l.sha256, l.name).toMatch(/^[0-9a-f]{64}$/);
    const r = m.reconciliation;
    const rejected = Object.values(r.rejected).reduce((a, b) => a + b, 0);
    const dropped = Object.values(r.dropped).reduce((a, b) => a + b, 0);
    expect(r.read).toBe(r.scored + rejected + dropped);
    expect(r.scored).toBe((first.get('scores.csv') as string).trimEnd().split('\n').length - 1);
    expect(rejected).toBe((first.get('scores.rejects.csv') as string).trimEnd().split('\n').length - 1);
    for (const o of m.outputs) expect(first.has(o.path), o.path).toBe(true);
  });

  it('gives byte-identical outputs on a second run (in another machine zone), except the manifest time `created`', () => {
    expect([...second.keys()].sort()).toEqual([...first.keys()].sort());
    // The report shows the manifest's run time: compare it with that one value blanked out.
    const created = (files: Map<string, string>): string => (JSON.parse(files.get('manifest.json') as string) as { created: string }).created;
    const blank = (files: Map<string, string>, name: string, content: string): string => (name === 'report.html' ? content.split(created(files)).join('<created>') : content);
    for (const [name, content] of first) {
      if (name === 'manifest.json') continue;
      expect(blank(second, name, second.get(name) as string) === blank(first, name, content), name).toBe(true);
    }
    const strip = (s: string): unknown => ({ ...(JSON.parse(s) as object), created: undefined });
    expect(strip(second.get('manifest.json') as string)).toEqual(strip(first.get('manifest.json') as string));
  });
});
