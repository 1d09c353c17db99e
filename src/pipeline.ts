/**
 * `lexichron run STUDY.json`: the whole job in one command.
 *
 * ```
 * study.json ─ parseStudy ─► inputs ─ runScore ─► scores.csv ─ runSeries ─► series-long.csv (+ wide, events)
 *                                                                  │
 *                                  ratings ─► validate ◄──────────┤
 *                                                      dynamics ◄─┤
 *                                                      term audit ┘
 *                          datapackage.json + manifest.json + report.html
 * ```
 *
 * Every stage is a library function; this module only resolves paths against the study
 * file's folder, calls the stages in order and records provenance.
 */
import { basename, dirname, join, relative, resolve } from 'node:path';
import { usageError } from './errors.js';
import { writeFileAtomic } from './io/atomic-write.js';
import { checkOutputFolder } from './io/check-output-folder.js';
import { lockOutputFolder } from './io/lock-output-folder.js';
import { removeStaleTemporaries } from './io/own-temporaries.js';
import { openStagedOutput } from './io/staged-output.js';
import { unplacedTime } from './ingest/unplaced-time.js';
import { loadLexicons } from './io/load-lexicon.js';
import { readZoneFile } from './io/read-zone-file.js';
import { fileDigest, runScore, type RunScoreResult } from './io/run-score.js';
import { runSeries, type RunSeriesResult } from './io/run-series.js';
import { dataPackage, tableResource, type TableResource } from './report/data-dictionary.js';
import { buildManifest, type FileRecord, type Manifest } from './report/manifest.js';
import { parseReducers, seriesOptionsFrom } from './series/series-options.js';
import type { Study } from './study/parse-study.js';
import { readStudy } from './io/read-study.js';
import type { AuditSettings, RatingsSettings } from './study/stage-settings.js';
import { readRatings } from './io/run-validate.js';
import { promptWindows } from './series/prompt-windows.js';
import { applySyntacticNames } from './io/apply-syntactic-names.js';
import type { TimeOptions } from './ingest/parse-instant.js';
import { timeWindow } from './ingest/time-window.js';
import type { ZoneTable } from './ingest/zone-table.js';
import { readPseudonymKey, PSEUDONYM_KEY_ENV } from './io/read-pseudonym-key.js';
import { createPseudonymizer } from './privacy/create-pseudonymizer.js';
import { createRedactor } from './privacy/create-redactor.js';
import { termAuditor } from './terms/term-auditor.js';
import { random } from './stats/random.js';
import { dateOfDayNumber, localDayOf } from './series/local-day.js';
import { writeStudyAudit } from './io/write-study-audit.js';
import { writeReport, type WriteReportResult } from './io/write-report.js';
import { studyInput } from './io/study-input.js';
import { readRecords } from './ingest/read-records.js';
import { tableFile } from './io/table-file.js';
import { scoresHeader } from './report/score-rows.js';
import { isValidZone } from './ingest/zone-offset.js';
import { readWindowsFile } from './io/read-windows-file.js';
import { zoneOnDay } from './series/zone-on-day.js';
import { TOOL_VERSION } from './version.js';
import type { ShardSpec } from './shard/shard-of-person.js';
import type { TermAudit } from './terms/term-auditor.js';
import type { Diagnostic, RawEntry } from './types.js';

/** Reads and validates a study file (src/io/read-study.ts); exported here for its callers. */
export { readStudy };

/** What a stage after the series contributes to the outputs. */
export interface StageOutput {
  resources: TableResource[];
  outputs: FileRecord[];
  summary: Record<string, unknown>;
}

/** A stage run after score and series, given the study and the files written so far. */
export type StudyStage = (context: StudyContext) => Promise<StageOutput | undefined>;

export interface StudyContext {
  study: Study;
  studyDir: string;
  outDir: string;
  /** Resolves a path of the study file against its folder. */
  at: (path: string) => string;
  zones: ZoneTable;
  time: TimeOptions;
  /** The self-reports' time options (the study's `time` with `ratings.time` over it); default `time`. */
  ratingsTime?: TimeOptions;
  /** Maps raw person ids to the ids written in outputs (pseudonyms when a key is given). */
  person: (id: string) => string;
  /** Whether a key was given: files are then named by role in outputs, never by file name. */
  pseudonymized?: boolean;
  score: RunScoreResult;
  series: RunSeriesResult;
  /** Seed for every random draw of the run (bootstrap, surrogates). */
  seed: number;
  /** What one stage leaves for a later one (e.g. self-reports per bin for dynamics). */
  shared: Record<string, unknown>;
}

export interface RunStudyResult {
  outDir: string;
  manifest: Manifest;
  score: RunScoreResult;
  series: RunSeriesResult;
  stages: Record<string, StageOutput>;
  report?: WriteReportResult;
}

/** Seed of a run's random draws when none is given. */
export const DEFAULT_SEED = 20261201;

/** Columns of every rejects file (scores.rejects.csv, series-long.rejects.csv). */
const REJECTS_HEADER = ['file', 'line', 'stage', 'code', 'message'];

/** Data rows of a table input (records and rejected rows, streamed with the shared reader, so quoted line breaks are not counted as rows). */
async function dataRows(path: string): Promise<number> {
  let rows = 0;
  for await (const item of readRecords(tableFile(path))) if (item.kind !== 'header') rows++;
  return rows;
}

/**
 * The study as the manifest records it: person ids as written in the outputs (pseudonyms when a
 * key was given); participants' addresses and sender names only as counts; no key file, no
 * redaction names; and, with pseudonyms, inputs and side files named by position or role
 * (`input-1`, `zones`, `ratings`, `windows`) instead of file names that may hold an id.
 */
function recordedStudy(study: Study, person: (id: string) => string, pseudonymized: boolean): Record<string, unknown> {
  const inputs = study.inputs.map((input, n) => {
    const { addresses, senders, ...rest } = input;
    return {
      ...rest,
      ...(pseudonymized ? { path: `input-${n + 1}` } : {}),
      ...(input.person ? { person: person(input.person) } : {}),
      ...(addresses ? { addresses: addresses.length } : {}),
      ...(senders ? { senders: senders.length } : {}),
    };
  });
  const recorded: Record<string, unknown> = {
    ...study,
    inputs,
    privacy: study.privacy ? { ...study.privacy, keyFile: study.privacy.keyFile ? '(key file, not recorded)' : undefined, names: undefined } : undefined,
  };
  if (pseudonymized) {
    if (study.zones) recorded.zones = 'zones';
    if (study.ratings) recorded.ratings = { ...study.ratings, path: 'ratings' };
    if (study.series.windows) recorded.series = { ...study.series, windows: 'windows' };
  }
  return recorded;
}

/** Options of runStudy. */
export interface RunStudyOptions {
  now: string;
  stages?: Array<[string, StudyStage]>;
  seed?: number;
  onProgress?: (rows: number) => void;
  /** Environment variables the study may name (`privacy.keyEnv`), passed in by the caller. */
  env?: Readonly<Record<string, string | undefined>>;
  /** Accept an output folder that is a symbolic link (refused by default, see checkOutputFolder). */
  allowSymlinks?: boolean;
  /** Column names of the CSV outputs (overrides the study's `names`): as written, or syntactic for R and pandas. */
  names?: 'as-written' | 'syntactic';
  /** Write into this folder instead of the study's `out` (resolved against the working folder). */
  out?: string;
  /**
   * Run one shard of the study (`--shard I/N`): score and bin only this shard's persons, and
   * write a shard manifest (`shard.json`) instead of the stages, datapackage, manifest and report;
   * `lexichron merge` puts the shards together.
   */
  shard?: ShardSpec;
}

/**
 * Runs a study: score → series → the optional stages (validation, dynamics, term audit,
 * report) → datapackage.json and manifest.json, into the study's output folder.
 * `now` (ISO 8601) is the run time recorded in the manifest; `stages` are called in order.
 *
 * One run at a time, and never half-old outputs: the run holds the output folder's lock
 * (lockOutputFolder; a second run fails with a usage error), removes what killed runs left
 * there, and writes every output into a staging folder (openStagedOutput) that replaces the
 * old outputs only when every stage has finished. manifest.json and report.html are removed first
 * and put in place last, so they never describe files of another run. On any error the old outputs
 * stay as they were. An output folder that is a symbolic link is refused unless `allowSymlinks`.
 */
export async function runStudy(studyPath: string, options: RunStudyOptions): Promise<RunStudyResult> {
  const study = await readStudy(studyPath);
  const finalDir = options.out !== undefined ? resolve(options.out) : resolve(dirname(resolve(studyPath)), study.out);
  await checkOutputFolder(finalDir, options.allowSymlinks);
  const lock = await lockOutputFolder(finalDir, `lexichron run ${studyPath}`);
  try {
    await removeStaleTemporaries(finalDir, { recursive: true });
    const staged = await openStagedOutput(finalDir, ['report.html', 'manifest.json', SHARD_MANIFEST]);
    let result: RunStudyResult;
    try {
      result = await runStudyInto(staged.dir, study, studyPath, options);
      await staged.commit();
    } catch (error) {
      await staged.abort();
      throw error;
    }
    // Paths as they are after the commit.
    const moved = (path: string): string => join(finalDir, relative(staged.dir, path));
    const { score, series } = result;
    return {
      ...result,
      outDir: finalDir,
      score: { ...score, scoresPath: moved(score.scoresPath), rejectsPath: moved(score.rejectsPath), metaPath: moved(score.metaPath) },
      series: { ...series, longPath: moved(series.longPath), widePath: moved(series.widePath), eventsPath: moved(series.eventsPath), rejectsPath: moved(series.rejectsPath) },
      ...(result.report ? { report: { ...result.report, path: moved(result.report.path) } } : {}),
    };
  } finally {
    await lock.release();
  }
}

/**
 * The study's self-reports, read with the validation stage's settings and the ratings' own time
 * options (for the study window, first to last prompt, and to check their times before scoring);
 * person ids are mapped like the text's so both sides join.
 */
async function studyRatings(settings: RatingsSettings, at: (p: string) => string, zones: ZoneTable, time: TimeOptions, person: (id: string) => string): Promise<Awaited<ReturnType<typeof readRatings>>> {
  return readRatings({
    ratings: at(settings.path),
    columns: settings.columns ? { person: settings.columns.person ?? 'person', time: settings.columns.time ?? 'time', text: 'text', id: settings.columns.id, zone: settings.columns.zone } : undefined,
    format: settings.format,
    delimiter: settings.delimiter,
    zones,
    time,
    ratingColumns: settings.ratings,
    missing: settings.missing,
    scales: new Map(Object.entries(settings.scales).map(([k, [min, max]]) => [k, { min, max }])),
    person,
  });
}

/**
 * The error of a study that names no time zones when a row's time has no UTC offset (or is an
 * epoch number): such a time cannot be placed without its person's zone (RFC 3339 section 4.2).
 */
function noZonesError(studyPath: string, diagnostic: Diagnostic, what: string): Error {
  return usageError(`Study file \`${studyPath}\`: ${unplacedTime(diagnostic, what)}, and the study names no time zones; add "timeZone": "Europe/Brussels" (one IANA zone for everyone) or "zones": "zones.csv" (columns person, zone[, from]) to the study file, or write every time with its offset (2026-03-29T08:15:00+02:00).`);
}

/** A study file read and checked, with everything its stages need (lexicons, zones, key, series options). */
export interface PreparedStudy {
  study: Study;
  /** The study file's path as given on the command line (recorded in the manifest's command). */
  studyPath: string;
  studyDir: string;
  at: (path: string) => string;
  lexicons: Awaited<ReturnType<typeof loadLexicons>>;
  zones: ZoneTable;
  time: TimeOptions;
  /** Each input's time options: the study's `time` with the input's own `time` keys over it. */
  inputTimes: TimeOptions[];
  /** The self-reports' time options: the study's `time` with `ratings.time` over it. */
  ratingsTime: TimeOptions;
  key: Awaited<ReturnType<typeof readPseudonymKey>>;
  pseudonyms?: ReturnType<typeof createPseudonymizer>;
  person: (id: string) => string;
  redact: (text: string) => string;
  seriesOptions: ReturnType<typeof seriesOptionsFrom>;
  reducers: ReturnType<typeof parseReducers>;
  windows?: Awaited<ReturnType<typeof readWindowsFile>>;
}

/**
 * Reads what a study file names (lexicons, zones, the pseudonym key, windows) and checks its
 * series settings, before anything is scored; errors name the study file's keys. `now` (ISO 8601)
 * bounds the plausible time window; `studyFile` is where to read it, `studyPath` how the command
 * line named it.
 */
export async function prepareStudy(study: Study, studyPath: string, env: RunStudyOptions['env'], now: string, studyFile = studyPath): Promise<PreparedStudy> {
  const studyDir = dirname(resolve(studyFile));
  const at = (p: string): string => resolve(studyDir, p);
  const lexicons = await loadLexicons(study.lexicons.map((l) => (l.includes('/') || l.endsWith('.tsv') ? at(l) : l)));
  if (study.timeZone && !isValidZone(study.timeZone)) {
    throw usageError(`Study file \`${studyPath}\`, $.timeZone: unknown time zone \`${study.timeZone}\`; expected an IANA name such as \`Europe/Brussels\`.`);
  }
  const zones = await readZoneFile(study.zones ? at(study.zones) : undefined, study.timeZone);
  const window = timeWindow(Date.parse(now), study.time.window, `Study file \`${studyPath}\`, $.time.window`);
  const time: TimeOptions = { format: study.time.format, epoch: study.time.epoch, gap: study.time.dstGap, overlap: study.time.dstOverlap, window };
  // An input's (or the ratings') own `time` keys over the study's.
  const ownTime = (own: Partial<Study['time']> | undefined, where: string): TimeOptions => {
    if (!own) return time;
    return {
      format: own.format ?? time.format,
      epoch: own.epoch ?? time.epoch,
      gap: own.dstGap ?? time.gap,
      overlap: own.dstOverlap ?? time.overlap,
      window: own.window !== undefined ? timeWindow(Date.parse(now), own.window, `Study file \`${studyPath}\`, ${where}.time.window`) : window,
    };
  };
  const inputTimes = study.inputs.map((input, n): TimeOptions => ownTime(input.time, `$.inputs[${n}]`));
  const ratingsTime = ownTime(study.ratings?.time, '$.ratings');
  const privacy = study.privacy ?? {};
  const keyEnv = privacy.keyEnv ?? PSEUDONYM_KEY_ENV;
  const key = await readPseudonymKey(privacy.keyFile ? at(privacy.keyFile) : undefined, env?.[keyEnv]);
  if (privacy.keyEnv && !key) throw usageError(`The study names the key variable \`${privacy.keyEnv}\` ($.privacy.keyEnv), but it is not set; set it or remove the key from the study file.`);
  const pseudonyms = key ? createPseudonymizer(key) : undefined;
  const person = pseudonyms ? pseudonyms.person : (id: string): string => id;
  const redact = createRedactor({ names: privacy.names });
  // Series settings are checked before anything is scored, and their errors name the study file's keys.
  let seriesOptions: ReturnType<typeof seriesOptionsFrom>;
  let reducers: ReturnType<typeof parseReducers>;
  try {
    seriesOptions = seriesOptionsFrom({ ...study.series });
    reducers = parseReducers(study.series.aggregate);
  } catch (error) {
    throw usageError(`Study file \`${studyPath}\`, $.series: ${(error as Error).message.replace(/--([a-z-]+)/g, (_m, flag: string) => `"${flag.replace(/-([a-z])/g, (_x, c: string) => c.toUpperCase())}"`)}`);
  }
  // The self-reports are read here when they set the window, or when no zones are named (a time
  // without an offset then stops the run before anything is scored).
  const noZones = !study.zones && !study.timeZone;
  const ratings = study.ratings && ((!study.series.windows && study.series.window === 'ratings') || noZones) ? await studyRatings(study.ratings, at, zones, ratingsTime, person) : undefined;
  const unplaced = noZones ? ratings?.diagnostics.find((d) => d.code === 'no_zone') : undefined;
  if (unplaced) throw noZonesError(studyPath, unplaced, 'the self-report');
  const windows = study.series.windows ? await readWindowsFile(at(study.series.windows)) : study.series.window === 'ratings' && ratings ? promptWindows(ratings.ratings, seriesOptions.dayStart) : undefined;
  return { study, studyPath, studyDir, at, lexicons, zones, time, inputTimes, ratingsTime, key, ...(pseudonyms ? { pseudonyms } : {}), person, redact, seriesOptions, reducers, ...(windows ? { windows } : {}) };
}

/** The term auditors of a study (one per rules lexicon; none when `audit` is false), each with the run's seeded random source. */
export function studyAuditors(p: PreparedStudy, seed: number | undefined): Array<ReturnType<typeof termAuditor>> {
  const { study } = p;
  if (study.audit === false) return [];
  return p.lexicons.filter((l) => l.scoring === 'rules').map((l) => termAuditor(l, { random: random(seed ?? DEFAULT_SEED), redact: p.redact, maxShare: (study.audit as AuditSettings).maxShare, minPersons: (study.audit as AuditSettings).minPersons }));
}

/** What the term audit is given for one entry: its local day after `dayStart` is its bin. */
export function auditEntryFeeder(p: PreparedStudy, auditors: ReadonlyArray<ReturnType<typeof termAuditor>>): ((entry: RawEntry) => void) | undefined {
  if (auditors.length === 0) return undefined;
  const dayStart = p.seriesOptions.dayStart;
  return (entry) => {
    const bin = dateOfDayNumber(localDayOf(entry.instant, entry.zone, dayStart).day);
    for (const a of auditors) a.add({ id: entry.id, person: entry.person, text: entry.text, bin });
  };
}

/** The series of a study from the scores in `outDir`. */
export async function studySeries(p: PreparedStudy, outDir: string, scoresPath: string): Promise<RunSeriesResult> {
  const { reducers } = p;
  return runSeries({
    ...p.seriesOptions,
    ...(p.windows ? { windows: p.windows } : {}),
    zoneOn: zoneOnDay(p.zones),
    scores: scoresPath,
    out: join(outDir, 'series-long.csv'),
    reducers: typeof reducers === 'string' ? undefined : reducers,
    allReducer: typeof reducers === 'string' ? reducers : undefined,
  });
}

/** The inputs as the manifest records them: the scored inputs, then the zones, ratings and windows files (by role when pseudonymized). */
async function studyInputRecords(p: PreparedStudy, score: RunScoreResult): Promise<FileRecord[]> {
  const { study, at, pseudonyms } = p;
  const inputs: FileRecord[] = [...score.inputs];
  // With pseudonyms, files are recorded by their role, never by a name that may hold an id.
  const extras: Array<[string | undefined, string]> = [[study.zones, 'zones'], [study.ratings?.path, 'ratings'], [study.series.windows, 'windows']];
  for (const [extra, role] of extras) {
    if (!extra) continue;
    const d = await fileDigest(at(extra));
    inputs.push({ path: pseudonyms ? role : extra, sha256: d.sha256, bytes: d.bytes, rows: await dataRows(at(extra)) });
  }
  return inputs;
}

/** The manifest's `parameters`: the study as recorded, the seed and the privacy settings. */
function studyParameters(p: PreparedStudy, score: RunScoreResult, seed: number): Record<string, unknown> {
  const { study, person, pseudonyms, key } = p;
  const privacy = study.privacy ?? {};
  return {
    // Person ids in the recorded study are the ones written in the outputs (pseudonyms when a key was given).
    study: recordedStudy(study, person, pseudonyms !== undefined),
    seed,
    privacy: { pseudonymized: key !== undefined || score.pseudonymized, aggregatesOnly: privacy.aggregatesOnly === true, redactedNames: privacy.names?.length ?? 0 },
  };
}

/** The manifest's record of the series stage. */
function seriesSummary(series: RunSeriesResult): Record<string, unknown> {
  return { persons: series.persons, bins: series.bins, observed: series.observed, missing: series.missing, entries: series.entries, excludedEntries: series.excludedEntries, rejected: series.rejected, columns: series.columns };
}

/** The series result of a shard without persons: nothing binned, no files written. */
function noSeries(outDir: string): RunSeriesResult {
  const longPath = join(outDir, 'series-long.csv');
  const stem = join(outDir, 'series-long');
  return { longPath, widePath: `${stem}.wide.csv`, eventsPath: `${stem}.events.csv`, rejectsPath: `${stem}.rejects.csv`, persons: 0, bins: 0, observed: 0, missing: {}, entries: 0, excludedEntries: 0, rejected: {}, columns: [], resources: [], warnings: [], sources: [] };
}

/** File name of a shard's manifest. */
export const SHARD_MANIFEST = 'shard.json';

/**
 * Writes `shard.json`, the manifest of one shard: the manifest fields of a whole run (tool
 * version, inputs with their hashes, the study as recorded, seed, counts) plus
 * `parameters.shard` and `parameters.studyFile` (where the study file is and its hash), so that
 * `lexichron merge` can check that its shards belong to one run and find the study.
 */
async function writeShardManifest(outDir: string, fields: { prepared: PreparedStudy; shard: ShardSpec; seed: number; now: string; score: RunScoreResult; series: RunSeriesResult }): Promise<Manifest> {
  const { prepared: p, score, series } = fields;
  const studyFile = resolve(p.studyPath);
  const outputs: FileRecord[] = [];
  const seriesFiles = series.persons > 0 ? [series.longPath, `${series.longPath}.meta.json`, series.widePath, series.eventsPath, series.rejectsPath] : [];
  for (const path of [score.scoresPath, `${score.scoresPath}.seq`, score.rejectsPath, score.metaPath, ...seriesFiles]) {
    const d = await fileDigest(path);
    outputs.push({ path: path.slice(outDir.length + 1), sha256: d.sha256, bytes: d.bytes });
  }
  const manifest = buildManifest({
    version: TOOL_VERSION,
    created: fields.now,
    command: `lexichron run ${p.studyPath} --shard ${fields.shard.index}/${fields.shard.count}`,
    inputs: await studyInputRecords(p, score),
    lexicons: score.lexicons,
    parameters: { ...studyParameters(p, score, fields.seed), shard: fields.shard, studyFile: { path: studyFile, studyPath: p.studyPath, sha256: (await fileDigest(studyFile)).sha256 } },
    reconciliation: score.reconciliation,
    stages: { series: seriesSummary(series) },
    outputs,
  });
  await writeFileAtomic(join(outDir, SHARD_MANIFEST), JSON.stringify(manifest, null, 2) + '\n');
  return manifest;
}

/** The stages of runStudy, writing every output into `outDir` (the staging folder). */
async function runStudyInto(outDir: string, study: Study, studyPath: string, options: RunStudyOptions): Promise<RunStudyResult> {
  const p = await prepareStudy(study, studyPath, options.env, options.now);
  // A shard runs no term audit: `lexichron merge` audits the whole study (see merge-shards.ts).
  const auditors = options.shard ? [] : studyAuditors(p, options.seed);
  const score = await runScore({
    inputs: study.inputs.map((i, n) => studyInput(i, p.at(i.path), p.zones, p.inputTimes[n] ?? p.time, `$.inputs[${n}]`)),
    lexicons: p.lexicons,
    zones: p.zones,
    time: p.time,
    out: join(outDir, 'scores.csv'),
    countRate: study.countRate,
    keepText: study.keepText,
    redact: p.redact,
    ...(p.pseudonyms ? { pseudonyms: p.pseudonyms } : {}),
    ...(options.shard ? { shard: options.shard } : {}),
    onProgress: options.onProgress,
    onRawEntry: auditEntryFeeder(p, auditors),
    ...(!study.zones && !study.timeZone ? { onReject: (d: Diagnostic) => { if (d.code === 'no_zone') throw noZonesError(studyPath, d, 'the entry'); } } : {}),
  });
  if (options.shard) {
    // A shard may hold no person at all (more shards than persons): it then writes no series.
    const series = score.reconciliation.scored > 0 ? await studySeries(p, outDir, score.scoresPath) : noSeries(outDir);
    const manifest = await writeShardManifest(outDir, { prepared: p, shard: options.shard, seed: options.seed ?? DEFAULT_SEED, now: options.now, score, series });
    return { outDir, manifest, score, series, stages: {} };
  }
  return finishStudy(outDir, p, score, auditors.map((a) => a.finish()), options);
}

/**
 * Everything of a study run after scoring: the series, the term audit (given finished), the
 * stages, datapackage.json, manifest.json and report.html, into `outDir`. Used by runStudy and,
 * on merged shard outputs, by `lexichron merge`, so both write the same files.
 */
export async function finishStudy(outDir: string, p: PreparedStudy, score: RunScoreResult, audits: TermAudit[], options: RunStudyOptions): Promise<RunStudyResult> {
  const { study, studyPath, studyDir, at, lexicons, zones, time, ratingsTime, person, pseudonyms } = p;
  const series = await studySeries(p, outDir, score.scoresPath);
  const seed = options.seed ?? DEFAULT_SEED;
  const stages: Record<string, StageOutput> = {};
  if (audits.length > 0) stages.audit = await writeStudyAudit(outDir, audits, (study.audit as AuditSettings).top, study.keepText);
  const context: StudyContext = { study, studyDir, outDir, at, zones, time, ratingsTime, person, pseudonymized: pseudonyms !== undefined, score, series, seed, shared: {} };
  for (const [name, stage] of options.stages ?? []) {
    const out = await stage(context);
    if (out) stages[name] = out;
  }
  // The header the score stage wrote (rebuilt, not read back: the scores file may be large).
  const scoreHeader = scoresHeader(score.columns, lexicons, study.keepText);
  const resources: TableResource[] = [
    tableResource('scores', 'scores.csv', scoreHeader, undefined, 'One row per scored entry; score columns are <lexicon>.<category>, with the unit at the end for count categories (<lexicon>.<category>_per100w).'),
    ...series.resources,
    tableResource('scores-rejects', 'scores.rejects.csv', REJECTS_HEADER, undefined, 'One row per input row the score stage could not use, with its file, line and reason (counted in the manifest reconciliation).'),
    tableResource('series-rejects', relative(outDir, series.rejectsPath), REJECTS_HEADER, undefined, 'One row per scores row the series stage could not use, with its line and reason.'),
    ...Object.values(stages).flatMap((s) => s.resources),
  ];
  await writeFileAtomic(join(outDir, 'datapackage.json'), JSON.stringify(dataPackage(study.name, study.name, resources), null, 2) + '\n');
  const outputs: FileRecord[] = [];
  for (const path of [score.scoresPath, score.rejectsPath, score.metaPath, series.longPath, `${series.longPath}.meta.json`, series.widePath, series.eventsPath, series.rejectsPath, join(outDir, 'datapackage.json')]) {
    const d = await fileDigest(path);
    outputs.push({ path: path.slice(outDir.length + 1), sha256: d.sha256, bytes: d.bytes });
  }
  outputs.push(...Object.values(stages).flatMap((s) => s.outputs));
  const inputs = await studyInputRecords(p, score);
  const manifest = buildManifest({
    version: TOOL_VERSION,
    created: options.now,
    command: `lexichron run ${studyPath}`,
    inputs,
    lexicons: score.lexicons,
    parameters: studyParameters(p, score, seed),
    reconciliation: score.reconciliation,
    stages: {
      series: seriesSummary(series),
      ...Object.fromEntries(Object.entries(stages).map(([k, v]) => [k, v.summary])),
    },
    outputs,
  });
  if (study.report !== false) {
    manifest.outputs.push({ path: 'report.html' });
    manifest.stages.report = { note: 'report.html is written after this manifest and shows it; its hash is not recorded here' };
  }
  await writeFileAtomic(join(outDir, 'manifest.json'), JSON.stringify(manifest, null, 2) + '\n');
  let report: WriteReportResult | undefined;
  if (study.report !== false) report = await writeReport(outDir, { ...study.report, ...(study.report.title ? {} : { title: study.name }), source: basename(at(study.out)) });
  if ((options.names ?? study.names) === 'syntactic') {
    // Last, after the report has read the outputs: renamed files get fresh digests in the manifest.
    const changed = new Set(await applySyntacticNames(outDir));
    for (const record of manifest.outputs) {
      if (!changed.has(record.path) || record.sha256 === undefined) continue;
      const d = await fileDigest(join(outDir, record.path));
      record.sha256 = d.sha256;
      record.bytes = d.bytes;
    }
    (manifest.parameters as Record<string, unknown>).names = 'syntactic';
    await writeFileAtomic(join(outDir, 'manifest.json'), JSON.stringify(manifest, null, 2) + '\n');
  }
  return { outDir, manifest, score, series, stages, report };
}
