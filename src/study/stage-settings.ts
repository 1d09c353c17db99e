import { checkTime } from './check-time.js';
import { keyHome } from './key-home.js';
import type { Study, StudyProblem } from './parse-study.js';

/** Validation settings of a study file (`ratings`). */
export interface RatingsSettings {
  path: string;
  columns?: Record<string, string>;
  format?: 'csv' | 'tsv' | 'jsonl' | 'json';
  delimiter?: string;
  /** Declared scale per rating column: `{ "mood": [0, 100] }`. */
  scales: Record<string, [number, number]>;
  /** Rating columns (default: every column but person, time, zone, id). */
  ratings?: string[];
  /** Missing-value codes of the rating columns, e.g. ["NA", "-99"]; default ["NA"] (DEFAULT_MISSING_CODES); [] leaves only empty cells missing. */
  missing?: string[];
  /** Score columns to validate (default: all). */
  scores?: string[];
  align: 'bins' | 'window';
  /** Window before each self-report for window alignment, e.g. "3h". */
  window: string;
  minWords: number;
  replicates: number;
  minPairs: number;
  reliability: number;
  /** Random slopes for the within-person score in the mixed model. */
  randomSlopes: 'auto' | 'always' | 'never';
  /** The self-reports' own time options, each overriding the study's `time` (as an input's `time`). */
  time?: Partial<Study['time']>;
}

/** Dynamics settings of a study file (`dynamics`). */
export interface DynamicsSettings {
  variables?: string[];
  pairs?: string[];
  minPairs: number;
  embedding?: number;
  maxEmbedding: number;
  tau: number;
  /** Default: max(E·tau, decorrelation time) per series. */
  exclusionRadius?: number;
  librarySizes: number;
  libraries: number;
  surrogates: number;
  /** Largest lag of the cross-map lag scan (0: none). */
  lagScan: number;
  /** Calendar cycle kept by seasonal surrogates. */
  season: 'auto' | 'day' | 'week' | 'none';
  stack: boolean;
  crossMapping: boolean;
  /** Also analyse the self-reports aggregated into the bins (when `ratings` is given). */
  includeRatings: boolean;
}

/** Term-audit settings of a study file (`audit`). */
export interface AuditSettings {
  maxShare: number;
  minPersons: number;
  top: number;
}

/** Report settings of a study file (`report`). */
export interface ReportSettings {
  score?: string;
  rating?: string;
  person?: string;
  title?: string;
}

type Check = (value: unknown) => boolean;
const isString: Check = (v) => typeof v === 'string' && v.trim() !== '';
const isStrings: Check = (v) => Array.isArray(v) && v.length > 0 && v.every(isString);
const wholeAtLeast = (min: number): Check => (v) => Number.isInteger(v) && (v as number) >= min;
const isBoolean: Check = (v) => typeof v === 'boolean';
const between01: Check = (v) => typeof v === 'number' && v > 0 && v < 1;

interface Rule {
  check: Check;
  expected: string;
}

/**
 * Checks each key of `value` by its rule. An unknown key is a problem naming its path and, with
 * `homes` (an object that has its own `time`), where the key belongs (see keyHome).
 */
function checkObject(value: Record<string, unknown>, rules: Record<string, Rule>, path: string, problems: StudyProblem[], homes = false): void {
  for (const [key, v] of Object.entries(value)) {
    const rule = rules[key];
    if (!rule) {
      const home = homes ? keyHome(key, path) : undefined;
      const what = path === '$.ratings' ? 'the ratings do not use' : 'unknown key';
      problems.push({ path: `${path}.${key}`, message: home ? `${what} \`${key}\`; ${home}` : `unknown key \`${key}\`; known keys are ${Object.keys(rules).join(', ')}` });
      continue;
    }
    if (!rule.check(v)) problems.push({ path: `${path}.${key}`, message: `expected ${rule.expected}` });
  }
}

const RATINGS_RULES: Record<string, Rule> = {
  path: { check: isString, expected: 'the path of the self-report file' },
  columns: { check: (v) => v !== null && typeof v === 'object' && !Array.isArray(v) && Object.values(v as object).every(isString), expected: 'an object such as {"person": "pid", "time": "answered_at"}' },
  format: { check: (v) => ['csv', 'tsv', 'jsonl', 'json'].includes(v as string), expected: 'one of csv, tsv, jsonl, json' },
  delimiter: { check: (v) => typeof v === 'string' && v.length === 1, expected: 'a single character' },
  scales: {
    check: (v) => v !== null && typeof v === 'object' && !Array.isArray(v) && Object.keys(v as object).length > 0 && Object.values(v as object).every((s) => Array.isArray(s) && s.length === 2 && s.every((x) => typeof x === 'number') && (s[0] as number) < (s[1] as number)),
    expected: 'the declared scale of each rating, e.g. {"mood": [0, 100], "calm": [1, 7]}',
  },
  ratings: { check: isStrings, expected: 'an array of rating column names' },
  missing: { check: (v) => Array.isArray(v) && v.every(isString), expected: 'an array of missing-value codes such as ["NA", "-99"] (default ["NA"]; [] leaves only empty cells missing)' },
  scores: { check: isStrings, expected: 'an array of score column names' },
  align: { check: (v) => v === 'bins' || v === 'window', expected: 'bins or window' },
  window: { check: (v) => typeof v === 'string' && /^\s*\d+\s*(m|min|h|d)\s*$/i.test(v), expected: 'a duration such as "3h" or "90m"' },
  minWords: { check: wholeAtLeast(0), expected: 'a whole number ≥ 0' },
  replicates: { check: wholeAtLeast(0), expected: 'a whole number ≥ 0 (bootstrap resamples; 0 skips)' },
  minPairs: { check: wholeAtLeast(2), expected: 'a whole number ≥ 2' },
  reliability: { check: between01, expected: 'a number between 0 and 1, e.g. 0.7' },
  randomSlopes: { check: (v) => v === 'auto' || v === 'always' || v === 'never', expected: 'auto, always or never' },
  time: { check: (v) => v !== null && typeof v === 'object' && !Array.isArray(v), expected: 'an object {"format": …, "epoch": …, "dstGap": …, "dstOverlap": …, "window": …} overriding the study\'s time for the self-reports' },
};

const DYNAMICS_RULES: Record<string, Rule> = {
  variables: { check: isStrings, expected: 'an array of score (or rating) column names' },
  pairs: { check: (v) => isStrings(v) && (v as string[]).every((p) => /^[^:]+:[^:]+$/.test(p)), expected: 'an array of "A:B" pairs, e.g. ["vader.compound:mood"]' },
  minPairs: { check: wholeAtLeast(1), expected: 'a whole number ≥ 1' },
  embedding: { check: wholeAtLeast(1), expected: 'a whole number ≥ 1' },
  maxEmbedding: { check: wholeAtLeast(1), expected: 'a whole number ≥ 1' },
  tau: { check: wholeAtLeast(1), expected: 'a whole number ≥ 1' },
  exclusionRadius: { check: wholeAtLeast(0), expected: 'a whole number ≥ 0' },
  librarySizes: { check: wholeAtLeast(2), expected: 'a whole number ≥ 2' },
  libraries: { check: wholeAtLeast(1), expected: 'a whole number ≥ 1' },
  surrogates: { check: wholeAtLeast(0), expected: 'a whole number ≥ 0' },
  lagScan: { check: wholeAtLeast(0), expected: 'a whole number ≥ 0' },
  season: { check: (v) => v === 'auto' || v === 'day' || v === 'week' || v === 'none', expected: 'one of "auto", "day", "week", "none"' },
  stack: { check: isBoolean, expected: 'true or false' },
  crossMapping: { check: isBoolean, expected: 'true or false' },
  includeRatings: { check: isBoolean, expected: 'true or false' },
};

const AUDIT_RULES: Record<string, Rule> = {
  maxShare: { check: between01, expected: 'a share between 0 and 1, e.g. 0.2' },
  minPersons: { check: wholeAtLeast(1), expected: 'a whole number ≥ 1' },
  top: { check: wholeAtLeast(1), expected: 'a whole number ≥ 1' },
};

const REPORT_RULES: Record<string, Rule> = {
  score: { check: isString, expected: 'a score column name' },
  rating: { check: isString, expected: 'a rating column name' },
  person: { check: isString, expected: 'a person id for the large view' },
  title: { check: isString, expected: 'a title' },
};

/** Checks and completes `ratings`; problems carry JSON paths under `$.ratings`. */
export function ratingsSettings(value: Record<string, unknown>, problems: StudyProblem[]): RatingsSettings {
  checkObject(value, RATINGS_RULES, '$.ratings', problems, true);
  const time = value.time !== null && typeof value.time === 'object' && !Array.isArray(value.time) ? (value.time as Record<string, unknown>) : undefined;
  if (time) checkTime(time, '$.ratings.time', problems);
  if (value.path === undefined) problems.push({ path: '$.ratings.path', message: 'expected the path of the self-report file' });
  if (value.scales === undefined) problems.push({ path: '$.ratings.scales', message: 'declare the scale of each rating, e.g. {"mood": [0, 100]}, so out-of-scale values can be rejected' });
  return {
    path: value.path as string,
    columns: value.columns as Record<string, string> | undefined,
    format: value.format as RatingsSettings['format'],
    delimiter: value.delimiter as string | undefined,
    scales: (value.scales ?? {}) as Record<string, [number, number]>,
    ratings: value.ratings as string[] | undefined,
    missing: value.missing as string[] | undefined,
    scores: value.scores as string[] | undefined,
    align: (value.align as 'bins' | 'window' | undefined) ?? 'bins',
    window: (value.window as string | undefined) ?? '3h',
    minWords: (value.minWords as number | undefined) ?? 1,
    replicates: (value.replicates as number | undefined) ?? 2000,
    minPairs: (value.minPairs as number | undefined) ?? 10,
    reliability: (value.reliability as number | undefined) ?? 0.7,
    randomSlopes: (value.randomSlopes as RatingsSettings['randomSlopes'] | undefined) ?? 'auto',
    ...(time ? { time: time as RatingsSettings['time'] } : {}),
  };
}

/** Checks and completes `dynamics`. */
export function dynamicsSettings(value: Record<string, unknown>, problems: StudyProblem[]): DynamicsSettings {
  checkObject(value, DYNAMICS_RULES, '$.dynamics', problems);
  return {
    variables: value.variables as string[] | undefined,
    pairs: value.pairs as string[] | undefined,
    minPairs: (value.minPairs as number | undefined) ?? 50,
    embedding: value.embedding as number | undefined,
    maxEmbedding: (value.maxEmbedding as number | undefined) ?? 8,
    tau: (value.tau as number | undefined) ?? 1,
    exclusionRadius: value.exclusionRadius as number | undefined,
    librarySizes: (value.librarySizes as number | undefined) ?? 10,
    libraries: (value.libraries as number | undefined) ?? 100,
    surrogates: (value.surrogates as number | undefined) ?? 99,
    lagScan: (value.lagScan as number | undefined) ?? 0,
    season: (value.season as DynamicsSettings['season'] | undefined) ?? 'auto',
    stack: value.stack === true,
    crossMapping: value.crossMapping !== false,
    includeRatings: value.includeRatings !== false,
  };
}

/** Checks and completes `audit`. */
export function auditSettings(value: Record<string, unknown>, problems: StudyProblem[]): AuditSettings {
  checkObject(value, AUDIT_RULES, '$.audit', problems);
  return { maxShare: (value.maxShare as number | undefined) ?? 0.2, minPersons: (value.minPersons as number | undefined) ?? 3, top: (value.top as number | undefined) ?? 10 };
}

/** Checks and completes `report`. */
export function reportSettings(value: Record<string, unknown>, problems: StudyProblem[]): ReportSettings {
  checkObject(value, REPORT_RULES, '$.report', problems);
  return { score: value.score as string | undefined, rating: value.rating as string | undefined, person: value.person as string | undefined, title: value.title as string | undefined };
}
