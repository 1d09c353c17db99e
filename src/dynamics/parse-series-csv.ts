import { inputError } from '../errors.js';
import Papa from 'papaparse';
import type { Diagnostic } from '../types.js';
import type { PersonSeriesInput } from './types.js';
import { restoreCell } from '../report/csv.js';
import { describeValue } from '../privacy/describe-value.js';

const FIXED = new Set(['person', 't', 'bin_start', 'bin_end', 'local_date', 'day', 'bin_of_day', 'bin_hours', 'hours_since_prev', 'entries', 'words', 'missing', 'lag_valid']);
const DERIVED = /\.(n|person_mean|within|lag1|within_lag1|filled|detrended)$/;
const REQUIRED = ['person', 't', 'lag_valid'];

/** Persons, score columns and row problems of a long series file. */
export interface ParsedSeriesCsv {
  persons: PersonSeriesInput[];
  /** Raw score columns in file order (derived `.n`, `.within`, `.lag1`… columns left out). */
  scores: string[];
  diagnostics: Diagnostic[];
}

/**
 * Reads the text of a `series-long.csv` (docs/architecture.md) into one {@link PersonSeriesInput}
 * per person, indexed by the bin index `t` (bins absent from the file become missing with an
 * invalid lag). Pure: the caller reads the file. Non-numeric score cells and
 * rows with a bad `t` become Diagnostics (stage `dynamics`) and are treated as missing; a file
 * without the `person`, `t` or `lag_valid` column is an input error.
 */
export function parseSeriesCsv(text: string, file = 'series-long.csv'): ParsedSeriesCsv {
  const [header, ...body] = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: true }).data;
  const table = header && header.length > 0 ? { header, rows: body } : undefined;
  if (!table) throw inputError(`Cannot read \`${file}\`: the file is empty; expected a long series file written by \`lexichron series\``);
  const index = new Map(table.header.map((h, i) => [h, i]));
  const lacking = REQUIRED.filter((c) => !index.has(c));
  if (lacking.length > 0) {
    throw inputError(`Cannot read \`${file}\`: no column ${lacking.map((c) => `\`${c}\``).join(', ')}; expected a long series file written by \`lexichron series\``);
  }
  const scores = table.header.filter((h) => !FIXED.has(h) && !DERIVED.test(h));
  const diagnostics: Diagnostic[] = [];
  const cell = (row: string[], name: string): string => {
    const i = index.get(name);
    return i === undefined ? '' : (row[i] ?? '');
  };
  interface Building {
    person: string;
    rows: Map<number, { values: (number | undefined)[]; lagValid: boolean; missing: string; binOfDay: number | undefined; binStart: string }>;
  }
  const byPerson = new Map<string, Building>();
  table.rows.forEach((row, r) => {
    const line = r + 2;
    const person = restoreCell(cell(row, 'person'));
    const t = Number(cell(row, 't'));
    if (!Number.isInteger(t) || t < 0) {
      diagnostics.push({ code: 'bad_bin_index', message: `\`t\` is ${describeValue(cell(row, 't'))}, not a whole number ≥ 0; row skipped`, source: { file, line }, stage: 'dynamics' });
      return;
    }
    const values = scores.map((s) => {
      const raw = cell(row, s);
      if (raw === '') return undefined;
      const v = Number(raw);
      if (!Number.isFinite(v)) {
        diagnostics.push({ code: 'bad_number', message: `\`${s}\` is ${describeValue(raw)}, not a number; treated as missing`, source: { file, line }, stage: 'dynamics' });
        return undefined;
      }
      return v;
    });
    const binOfDay = Number(cell(row, 'bin_of_day'));
    const building = byPerson.get(person) ?? { person, rows: new Map() };
    if (building.rows.has(t)) {
      diagnostics.push({ code: 'duplicate_bin', message: `person \`${person}\` has bin t = ${t} twice; the later row is kept`, source: { file, line }, stage: 'dynamics' });
    }
    building.rows.set(t, { values, lagValid: cell(row, 'lag_valid') === '1', missing: cell(row, 'missing'), binOfDay: Number.isInteger(binOfDay) && binOfDay > 0 ? binOfDay : undefined, binStart: cell(row, 'bin_start') });
    byPerson.set(person, building);
  });
  const persons: PersonSeriesInput[] = [...byPerson.values()].map(({ person, rows }) => {
    const length = Math.max(-1, ...rows.keys()) + 1;
    const values: Record<string, (number | undefined)[]> = Object.fromEntries(scores.map((s) => [s, new Array<number | undefined>(length).fill(undefined)]));
    const lagValid = new Array<boolean>(length).fill(false);
    const missing = new Array<string>(length).fill('absent');
    const binOfDay: number[] = new Array<number>(length).fill(0);
    const binStart: string[] = new Array<string>(length).fill('');
    let allBinOfDay = true;
    for (let t = 0; t < length; t++) {
      const row = rows.get(t);
      if (!row) {
        allBinOfDay = false;
        continue;
      }
      scores.forEach((s, c) => ((values[s] as (number | undefined)[])[t] = row.values[c]));
      lagValid[t] = row.lagValid && t > 0 && rows.has(t - 1);
      missing[t] = row.missing;
      binStart[t] = row.binStart;
      if (row.binOfDay === undefined) allBinOfDay = false;
      else binOfDay[t] = row.binOfDay;
    }
    return { person, t: Array.from({ length }, (_, t) => t), values, lagValid, missing, binStart, ...(allBinOfDay ? { binOfDay } : {}) };
  });
  return { persons, scores, diagnostics };
}
