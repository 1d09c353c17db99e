import type { EpochUnit } from '../ingest/parse-instant.js';
import { checkTime } from './check-time.js';
import { INPUT_KEYS, PRIVACY_KEYS, SERIES_KEYS, STUDY_IMPORT_FORMATS, TOP_KEYS } from './study-keys.js';
import { unknownKeys } from './unknown-keys.js';
import type { ImportSourceSpec } from '../io/open-import-source.js';
import { auditSettings, dynamicsSettings, ratingsSettings, reportSettings, type AuditSettings, type DynamicsSettings, type RatingsSettings, type ReportSettings } from './stage-settings.js';

/**
 * The study file of `lexichron run`: one JSON document naming inputs, zones, lexicons and the
 * settings of every stage. This module validates it and reports each problem with its JSON path.
 */

export { STUDY_IMPORT_FORMATS };

/** The importer options a donated-export input may carry, as on the command line (camel case). */
type ImportFields = Partial<Pick<ImportSourceSpec, 'addresses' | 'senders' | 'dateOrder' | 'heading' | 'dateFormat' | 'locale' | 'entryTime' | 'entryTimeFormat' | 'senderField' | 'timeField' | 'textField' | 'timeFormat'>>;

export interface StudyInput extends ImportFields {
  path: string;
  format?: 'csv' | 'tsv' | 'jsonl' | 'json' | (typeof STUDY_IMPORT_FORMATS)[number];
  columns?: Record<string, string>;
  delimiter?: string;
  /** Donated exports: the participant the file belongs to. */
  person?: string;
  /** Drop exact and near-duplicate entries. */
  dedupe?: boolean;
  /** Merge messages within this many minutes into one entry. */
  mergeBurstMinutes?: number;
  /** This input's own time options, each overriding the study's `time`. */
  time?: Partial<Study['time']>;
}

export interface StudySeries {
  bin: string;
  dayStart: string;
  minWords: number;
  excludeHours?: string;
  fill: 'none' | 'carry' | 'linear';
  maxFill: number;
  detrend: boolean;
  aggregate?: string;
  from?: string;
  to?: string;
  /** Per-person study windows file (person, from, to). */
  windows?: string;
  /**
   * Where each person's series runs when no dates or windows file are given: `ratings` (first to
   * last self-report prompt of the person; the default when the study has ratings) or `entries`
   * (first to last entry).
   */
  window: 'ratings' | 'entries' | 'dates';
  /** Most bins per person (default 100,000) and the span in days beyond which a person is warned about (default 730). */
  maxBins?: number;
  warnSpanDays?: number;
}

export interface Study {
  name: string;
  inputs: StudyInput[];
  zones?: string;
  timeZone?: string;
  time: { format?: string; epoch: EpochUnit; window?: string; dstGap: 'reject' | 'earlier' | 'later'; dstOverlap: 'reject' | 'earlier' | 'later' };
  lexicons: string[];
  keepText: boolean;
  /** Unit of `count` categories (and the end of their column names). */
  countRate: 'per100w' | 'per1000w' | 'prop';
  /** Column names of the CSV outputs: as written, or syntactic for R and pandas (`afinn_165_valence`). */
  names: 'as-written' | 'syntactic';
  maxRejects: string;
  series: StudySeries;
  /** Self-reports and validation settings (see README.md, "Validating text scores"); absent: no validation. */
  ratings?: RatingsSettings;
  /** Dynamics settings (see README.md, "Dynamics"); `false` skips the stage. */
  dynamics: DynamicsSettings | false;
  /** Term-audit settings; `false` skips it. */
  audit: AuditSettings | false;
  /** Report settings; `false` skips the report. */
  report: ReportSettings | false;
  /** Privacy settings: pseudonymization key file or environment variable, redaction names. */
  privacy?: { keyFile?: string; keyEnv?: string; names?: string[]; aggregatesOnly?: boolean };
  out: string;
}

export interface StudyProblem {
  path: string;
  message: string;
}

/** An input's key its kind does not use: named with its JSON path and the keys that kind accepts. */
function kindKeys(value: Record<string, unknown>, kind: string, path: string, problems: StudyProblem[]): void {
  const known = INPUT_KEYS[(STUDY_IMPORT_FORMATS as readonly string[]).includes(kind) ? kind : 'table'] ?? (INPUT_KEYS.table as readonly string[]);
  for (const key of Object.keys(value)) {
    if (known.includes(key)) continue;
    const user = Object.entries(INPUT_KEYS).filter(([, keys]) => keys.includes(key)).map(([k]) => (k === 'table' ? 'table' : k));
    const where = user.length > 0 ? `; it belongs to ${user.join(', ')} inputs` : '';
    problems.push({ path: `${path}.${key}`, message: `a ${kind} input does not use \`${key}\`${where}; its keys are ${known.join(', ')}` });
  }
}

function isObject(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === 'object' && !Array.isArray(value);
}

/**
 * Validates a parsed study file. Returns the study with defaults filled in, or the problems,
 * each with its JSON path (`$.series.bin`) and what is expected there.
 */
export function parseStudy(json: unknown): { study?: Study; problems: StudyProblem[] } {
  const problems: StudyProblem[] = [];
  const need = (ok: boolean, path: string, message: string): void => {
    if (!ok) problems.push({ path, message });
  };
  if (!isObject(json)) return { problems: [{ path: '$', message: 'the study file must hold one JSON object, e.g. {"inputs": [...], "out": "out"}' }] };
  unknownKeys(json, TOP_KEYS, '$', problems);
  const str = (v: unknown): v is string => typeof v === 'string' && v.trim() !== '';
  need(json.name === undefined || typeof json.name === 'string', '$.name', 'expected a string');
  const inputs: StudyInput[] = [];
  if (!Array.isArray(json.inputs) || json.inputs.length === 0) {
    problems.push({ path: '$.inputs', message: 'expected a non-empty array of inputs such as [{"path": "messages.csv"}]' });
  } else {
    json.inputs.forEach((input, i) => {
      const p = `$.inputs[${i}]`;
      if (typeof input === 'string') {
        inputs.push({ path: input });
        return;
      }
      if (!isObject(input)) {
        problems.push({ path: p, message: 'expected a path string or an object {"path": …, "columns": {…}}' });
        return;
      }
      kindKeys(input, typeof input.format === 'string' ? input.format : 'csv', p, problems);
      if (input.time !== undefined) {
        if (isObject(input.time)) {
          checkTime(input.time, `${p}.time`, problems);
          const own = ['mbox', 'diary', 'chat-lines'].includes(input.format as string);
          for (const key of ['format', 'epoch']) need(!(own && input.time[key] !== undefined), `${p}.time.${key}`, `a ${String(input.format)} export writes its times its own way and does not use \`time.${key}\`; its time keys are window, dstGap, dstOverlap`);
        }
        else problems.push({ path: `${p}.time`, message: 'expected an object {"format": …, "epoch": …, "dstGap": …, "dstOverlap": …, "window": …} overriding the study\'s time for this input' });
      }
      need(str(input.path), `${p}.path`, 'expected the path of a CSV, TSV, JSON Lines or JSON file');
      const formats = ['csv', 'tsv', 'jsonl', 'json', ...STUDY_IMPORT_FORMATS];
      need(input.format === undefined || formats.includes(input.format as string), `${p}.format`, `expected one of ${formats.join(', ')}`);
      const imported = (STUDY_IMPORT_FORMATS as readonly string[]).includes(input.format as string);
      if (imported) {
        need(str(input.person), `${p}.person`, `a ${String(input.format)} export belongs to one participant: name them with "person"`);
        if (input.format === 'mbox') need(Array.isArray(input.addresses) && input.addresses.length > 0 && input.addresses.every(str), `${p}.addresses`, 'expected the participant\'s e-mail addresses, e.g. ["ana@example.org"]');
        if (input.format === 'chat-lines' || input.format === 'chat-table') need(Array.isArray(input.senders) && input.senders.length > 0 && input.senders.every(str), `${p}.senders`, 'expected the participant\'s sender names as they appear in the export, e.g. ["Ana"]');
      }
      for (const key of ['person', 'heading', 'dateFormat', 'locale', 'entryTime', 'entryTimeFormat', 'senderField', 'timeField', 'textField', 'timeFormat']) need(input[key] === undefined || str(input[key]), `${p}.${key}`, 'expected a string');
      need(input.dateOrder === undefined || input.dateOrder === 'dmy' || input.dateOrder === 'mdy', `${p}.dateOrder`, 'expected dmy or mdy');
      need(input.dedupe === undefined || typeof input.dedupe === 'boolean', `${p}.dedupe`, 'expected true or false');
      need(input.mergeBurstMinutes === undefined || (typeof input.mergeBurstMinutes === 'number' && input.mergeBurstMinutes > 0), `${p}.mergeBurstMinutes`, 'expected a number of minutes > 0');
      if (input.columns !== undefined) {
        if (!isObject(input.columns)) problems.push({ path: `${p}.columns`, message: 'expected an object such as {"person": "participant", "time": "sent_at", "text": "body"}' });
        else {
          unknownKeys(input.columns, ['person', 'time', 'text', 'id', 'zone'], `${p}.columns`, problems);
          for (const [k, v] of Object.entries(input.columns)) need(str(v), `${p}.columns.${k}`, 'expected a column name');
        }
      }
      need(input.delimiter === undefined || (typeof input.delimiter === 'string' && input.delimiter.length === 1), `${p}.delimiter`, 'expected a single character');
      inputs.push(input as unknown as StudyInput);
    });
  }
  need(json.zones === undefined || str(json.zones), '$.zones', 'expected the path of a zone file (person, zone[, from])');
  need(json.timeZone === undefined || str(json.timeZone), '$.timeZone', 'expected an IANA zone name such as Europe/Brussels');
  // No zones at all is allowed: a study whose every time carries its UTC offset needs none (a time
  // without one then stops the run with a message naming "zones" and "timeZone", see runStudy).
  const time = isObject(json.time) ? json.time : {};
  if (json.time !== undefined && !isObject(json.time)) problems.push({ path: '$.time', message: 'expected an object {"format": …, "epoch": …, "dstGap": …, "dstOverlap": …}' });
  checkTime(time, '$.time', problems);
  const lexicons = json.lexicons ?? ['afinn-165', 'vader'];
  need(Array.isArray(lexicons) && lexicons.length > 0 && lexicons.every(str), '$.lexicons', 'expected a non-empty array of bundled lexicon names or .lex.tsv paths');
  need(json.keepText === undefined || typeof json.keepText === 'boolean', '$.keepText', 'expected true or false');
  need(json.names === undefined || json.names === 'as-written' || json.names === 'syntactic', '$.names', 'expected "as-written" (the default) or "syntactic" (column names R and pandas accept unquoted)');
  need(json.countRate === undefined || ['per100w', 'per1000w', 'prop'].includes(json.countRate as string), '$.countRate', 'expected per100w, per1000w or prop (the unit of count categories)');
  need(json.maxRejects === undefined || (typeof json.maxRejects === 'string' && /^(\d+%?|\d+\.\d+%|none)$/.test(json.maxRejects)) || Number.isInteger(json.maxRejects), '$.maxRejects', 'expected a count (25), a percentage ("5%") or "none"');
  const series = isObject(json.series) ? json.series : {};
  if (json.series !== undefined && !isObject(json.series)) problems.push({ path: '$.series', message: 'expected an object such as {"bin": "1d", "dayStart": "04:00", "minWords": 10}' });
  unknownKeys(series, SERIES_KEYS, '$.series', problems);
  for (const key of ['bin', 'dayStart', 'excludeHours', 'aggregate', 'from', 'to', 'windows']) need(series[key] === undefined || typeof series[key] === 'string', `$.series.${key}`, 'expected a string');
  for (const key of ['maxBins', 'warnSpanDays']) need(series[key] === undefined || (Number.isInteger(series[key]) && (series[key] as number) >= 1), `$.series.${key}`, 'expected a whole number ≥ 1');
  for (const key of ['minWords', 'maxFill']) need(series[key] === undefined || (Number.isInteger(series[key]) && (series[key] as number) >= 0), `$.series.${key}`, 'expected a whole number ≥ 0');
  need(series.fill === undefined || ['none', 'carry', 'linear'].includes(series.fill as string), '$.series.fill', 'expected none, carry or linear');
  need(series.detrend === undefined || typeof series.detrend === 'boolean', '$.series.detrend', 'expected true or false');
  const windowDates = isObject(series.window) ? series.window : undefined;
  need(series.window === undefined || series.window === 'ratings' || series.window === 'entries' || (windowDates !== undefined && typeof windowDates.from === 'string' && typeof windowDates.to === 'string' && Object.keys(windowDates).length === 2), '$.series.window', 'expected {"from": "YYYY-MM-DD", "to": "YYYY-MM-DD"} (the study window in local dates), "ratings" (first to last prompt of each person) or "entries" (first to last entry)');
  need(!(windowDates && (series.from !== undefined || series.to !== undefined)), '$.series.window', 'give the study window once: either window {"from", "to"} or from and to, not both');
  need(!(series.window === 'ratings' && !isObject(json.ratings)), '$.series.window', '"ratings" takes the window from the self-reports, but the study has no ratings; give dates {"from", "to"} or "entries"');
  need(json.ratings === undefined || isObject(json.ratings), '$.ratings', 'expected an object such as {"path": "ratings.csv", "scales": {"mood": [0, 100]}}');
  for (const key of ['dynamics', 'audit', 'report']) need(json[key] === undefined || json[key] === false || json[key] === true || isObject(json[key]), `$.${key}`, 'expected an object of settings, true for the default settings, or false to skip the stage');
  const ratings = isObject(json.ratings) ? ratingsSettings(json.ratings, problems) : undefined;
  const stage = <T>(value: unknown, settings: (v: Record<string, unknown>, p: StudyProblem[]) => T): T | false => (value === false ? false : settings(isObject(value) ? value : {}, problems));
  const dynamics = stage(json.dynamics, dynamicsSettings);
  const audit = stage(json.audit, auditSettings);
  const report = stage(json.report, reportSettings);
  if (json.privacy !== undefined) {
    if (!isObject(json.privacy)) problems.push({ path: '$.privacy', message: 'expected an object {"keyFile": …} or {"keyEnv": …}' });
    else {
      unknownKeys(json.privacy, PRIVACY_KEYS, '$.privacy', problems);
      need(json.privacy.names === undefined || (Array.isArray(json.privacy.names) && json.privacy.names.every(str)), '$.privacy.names', 'expected an array of names to redact');
      need(json.privacy.aggregatesOnly === undefined || typeof json.privacy.aggregatesOnly === 'boolean', '$.privacy.aggregatesOnly', 'expected true or false');
      need(!(json.privacy.aggregatesOnly === true && json.keepText === true), '$.privacy.aggregatesOnly', 'aggregatesOnly forbids keepText: drop one of them');
    }
  }
  need(str(json.out), '$.out', 'expected the output folder, e.g. "out"');
  if (problems.length > 0) return { problems };
  return {
    problems,
    study: {
      name: (json.name as string | undefined) ?? 'lexichron study',
      inputs,
      zones: json.zones as string | undefined,
      timeZone: json.timeZone as string | undefined,
      time: {
        format: time.format as string | undefined,
        epoch: (time.epoch as EpochUnit | undefined) ?? 'auto',
        window: time.window as string | undefined,
        dstGap: (time.dstGap as 'reject' | undefined) ?? 'reject',
        dstOverlap: (time.dstOverlap as 'reject' | undefined) ?? 'reject',
      },
      lexicons: lexicons as string[],
      keepText: json.keepText === true,
      names: (json.names as Study['names'] | undefined) ?? 'as-written',
      countRate: (json.countRate as Study['countRate'] | undefined) ?? 'per100w',
      maxRejects: json.maxRejects === undefined ? '5%' : String(json.maxRejects),
      series: {
        bin: (series.bin as string | undefined) ?? '1d',
        dayStart: (series.dayStart as string | undefined) ?? '00:00',
        minWords: (series.minWords as number | undefined) ?? 1,
        excludeHours: series.excludeHours as string | undefined,
        fill: (series.fill as 'none' | undefined) ?? 'none',
        maxFill: (series.maxFill as number | undefined) ?? 1,
        detrend: series.detrend === true,
        aggregate: series.aggregate as string | undefined,
        from: (windowDates?.from ?? series.from) as string | undefined,
        to: (windowDates?.to ?? series.to) as string | undefined,
        windows: series.windows as string | undefined,
        window: windowDates || series.from !== undefined || series.to !== undefined || series.windows !== undefined ? 'dates' : series.window === 'entries' ? 'entries' : isObject(json.ratings) ? 'ratings' : 'entries',
        maxBins: series.maxBins as number | undefined,
        warnSpanDays: series.warnSpanDays as number | undefined,
      },
      ratings,
      dynamics,
      audit,
      report,
      privacy: json.privacy as Study['privacy'],
      out: json.out as string,
    },
  };
}
