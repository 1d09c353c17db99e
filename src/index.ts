/**
 * lexichron's public library API: re-exports only (test/index.test.ts pins the list), and the
 * one set-up the library needs: the English tokenizer is given wink's model, read from the
 * installed package by src/io/read-core-model.ts (the text layer reads no file).
 */
import { readCoreModel } from './io/read-core-model.js';
import { provideCoreModel } from './text/core-model.js';

provideCoreModel(readCoreModel);

export type { Diagnostic, LexiconRef, RawEntry, ReadItem, Reconciliation, ScoredEntry, SourceRef, Stage } from './types.js';
export { LexichronError, usageError, inputError, exitCodeFor } from './errors.js';
export { TOOL_VERSION } from './version.js';

// ingest
export { readRecords, formatFromPath, type RecordItem, type ReadRecordsOptions, type TableFile, type TableFormat } from './ingest/read-records.js';
export { readEntries, recordToEntry, type ReadEntriesOptions } from './ingest/read-entries.js';
export { tableFile } from './io/table-file.js';
export { parseInstant, formatLocal, formatUtc, DEFAULT_TIME_OPTIONS, type TimeOptions, type InstantResult } from './ingest/parse-instant.js';
export { timeWindow, type TimeWindow } from './ingest/time-window.js';
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
export { tokenize } from './text/tokenize.js';
export { tokenizeEnglish } from './fast/tokenize-english.js';
export { tokenizeSegmenter } from './text/tokenize-segmenter.js';
export { TokenKind, type Tokens } from './text/tokens.js';
export { matchLexicon, type LexiconMatch } from './score/match-lexicon.js';
export { scoreEntry } from './score/score-entry.js';
export { scoreColumns, type ScoreColumn } from './score/score-columns.js';
export { scoreVader, type VaderLexicon, type VaderScores } from './score/score-vader.js';

// series
export { parseBinSpec, parseClockTime, parseExcludedHours, type BinSpec } from './series/bin-spec.js';
export { createSeriesState } from './series/create-series-state.js';
export { addSeriesEntry } from './series/add-series-entry.js';
export { buildPersonSeries } from './series/build-person-series.js';
export type { SeriesOptions, SeriesRow, SeriesEntry } from './series/series-types.js';

// runners (files)
export { runScore, type RunScoreOptions, type RunScoreResult } from './io/run-score.js';
export { runSeries, type RunSeriesOptions, type RunSeriesResult } from './io/run-series.js';
export { runStudy, readStudy } from './pipeline.js';
export { parseStudy, type Study } from './study/parse-study.js';
export { dataPackage, tableResource } from './report/data-dictionary.js';
export { buildManifest, CAUTIONS, type Manifest } from './report/manifest.js';

// import of donated exports (mbox, diary, chat-lines, chat-table) and privacy
export { openImportSource, IMPORT_FORMATS, type ImportFormat, type ImportSourceSpec, type OpenedImportSource } from './io/open-import-source.js';
export { runImport, type RunImportOptions, type RunImportResult } from './io/run-import.js';
export { readByteLines, readDecodedLines } from './io/read-byte-lines.js';
export { readPseudonymKey, PSEUDONYM_KEY_ENV } from './io/read-pseudonym-key.js';
export { forgetPerson, type ForgetOptions, type ForgetResult } from './io/forget-person.js';
export { importEntries, tallyImportItem, type ImportStepOptions } from './ingest/import/import-entries.js';
export { emptyImportReconciliation, type ImportItem, type ImportReconciliation, type DropReason, type EntryNote } from './ingest/import/import-item.js';
export { entryLine, entryTime } from './ingest/import/entry-line.js';
export { readMbox, type MboxOptions } from './ingest/import/read-mbox.js';
export { splitMbox, isMboxSeparator, type MboxPart } from './ingest/import/split-mbox.js';
export { splitByteLines, type ByteLine } from './ingest/import/split-byte-lines.js';
export { parseMailMessage, type MailContext } from './ingest/import/parse-mail-message.js';
export { parseMailDate, type MailDateResult } from './ingest/import/parse-mail-date.js';
export { parseAddressList, normalizeAddress, type Mailbox } from './ingest/import/parse-address-list.js';
export { readMailHeaders, mailHeader, type MailHeader, type MailHeaderBlock } from './ingest/import/read-mail-headers.js';
export { stripMailQuotes } from './ingest/import/strip-mail-quotes.js';
export { readDiary, compileDiaryHeading, DEFAULT_DIARY_HEADING, DEFAULT_DIARY_DATE_FORMAT, type DiaryOptions } from './ingest/import/read-diary.js';
export { readChatLines, chatStampTime, type ChatLinesOptions, type NumberedLine } from './ingest/import/read-chat-lines.js';
export { parseChatLine, normalizeSender, type ChatLine, type ChatStamp } from './ingest/import/parse-chat-line.js';
export { settleDateOrder, type DateOrder, type DateOrderResult } from './ingest/import/settle-date-order.js';
export { readChatTable, CHAT_TABLE_FIELDS, type ChatTableOptions } from './ingest/import/read-chat-table.js';
export { decodeTextLine, type DecodedLine } from './ingest/import/decode-text-line.js';
export { decodeWindows1252 } from './ingest/import/decode-windows-1252.js';
export { repairMojibake } from './ingest/import/repair-mojibake.js';
export { createDeduplicator, normalizeForDuplicates, type DedupeOptions, type DuplicateVerdict } from './ingest/import/create-deduplicator.js';
export { createBurstMerger, type BurstMerger } from './ingest/import/create-burst-merger.js';
export { importReconciliationText } from './report/import-reconciliation-text.js';
export { pseudonymizePerson, MIN_PSEUDONYM_KEY_BYTES } from './privacy/pseudonymize-person.js';
export { createPseudonymizer, type Pseudonymizer } from './privacy/create-pseudonymizer.js';
export { createRedactor, REDACTION_TOKENS, type RedactOptions } from './privacy/create-redactor.js';
export { keptText, type TextPolicy } from './privacy/kept-text.js';
export { createPersonRowFilter, personMentionPattern, type PersonRowFilter } from './privacy/create-person-row-filter.js';
export { removePersonFromJson, type JsonRemoval } from './privacy/remove-person-from-json.js';

// dynamics
export { analyseDynamics, type DynamicsOptions, type DynamicsResult, type SummaryRow, type VarRow, type CcmRow } from './dynamics/analyse-dynamics.js';
export { dynamicsTables, type DynamicsTable } from './dynamics/dynamics-tables.js';
export { parseSeriesCsv, type ParsedSeriesCsv } from './dynamics/parse-series-csv.js';
export { personVariableSummary, DEFAULT_MIN_LAG_PAIRS, type PersonVariableSummary } from './dynamics/person-variable-summary.js';
export { mssd } from './dynamics/mssd.js';
export { lag1AutocorrelationAcf } from './dynamics/lag1-autocorrelation-acf.js';
export { lag1AutocorrelationPearson } from './dynamics/lag1-autocorrelation-pearson.js';
export { var1, type Var1Fit, type Var1Coefficient } from './dynamics/var1.js';
export { pooledVar1, type PooledVar1Fit } from './dynamics/pooled-var1.js';
export { convergentCrossMapping, type CcmOptions, type CcmDirection } from './dynamics/convergent-cross-mapping.js';
export { simplexForecast, type SimplexForecastOptions } from './dynamics/simplex-forecast.js';
export { chooseEmbeddingDimension } from './dynamics/choose-embedding-dimension.js';
export { delayEmbedding } from './dynamics/delay-embedding.js';
export type { BinnedSeries, PersonSeriesInput } from './dynamics/types.js';

// statistics (domain-free primitives)
export {
  mean, variance, moments, standardDeviation, quantile, isNumber, groupBy,
  pearsonCorrelation, correlationFromMoments, fisherInterval,
  repeatedMeasuresCorrelation, intraclassCorrelation, oneWayIntraclassCorrelation,
  linearMixedModel, randomSlopeMixedModel, randomSlopeTest, minimizeNelderMead, cronbachAlpha, spearmanBrown, spearmanBrownFactor, splitHalfReliability,
  clusterBootstrap, random, randomInteger, shuffle, minimizeScalar, cholesky, notEstimable,
  normalCdf, normalQuantile, studentTCdf, studentTQuantile, studentTTwoSidedP, normalTwoSidedP, fCdf, fQuantile,
  type StatResult, type NotEstimable, type Correlation, type RepeatedMeasuresCorrelation, type IntraclassCorrelations, type IccForm,
  type OneWayIntraclassCorrelation, type LinearMixedModelFit, type RandomSlopeFit, type RandomSlopeOptions, type RandomSlopeTest, type MixedModelMethod, type LinearMixedModelOptions, type FixedEffect, type FixedEffectInference,
  type CronbachAlpha, type SplitHalfReliability, type BootstrapInterval, type RandomSource,
} from './stats/index.js';

// validation against self-reports
export {
  validateSeries, DEFAULT_VALIDATE_OPTIONS, analysePair, pairVerdict, VERDICT_THRESHOLDS, betweenPersonCorrelation, personMeans,
  perPersonCorrelations, wordCountReliability, binsPerPerson, alignRatingsToBins, alignRatingsToWindows,
  parseRatingScales, ratingValues, ratingColumns, seriesBinFromRecord, seriesScoreColumns, entryScoreColumns, entryScoreFromRecord,
  type ValidateInput, type ValidateOptions, type ValidationResult, type PairAnalysis, type Verdict, type VerdictWarning,
  type AlignedPair, type AlignedRow, type Rating, type RatingScale, type SeriesBin, type EntryScore, type WordCountReliability, type BinsPerPerson,
} from './validate/index.js';
export { runValidate, readRatings, type RunValidateOptions, type RunValidateResult } from './io/run-validate.js';

// HTML report
export { writeReport, type WriteReportResult } from './io/write-report.js';
export { readReportData, locateReportFiles } from './io/read-report-data.js';
export { buildReportData, type ReportInputs, type ReportOptions } from './report/data/build-report-data.js';
export { renderReport } from './report/html/render-report.js';
export { REPORT_CAUTIONS } from './report/html/cautions.js';
export type { ReportData, Part, CoverageData, SeriesData, ValidationData, ValidationPair, LexiconAuditData, ReadinessData, DynamicsData, ProvenanceData } from './report/report-data.js';

// term lists
export * from './terms/index.js';
export { writeTermAudit } from './io/write-term-audit.js';
export { openWordNet, wordnetDictDir } from './io/open-wordnet.js';
export { readCorpus, type ReadCorpusOptions, type CorpusItem } from './io/read-corpus.js';
export { LEXICON_EXTENSION, OVERRIDES_EXTENSION } from './io/load-lexicon.js';

// batch scoring and worker threads
export { scoreTexts, scoreTextInto, createBatchScores, type BatchScores } from './fast/score-texts.js';
export { scoredEntryFrom } from './score/score-entry.js';
export { createScorePool, autoWorkers, type ScorePool } from './io/score-pool.js';

// study runner stages
export { runDynamics, type RunDynamicsResult, type RatingsByBin } from './io/run-dynamics.js';
export { defaultStudyStages, validateStage, dynamicsStage } from './io/study-stages.js';
export { studyInput } from './io/study-input.js';
export { writeStudyAudit } from './io/write-study-audit.js';
export { inferTableResource } from './report/infer-table-resource.js';
export { readNamesFile } from './io/read-names-file.js';
export { DEFAULT_SEED, type StudyContext, type StudyStage, type StageOutput, type RunStudyResult } from './pipeline.js';
