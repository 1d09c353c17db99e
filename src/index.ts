/**
 * lexichron's public library API: re-exports only (test/index.test.ts pins the list).
 */
export type { Diagnostic, LexiconRef, RawEntry, ReadItem, Reconciliation, ScoredEntry, SourceRef, Stage } from './types.js';
export { LexichronError, usageError, inputError, exitCodeFor } from './errors.js';
export { TOOL_VERSION } from './version.js';

// ingest
export { readRecords, formatFromPath, type RecordItem, type ReadRecordsOptions, type TableFormat } from './ingest/read-records.js';
export { readEntries, recordToEntry, type ReadEntriesOptions } from './ingest/read-entries.js';
export { parseInstant, formatLocal, formatUtc, DEFAULT_TIME_OPTIONS, type TimeOptions, type InstantResult } from './ingest/parse-instant.js';
export { resolveWallClock, zoneOffset, isValidZone, type WallClockPolicy } from './ingest/zone-offset.js';
export { buildZoneTable, zoneAtInstant, zoneOnLocalDate, type ZoneTable } from './ingest/zone-table.js';
export { parseColumnMapping, resolveColumns, type ColumnMapping } from './ingest/column-mapping.js';

// lexicons and scoring
export { parseLexicon, isWildcard, LEXICON_SIGNATURE } from './lexicon/parse-lexicon.js';
export { serializeLexicon } from './lexicon/serialize-lexicon.js';
export { lexiconHash } from './lexicon/lexicon-hash.js';
export { compileLexicon, type CompiledLexicon } from './lexicon/compile-lexicon.js';
export type { Lexicon, Category, TermRow, Aggregation, NegationRule, TermStatus } from './lexicon/lexicon-types.js';
export { readLexicon, loadLexicons, bundledLexiconNames } from './io/load-lexicon.js';
export { tokenize, tokenizeEnglish, tokenizeSegmenter, TokenKind, type Tokens } from './text/tokenize.js';
export { matchLexicon, type LexiconMatch } from './score/match-lexicon.js';
export { scoreEntry, scoreColumns, type ScoreColumn } from './score/score-entry.js';
export { scoreVader, type VaderLexicon, type VaderScores } from './score/vader.js';

// series
export { parseBinSpec, parseClockTime, parseExcludedHours, type BinSpec } from './series/bin-spec.js';
export { createSeriesState, addSeriesEntry, buildPersonSeries, type SeriesOptions, type SeriesRow, type SeriesEntry } from './series/build-series.js';

// runners (files)
export { runScore, type RunScoreOptions, type RunScoreResult } from './io/run-score.js';
export { runSeries, type RunSeriesOptions, type RunSeriesResult } from './io/run-series.js';
export { runStudy, readStudy } from './pipeline.js';
export { parseStudy, type Study } from './study/parse-study.js';
export { dataPackage, tableResource } from './report/data-dictionary.js';
export { buildManifest, CAUTIONS, type Manifest } from './report/manifest.js';
