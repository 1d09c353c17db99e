import { inTimeWindow } from '../ingest/time-window.js';
import { readFile } from 'node:fs/promises';
import { basename, dirname } from 'node:path';
import { inputError, usageError } from '../errors.js';
import { readRecords } from '../ingest/read-records.js';
import { ownTableFile } from './own-table-file.js';
import { formatLocal } from '../ingest/parse-instant.js';
import { isValidZone, zoneOffset } from '../ingest/zone-offset.js';
import { csvRow, restoreCell } from '../report/csv.js';
import { tableResource, type TableResource } from '../report/data-dictionary.js';
import { formatNumber } from '../report/format-number.js';
import { seriesHeader, seriesRow, type SeriesLayout } from '../report/series-rows.js';
import type { BinReducer } from '../series/bin-accumulator.js';
import { addSeriesEntry } from '../series/add-series-entry.js';
import { buildPersonSeries } from '../series/build-person-series.js';
import { createSeriesState } from '../series/create-series-state.js';
import type { SeriesOptions } from '../series/series-types.js';
import { dateOfDayNumber } from '../series/local-day.js';
import type { Diagnostic } from '../types.js';
import { openAtomicLineWriter } from './atomic-write.js';
import { mergedDataPackage } from './merge-data-package.js';
import { fileDigest } from './run-score.js';
import { TOOL_VERSION } from '../version.js';
import { shardFilter, type ShardSpec } from '../shard/shard-of-person.js';
import { describeValue, ZONE_LIKE } from '../privacy/describe-value.js';
import { diagnosticText } from '../privacy/diagnostic-text.js';

/** Score column metadata from a scores sidecar (`scores.csv.meta.json`). */
export interface ScoreColumnMeta {
  name: string;
  aggregation: 'count' | 'rating' | 'sum' | 'vader';
}

export interface RunSeriesOptions extends Omit<SeriesOptions, 'reducers'> {
  /**
   * The scores file(s) written by `lexichron score`, each with its `.meta.json` sidecar beside it.
   * Several files must have the same lexicons and score columns; their persons are combined.
   */
  scores: string | readonly string[];
  /** The long series CSV; the wide and event files go beside it. */
  out: string;
  /** Reducer per score column name, overriding the defaults. */
  reducers?: Record<string, BinReducer>;
  /** One reducer for every column not named in `reducers`. */
  allReducer?: BinReducer;
  /** Only these score columns (default: all). */
  columns?: string[];
  /** Bin only this shard's persons (see shardOfPerson); other persons' rows are counted as `otherShard`. */
  shard?: ShardSpec;
  /** Most bins one person's series may have (default 100,000); more stops the run, naming the person and the entries at the ends. */
  maxBins?: number;
  /** A person whose entries span more days than this gets a warning (default 730). */
  warnSpanDays?: number;
  /** A datapackage.json to add the series tables to (mergeDataPackage), written with the other outputs. */
  dataPackage?: { path: string; name: string; title: string };
}

/** Default of RunSeriesOptions.maxBins: 100,000 bins is over 11 years of hourly bins (common practice, no source). */
export const DEFAULT_MAX_BINS = 100_000;
/** Default of RunSeriesOptions.warnSpanDays: two years. */
export const DEFAULT_WARN_SPAN_DAYS = 730;

export interface RunSeriesResult {
  longPath: string;
  widePath: string;
  eventsPath: string;
  rejectsPath: string;
  persons: number;
  bins: number;
  observed: number;
  missing: Record<string, number>;
  entries: number;
  excludedEntries: number;
  rejected: Record<string, number>;
  columns: Array<ScoreColumnMeta & { reducer: BinReducer }>;
  resources: TableResource[];
  /** Only with a shard: scores rows of persons of other shards. */
  otherShard?: number;
  /** Warnings for the user: persons whose entries span more than warnSpanDays (positions and counts only). */
  warnings: string[];
  /** Per scores file: rows read = entries binned + rows rejected (+ rows of other shards). */
  sources: SeriesSource[];
}

/** What the series stage did with one scores file (recorded in the series sidecar). */
export interface SeriesSource {
  path: string;
  sha256: string;
  bytes: number;
  /** Data rows read (excluding the header). */
  rows: number;
  /** Entries binned. */
  entries: number;
  /** Rows rejected, by reason. */
  rejected: Record<string, number>;
  /** Only with a shard: rows of persons of other shards. */
  otherShard?: number;
}

/** An entry at one end of a person's series: its id and the line of the scores file. */
interface EntryEnd {
  instant: number;
  id: string;
  line: number;
  file: string;
}

/** How an entry at an end is named in a message: its entry id and scores line (never text). */
function endName(end: EntryEnd): string {
  return `\`${end.id}\` (${formatUtcDate(end.instant)}, line ${end.line} of ${end.file})`;
}

function formatUtcDate(instant: number): string {
  return new Date(instant).toISOString().slice(0, 10);
}

/** Bins of a grid of `days` local days (an upper bound: a 25-hour day has one more sub-daily bin). */
function binsOfDays(days: number, bin: RunSeriesOptions['bin']): number {
  if (bin.minutes > 0) return days * Math.ceil(1500 / bin.minutes);
  if (bin.week) return Math.ceil((days + 6) / 7);
  return Math.ceil(days / Math.max(1, bin.days));
}

/** Default reducer: word-weighted mean for `count` and `rating` categories, entry mean for `sum` and VADER. */
export function defaultReducer(aggregation: ScoreColumnMeta['aggregation']): BinReducer {
  return aggregation === 'count' || aggregation === 'rating' ? 'weighted' : 'mean';
}

/** Paths of the files written beside the long series file. */
export function seriesSidecars(out: string): { wide: string; events: string; rejects: string } {
  const stem = out.replace(/\.csv$/i, '');
  return { wide: `${stem}.wide.csv`, events: `${stem}.events.csv`, rejects: `${stem}.rejects.csv` };
}

/** The parts of a scores sidecar (`<scores>.meta.json`, written by `lexichron score`) the series stage uses. */
interface ScoresSidecar {
  lexicons: unknown[];
  columns: ScoreColumnMeta[];
}

const AGGREGATIONS: ReadonlyArray<ScoreColumnMeta['aggregation']> = ['count', 'rating', 'sum', 'vader'];

/**
 * Reads the sidecar of a scores file. Without it the score columns' aggregations are unknown
 * (a VADER compound binned as a count changes its value), so a missing or unreadable sidecar is
 * refused, saying how to proceed.
 */
async function readScoresSidecar(scores: string): Promise<ScoresSidecar> {
  const file = basename(scores);
  let text: string;
  try {
    text = await readFile(`${scores}.meta.json`, 'utf8');
  } catch {
    throw usageError(
      `\`${file}\` has no sidecar \`${file}.meta.json\`, which says how each score column was scored (counts and ratings are binned word-weighted, sums and VADER by the entry mean). Keep the \`.meta.json\` written by \`lexichron score\` beside the scores file, or score the text again.`,
    );
  }
  const refuse = (): never => {
    throw usageError(`\`${file}.meta.json\` is not the sidecar written by \`lexichron score\` (it needs \`lexicons\` and \`columns\` with a name and an aggregation each); restore it from the score run, or score the text again.`);
  };
  let meta: { lexicons?: unknown; columns?: unknown };
  try {
    meta = JSON.parse(text) as typeof meta;
  } catch {
    return refuse();
  }
  if (!meta || !Array.isArray(meta.lexicons) || !Array.isArray(meta.columns)) return refuse();
  const columns = (meta.columns as Array<Partial<ScoreColumnMeta>>).map((c) => (c && typeof c.name === 'string' && AGGREGATIONS.includes(c.aggregation as ScoreColumnMeta['aggregation']) ? { name: c.name, aggregation: c.aggregation as ScoreColumnMeta['aggregation'] } : refuse()));
  return { lexicons: meta.lexicons as unknown[], columns };
}

/** What two scores sidecars disagree on (lexicons or score columns), or undefined when they agree. */
function sidecarDifference(a: ScoresSidecar, b: ScoresSidecar): string | undefined {
  const lexicon = (l: unknown): string => {
    const x = (l ?? {}) as { name?: unknown; version?: unknown; sha256?: unknown };
    return `${String(x.name)} ${String(x.version)} (${String(x.sha256).slice(0, 12)})`;
  };
  const la = a.lexicons.map(lexicon).join(', ');
  const lb = b.lexicons.map(lexicon).join(', ');
  if (la !== lb) return `the lexicons differ (${la || 'none'} against ${lb || 'none'})`;
  const ca = a.columns.map((c) => `${c.name} (${c.aggregation})`).join(', ');
  const cb = b.columns.map((c) => `${c.name} (${c.aggregation})`).join(', ');
  if (ca !== cb) return `the score columns differ (${ca} against ${cb})`;
  return undefined;
}

/**
 * Turns a scores file into regular per-person series: streams the entries into one accumulator
 * per (person, bin), then writes, atomically, the long series, a wide file (one row per person,
 * one column per score and bin index), the event-level file (one row per entry with its exact
 * time and bin) and a rejects file. Memory grows with bins, not entries.
 */
export async function runSeries(options: RunSeriesOptions): Promise<RunSeriesResult> {
  const paths = typeof options.scores === 'string' ? [options.scores] : [...options.scores];
  if (paths.length === 0) throw usageError('Name at least one scores file written by `lexichron score`.');
  const names = paths.map((p) => basename(p));
  const twice = paths.find((p, k) => paths.indexOf(p) !== k);
  if (twice !== undefined) throw usageError(`The scores file \`${basename(twice)}\` is named twice; name each scores file once.`);
  // Every sidecar is read, and compared with the first, before any output is opened.
  const scoresMetas: ScoresSidecar[] = [];
  for (let k = 0; k < paths.length; k++) {
    const sidecar = await readScoresSidecar(paths[k] as string);
    const difference = k > 0 ? sidecarDifference(scoresMetas[0] as ScoresSidecar, sidecar) : undefined;
    if (difference) {
      throw usageError(`Cannot bin \`${names[0]}\` and \`${names[k]}\` together: ${difference}, per their .meta.json sidecars. Score every file with the same lexicons to bin them into one series, or bin each file on its own.`);
    }
    scoresMetas.push(sidecar);
  }
  let metas: ScoreColumnMeta[] | undefined;
  let matchedLayout: boolean[] = [];
  const sidecars = seriesSidecars(options.out);
  const events = await openAtomicLineWriter(sidecars.events);
  const rejects = await openAtomicLineWriter(sidecars.rejects);
  const rejected: Record<string, number> = {};
  let entries = 0;
  let state: ReturnType<typeof createSeriesState> | undefined;
  const inShard = options.shard ? shardFilter(options.shard) : undefined;
  let otherShard = 0;
  const ends = new Map<string, { first: EntryEnd; last: EntryEnd }>();
  const sources: SeriesSource[] = [];
  try {
    await rejects.write(csvRow(['file', 'line', 'stage', 'code', 'message']));
    for (let k = 0; k < paths.length; k++) {
      const path = paths[k] as string;
      const file = names[k] as string;
      const source = { rows: 0, entries: 0, rejected: {} as Record<string, number>, otherShard: 0 };
      const reject = async (d: Diagnostic): Promise<void> => {
        rejected[d.code] = (rejected[d.code] ?? 0) + 1;
        source.rejected[d.code] = (source.rejected[d.code] ?? 0) + 1;
        await rejects.write(csvRow([d.source?.file ?? file, String(d.source?.line ?? ''), d.stage, d.code, diagnosticText(d.message)]));
      };
      let header: string[] | undefined;
      let idx: number[] = [];
      let nIdx: number[] = [];
      for await (const item of readRecords(await ownTableFile(path))) {
        if (item.kind === 'header') {
          header = item.columns;
          const missing = ['person', 'time_utc', 'zone', 'words'].filter((c) => !header?.includes(c));
          if (missing.length > 0) {
            throw usageError(`Cannot read \`${file}\` as scores: no column ${missing.map((m) => `\`${m}\``).join(', ')}. The series stage reads the output of \`lexichron score\`; score the text first.`);
          }
          if (!metas) {
            metas = (scoresMetas[k] as ScoresSidecar).columns.filter((c) => header?.includes(c.name));
            if (options.columns) {
              const known = metas;
              const unknown = options.columns.filter((c) => !known.some((m) => m.name === c));
              if (unknown.length > 0) throw usageError(`Unknown score column ${unknown.map((u) => `\`${u}\``).join(', ')}; the scores file has ${metas.map((m) => m.name).join(', ')}.`);
              metas = metas.filter((m) => options.columns?.includes(m.name));
            }
            if (metas.length === 0) throw usageError(`\`${file}\` has no score columns; score it with at least one lexicon.`);
            for (const name of Object.keys(options.reducers ?? {})) {
              if (!metas.some((m) => m.name === name)) throw usageError(`--aggregate names \`${name}\`, which is not a score column; choose from ${metas.map((m) => m.name).join(', ')}.`);
            }
            matchedLayout = metas.map((m) => header?.includes(`${m.name}.n`) ?? false);
            const chosen = metas;
            const reducers = chosen.map((m) => options.reducers?.[m.name] ?? options.allReducer ?? defaultReducer(m.aggregation));
            state = createSeriesState({ ...options, reducers }, chosen.length);
            await events.write(csvRow(['entry_id', 'person', 'time_utc', 'time_local', 'zone', 'bin_start', 'local_date', 'excluded', 'words', ...chosen.map((m) => m.name)]));
          } else {
            const absent = metas.filter((m) => !header?.includes(m.name)).map((m) => `\`${m.name}\``);
            if (absent.length > 0) throw usageError(`\`${file}\` has no column ${absent.join(', ')}, which \`${names[0]}\` has; bin scores files written with the same lexicons together, or bin each on its own.`);
          }
          idx = metas.map((m) => (header as string[]).indexOf(m.name));
          nIdx = metas.map((m) => (header as string[]).indexOf(`${m.name}.n`));
          continue;
        }
        source.rows++;
        if (item.kind === 'reject') {
          await reject({ ...item.diagnostic, stage: 'series' });
          continue;
        }
        const r = item.record;
        const instant = Date.parse(r.time_utc ?? '');
        const zone = r.zone ?? '';
        const words = Number(r.words);
        if (!isValidZone(zone)) {
          await reject({ code: 'unknown_zone', message: zone === '' ? 'the zone is empty; every scores row needs the person\'s IANA zone (score again with --zones or --time-zone)' : `unknown time zone ${describeValue(zone, ZONE_LIKE)}; expected an IANA name such as \`Europe/Brussels\` (fix the zone file and score again)`, source: item.source, stage: 'series' });
          continue;
        }
        if (!(r.person ?? '').trim() || !inTimeWindow(instant, undefined) || !Number.isInteger(words) || words < 0) {
          const what = !(r.person ?? '').trim() ? 'no person' : !inTimeWindow(instant, undefined) ? `time_utc (${describeValue(r.time_utc ?? '')}) is not an RFC 3339 instant with a year 0000–9999` : `words (${describeValue(r.words ?? '')}) is not a whole number ≥ 0`;
          await reject({ code: 'bad_score_row', message: `${what}; the series stage reads rows written by lexichron score`, source: item.source, stage: 'series' });
          continue;
        }
        if (inShard && !inShard(restoreCell((r.person as string).trim()))) {
          otherShard++;
          source.otherShard++;
          continue;
        }
        const values = idx.map((i) => {
          const text = r[(header as string[])[i] as string] ?? '';
          return text === '' ? undefined : Number(text);
        });
        const matched = nIdx.map((i) => (i >= 0 ? Number(r[(header as string[])[i] as string] ?? 0) || 0 : 0));
        entries++;
        source.entries++;
        const person = restoreCell((r.person as string).trim());
        const here: EntryEnd = { instant, id: restoreCell(r.entry_id ?? ''), line: item.source.line, file };
        const end = ends.get(person);
        if (!end) ends.set(person, { first: here, last: here });
        else if (instant < end.first.instant) end.first = here;
        else if (instant > end.last.instant) end.last = here;
        const placed = addSeriesEntry(state as NonNullable<typeof state>, { person, instant, zone, words, values, matched });
        await events.write(
          csvRow([
            restoreCell(r.entry_id ?? ''),
            person,
            r.time_utc as string,
            formatLocal(instant, zoneOffset(zone, instant)),
            zone,
            formatLocal(placed.binStart, zoneOffset(zone, placed.binStart)).replace('.000', ''),
            dateOfDayNumber(placed.day),
            placed.excluded ? '1' : '0',
            String(words),
            ...values.map((v) => formatNumber(v)),
          ]),
        );
      }
      if (!header) throw inputError(`\`${file}\` holds no rows, so there is nothing to bin; check that it is the scores file written by \`lexichron score\` and that scoring kept some entries (see its rejects file).`);
      const digest = await fileDigest(path);
      sources.push({ path: file, sha256: digest.sha256, bytes: digest.bytes, rows: source.rows, entries: source.entries, rejected: source.rejected, ...(options.shard ? { otherShard: source.otherShard } : {}) });
    }
    if (!state || !metas) throw inputError(`\`${names[0]}\` holds no rows, so there is nothing to bin; check that it is the scores file written by \`lexichron score\`.`);
    if (entries === 0) throw inputError(`${names.length === 1 ? `\`${names[0]}\` holds` : `${names.map((n) => `\`${n}\``).join(', ')} hold`} no scored entries; check the rejects of the score stage.`);
    const warnings = checkSeriesBounds(state, ends, options);
    const chosen = metas;
    const layout: SeriesLayout = { scores: chosen.map((m) => m.name), matched: matchedLayout, fill: options.fill !== 'none', detrend: options.detrend };
    const long = await openAtomicLineWriter(options.out);
    const wide = await openAtomicLineWriter(sidecars.wide);
    const staged: Array<Awaited<ReturnType<typeof openAtomicLineWriter>>> = [];
    const missing: Record<string, number> = {};
    let bins = 0;
    let observed = 0;
    const persons = [...state.persons.keys()].sort();
    try {
      const longHeader = seriesHeader(layout);
      await long.write(csvRow(longHeader));
      // One person's rows at a time: the long file is written as they are built, and only the
      // values are kept for the wide file (8 bytes per bin and score, NaN for missing), so memory
      // stays bounded by bins.
      let maxT = 0;
      const columns = layout.scores.length;
      const wideValues: Float64Array[] = [];
      for (const person of persons) {
        const rows = buildPersonSeries(state, person);
        maxT = Math.max(maxT, rows.length);
        const values = new Float64Array(rows.length * columns).fill(NaN);
        rows.forEach((row, t) => {
          for (let c = 0; c < columns; c++) values[c * rows.length + t] = row.values[c] ?? NaN;
        });
        wideValues.push(values);
        for (const row of rows) {
          bins++;
          if (row.missing === '') observed++;
          else missing[row.missing] = (missing[row.missing] ?? 0) + 1;
          await long.write(seriesRow(row, layout));
        }
      }
      const wideHeader = ['person', ...layout.scores.flatMap((s) => Array.from({ length: maxT }, (_, t) => `${s}@${t}`))];
      await wide.write(csvRow(wideHeader));
      for (let p = 0; p < persons.length; p++) {
        const values = wideValues[p] as Float64Array;
        const length = values.length / Math.max(1, columns);
        const fields = [persons[p] as string];
        for (let c = 0; c < columns; c++) {
          for (let t = 0; t < maxT; t++) {
            const x = t < length ? (values[c * length + t] as number) : NaN;
            fields.push(Number.isNaN(x) ? '' : formatNumber(x));
          }
        }
        await wide.write(csvRow(fields));
      }
      // A sidecar naming what made the series: the scores file (with its hash) and the lexicons
      // (name, version, content hash) recorded by the score stage.
      const metaText =
        JSON.stringify({
          tool: { name: 'lexichron', version: TOOL_VERSION },
          scores: sources.length === 1 ? { path: sources[0]?.path, sha256: sources[0]?.sha256, bytes: sources[0]?.bytes } : sources.map((x) => ({ path: x.path, sha256: x.sha256, bytes: x.bytes })),
          lexicons: (scoresMetas[0] as ScoresSidecar).lexicons,
          options: { bin: options.bin.text, dayStart: options.dayStart, minWords: options.minWords, excludeHours: options.excludeHours, fill: options.fill, maxFill: options.maxFill, detrend: options.detrend, span: options.span, windows: options.windows ? options.windows.size : 0 },
          columns: chosen.map((m) => ({ ...m, reducer: options.reducers?.[m.name] ?? options.allReducer ?? defaultReducer(m.aggregation) })),
          counts: { persons: persons.length, bins, observed, missing, entries, excludedEntries: state.excludedEntries, rejected, ...(options.shard ? { otherShard } : {}) },
          // Per scores file: rows read = entries binned + rows rejected (+ rows of other shards).
          sources: sources.map((x) => ({ path: x.path, rows: x.rows, entries: x.entries, rejected: x.rejected, ...(x.otherShard !== undefined ? { otherShard: x.otherShard } : {}) })),
          ...(options.shard ? { shard: options.shard } : {}),
        }, null, 2) + '\n';
      const describe = (name: string): string | undefined => {
        const base = name.replace(/@\d+$/, '');
        const m = chosen.find((x) => x.name === base);
        return m ? `${base}: ${options.reducers?.[m.name] ?? options.allReducer ?? defaultReducer(m.aggregation)} per bin of the ${m.aggregation} score${base !== name ? ` at t = ${name.split('@')[1]}` : ''}` : undefined;
      };
      const outDir = dirname(options.out);
      const rel = (p: string): string => (dirname(p) === outDir ? basename(p) : p);
      const resources = [
        tableResource('series-long', rel(options.out), longHeader, describe, 'One row per person and bin of the observation window; empty values are missing, with the reason in `missing`.'),
        tableResource('series-wide', rel(sidecars.wide), wideHeader, describe, 'One row per person; one column per score and within-person time index t.'),
        tableResource('series-events', rel(sidecars.events), ['entry_id', 'person', 'time_utc', 'time_local', 'zone', 'bin_start', 'local_date', 'excluded', 'words', ...layout.scores], describe, 'One row per entry with its exact time and the bin it fell in (for continuous-time models).'),
      ];
      // Every output is complete in a temporary file before the first is renamed into place: a
      // failure up to here leaves the previous outputs (if any) as they were.
      const packageText = options.dataPackage ? await mergedDataPackage(options.dataPackage.path, options.dataPackage.name, options.dataPackage.title, resources) : undefined;
      const meta = await openAtomicLineWriter(`${options.out}.meta.json`);
      staged.push(meta);
      await meta.write(metaText);
      let pkg: Awaited<ReturnType<typeof openAtomicLineWriter>> | undefined;
      if (options.dataPackage && packageText !== undefined) {
        pkg = await openAtomicLineWriter(options.dataPackage.path);
        staged.push(pkg);
        await pkg.write(packageText);
      }
      await long.commit();
      await wide.commit();
      await events.commit();
      await rejects.commit();
      await meta.commit();
      await pkg?.commit();
      return {
        longPath: options.out,
        widePath: sidecars.wide,
        eventsPath: sidecars.events,
        rejectsPath: sidecars.rejects,
        persons: persons.length,
        bins,
        observed,
        missing,
        entries,
        excludedEntries: state.excludedEntries,
        rejected,
        columns: chosen.map((m) => ({ ...m, reducer: options.reducers?.[m.name] ?? options.allReducer ?? defaultReducer(m.aggregation) })),
        resources,
        ...(options.shard ? { otherShard } : {}),
        warnings,
        sources,
      };
    } catch (error) {
      await long.abort();
      await wide.abort();
      for (const writer of staged) await writer.abort();
      throw error;
    }
  } catch (error) {
    await events.abort();
    await rejects.abort();
    throw error;
  }
}

/**
 * Checks each person's grid before any row is built: throws when a series would have more than
 * `maxBins` bins (a stray timestamp decades away makes hundreds of thousands), naming the person
 * and the entries at the ends of their series; returns a warning for each person whose entries
 * span more than `warnSpanDays` days.
 */
function checkSeriesBounds(state: ReturnType<typeof createSeriesState>, ends: ReadonlyMap<string, { first: EntryEnd; last: EntryEnd }>, options: RunSeriesOptions): string[] {
  const maxBins = options.maxBins ?? DEFAULT_MAX_BINS;
  const warnSpan = options.warnSpanDays ?? DEFAULT_WARN_SPAN_DAYS;
  const warnings: string[] = [];
  for (const [person, bins] of [...state.persons.entries()].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))) {
    const own = options.windows?.get(person);
    const from = Math.min(options.span?.from ?? own?.from ?? bins.firstDay, bins.firstDay);
    const to = Math.max(options.span?.to ?? own?.to ?? bins.lastDay, bins.lastDay);
    const days = to - from + 1;
    const end = ends.get(person);
    const at = end ? ` The entries at its ends are ${endName(end.first)} and ${endName(end.last)}.` : '';
    const needed = binsOfDays(days, options.bin);
    if (needed > maxBins) {
      throw inputError(`Cannot build the series of person \`${person}\`: its grid spans ${days} days, up to ${needed} bins of ${options.bin.text}, more than --max-bins ${maxBins}.${at} Check those times for a stray timestamp (or a wrong --epoch), leave the entry out, or raise --max-bins. No series file was written.`);
    }
    const span = bins.lastDay - bins.firstDay + 1;
    if (span > warnSpan) warnings.push(`person \`${person}\`: the entries span ${span} days, more than --warn-span-days ${warnSpan}.${at} Check them for a stray timestamp.`);
  }
  return warnings;
}
