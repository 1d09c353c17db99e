/**
 * The keys of each object of a study file (see parseStudy). Any other key is an error naming its
 * JSON path: nothing is accepted and ignored.
 */

/** Formats read through an importer (donated exports) rather than as a table. */
export const STUDY_IMPORT_FORMATS = ['mbox', 'diary', 'chat-lines', 'chat-table'] as const;

export const TOP_KEYS = ['name', 'inputs', 'zones', 'timeZone', 'time', 'lexicons', 'keepText', 'countRate', 'names', 'maxRejects', 'series', 'ratings', 'dynamics', 'audit', 'report', 'privacy', 'out', 'description'];
const TABLE_KEYS = ['path', 'format', 'columns', 'delimiter', 'time'];
const IMPORT_KEYS = ['path', 'format', 'person', 'dedupe', 'mergeBurstMinutes', 'time'];
/** The keys each kind of input uses (`table`: CSV, TSV, JSON Lines, JSON). */
export const INPUT_KEYS: Record<string, readonly string[]> = {
  table: TABLE_KEYS,
  mbox: [...IMPORT_KEYS, 'addresses'],
  diary: [...IMPORT_KEYS, 'heading', 'dateFormat', 'locale', 'entryTime', 'entryTimeFormat'],
  'chat-lines': [...IMPORT_KEYS, 'senders', 'dateOrder'],
  'chat-table': [...IMPORT_KEYS, 'senders', 'senderField', 'timeField', 'textField', 'timeFormat'],
};
/** Keys of a `time` object: the study's, an input's or the ratings'. */
export const TIME_KEYS = ['format', 'epoch', 'window', 'dstGap', 'dstOverlap'];
export const SERIES_KEYS = ['bin', 'dayStart', 'minWords', 'excludeHours', 'fill', 'maxFill', 'detrend', 'aggregate', 'from', 'to', 'window', 'windows', 'maxBins', 'warnSpanDays'];
export const PRIVACY_KEYS = ['keyFile', 'keyEnv', 'names', 'aggregatesOnly'];
