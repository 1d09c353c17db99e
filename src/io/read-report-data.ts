import { readdir, readFile, stat } from 'node:fs/promises';
import { basename, join, relative, resolve } from 'node:path';
import { usageError } from '../errors.js';
import { buildReportData, type ReportInputs, type ReportOptions } from '../report/data/build-report-data.js';
import type { ReportData } from '../report/report-data.js';
import type { Reconciliation } from '../types.js';
import { TOOL_VERSION } from '../version.js';
import { ownTableFile } from './own-table-file.js';

/** Files of the folder (and its subfolders, two levels deep), as paths relative to it, sorted. */
async function listFiles(dir: string, depth = 2, prefix = ''): Promise<string[]> {
  const out: string[] = [];
  for (const d of (await readdir(join(dir, prefix), { withFileTypes: true })).sort((a, b) => (a.name < b.name ? -1 : 1))) {
    const rel = prefix ? `${prefix}/${d.name}` : d.name;
    if (d.isDirectory() && depth > 0) out.push(...(await listFiles(dir, depth - 1, rel)));
    else if (d.isFile()) out.push(rel);
  }
  return out;
}

/** Shallower paths first, then by name: the top-level file wins over one in a subfolder. */
const byDepth = (a: string, b: string): number => a.split('/').length - b.split('/').length || (a < b ? -1 : 1);

/** Finds the files of each stage in an output folder by name (see README.md, "The HTML report"). */
export function locateReportFiles(files: readonly string[]): {
  series?: string;
  manifest?: string;
  scoresMeta?: string;
  validationJson?: string;
  alignedCsv?: string;
  topTermsCsv?: string;
  termsJson?: string;
  /** Each lexicon's term-hits.csv (in a folder named after the lexicon). */
  termHits: string[];
  dynamics: string[];
} {
  const name = (f: string): string => f.split('/').pop() as string;
  const pick = (test: (f: string) => boolean): string | undefined => files.filter(test).sort(byDepth)[0];
  const inValidation = (f: string): boolean => /valid/i.test(f);
  return {
    series: pick((f) => name(f) === 'series-long.csv'),
    manifest: pick((f) => name(f) === 'manifest.json'),
    scoresMeta: pick((f) => name(f).endsWith('.csv.meta.json') && /score/i.test(name(f))),
    validationJson: pick((f) => inValidation(f) && f.endsWith('.json') && !/datapackage|meta\.json$/.test(f) && !/rejects|diagnostic/i.test(name(f))),
    alignedCsv: pick((f) => inValidation(f) && f.endsWith('.csv') && /pair|align/i.test(name(f))),
    topTermsCsv: pick((f) => name(f) === 'top-terms.csv'),
    termsJson: pick((f) => name(f) === 'term-audit.json') ?? pick((f) => /term|audit/i.test(f) && f.endsWith('.json') && !/meta\.json$|datapackage/.test(f)),
    termHits: files.filter((f) => name(f) === 'term-hits.csv' && f.includes('/')).sort(),
    dynamics: files.filter((f) => /dynamic/i.test(f) && f.endsWith('.csv') && !/rejects|diagnostic/i.test(name(f))).sort(),
  };
}

/** Text of one of lexichron's own CSV outputs, its header in lexichron's default names (see ownTableFile). */
async function readOwnTable(path: string): Promise<string> {
  return (await (await ownTableFile(path)).bytes()).toString('utf8');
}

async function readJson(path: string): Promise<{ value?: unknown; reason?: string }> {
  try {
    return { value: JSON.parse(await readFile(path, 'utf8')) };
  } catch (error) {
    return { reason: `\`${basename(path)}\` could not be read as JSON (${(error as Error).message}).` };
  }
}

/**
 * Reads whatever a study output folder holds (series-long.csv, manifest.json, the scores sidecar,
 * validation, term audit and dynamics outputs) and assembles the report's {@link ReportData}.
 * Missing files are not errors: their sections say what is absent. Throws a usage error only when
 * the folder itself does not exist. `source` is the folder name shown on the page (default: the folder's own name).
 */
export async function readReportData(outDir: string, options: ReportOptions = {}, source?: string): Promise<ReportData> {
  const dir = resolve(outDir);
  const info = await stat(dir).catch(() => undefined);
  if (!info?.isDirectory()) throw usageError(`Cannot read \`${outDir}\`: no such folder; give the output folder of \`lexichron run\` (the \`out\` of the study file).`);
  const found = locateReportFiles(await listFiles(dir));
  const at = (rel: string): string => join(dir, rel);
  const inputs: ReportInputs = { source: source ?? basename(dir), tool: { name: 'lexichron', version: TOOL_VERSION }, reasons: {} };
  const reasons = inputs.reasons as NonNullable<ReportInputs['reasons']>;
  if (found.series) inputs.seriesCsv = await readOwnTable(at(found.series));
  if (found.manifest) {
    const m = await readJson(at(found.manifest));
    if (m.value && typeof m.value === 'object') inputs.manifest = m.value as Record<string, unknown>;
    else reasons.manifest = m.reason ?? 'manifest.json is not a JSON object.';
  }
  if (found.scoresMeta) {
    const meta = await readJson(at(found.scoresMeta));
    const r = (meta.value as { reconciliation?: Reconciliation } | undefined)?.reconciliation;
    if (r) inputs.reconciliation = r;
    if (meta.value && typeof meta.value === 'object' && !Array.isArray(meta.value)) inputs.scoresMeta = meta.value as Record<string, unknown>;
  }
  if (found.validationJson) {
    const v = await readJson(at(found.validationJson));
    if (v.value !== undefined) inputs.validationJson = v.value;
    else if (v.reason) reasons.validation = v.reason;
  }
  if (found.alignedCsv) inputs.alignedCsv = await readOwnTable(at(found.alignedCsv));
  if (found.topTermsCsv) inputs.topTermsCsv = await readOwnTable(at(found.topTermsCsv));
  if (found.termsJson && !found.topTermsCsv) {
    const t = await readJson(at(found.termsJson));
    if (t.value !== undefined) inputs.termsJson = t.value;
    else if (t.reason) reasons.lexicons = t.reason;
  }
  if (found.termHits.length) inputs.termHitsFiles = await Promise.all(found.termHits.map(async (f) => ({ lexicon: f.split('/').slice(-2, -1)[0] as string, text: await readOwnTable(at(f)) })));
  if (found.dynamics.length) inputs.dynamicsFiles = await Promise.all(found.dynamics.map(async (f) => ({ name: relative(dir, at(f)), text: await readOwnTable(at(f)) })));
  return buildReportData(inputs, options);
}
