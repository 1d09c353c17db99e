import { describe, expect, it } from 'vitest';
import * as api from '../src/index.js';

/**
 * The public library API (src/index.ts), pinned: adding or removing an export is a deliberate
 * change to this list. Engineers append exports to src/index.ts; the lead updates this list last.
 */
const EXPORTS = [
  'CAUTIONS', 'CHAT_TABLE_FIELDS', 'DEFAULT_DIARY_DATE_FORMAT', 'DEFAULT_DIARY_HEADING',
  'DEFAULT_MIN_LAG_PAIRS', 'DEFAULT_SEED', 'DEFAULT_TIME_OPTIONS', 'DEFAULT_VALIDATE_OPTIONS',
  'ENGLISH_FUNCTION_WORDS', 'IMPORT_FORMATS', 'LEXICON_EXTENSION', 'LEXICON_SIGNATURE',
  'LexichronError', 'MIN_PSEUDONYM_KEY_BYTES', 'OVERRIDES_EXTENSION', 'OVERRIDES_SIGNATURE',
  'PSEUDONYM_KEY_ENV', 'REDACTION_TOKENS', 'REPORT_CAUTIONS', 'SEEDS_SIGNATURE', 'TERM_AUDIT_FILES',
  'TOOL_VERSION', 'TOP_TERMS_COLUMNS', 'TokenKind', 'VERDICT_THRESHOLDS', 'WORDNET_FILE_SUFFIX',
  'WORDNET_LICENSE', 'addSeriesEntry', 'alignRatingsToBins', 'alignRatingsToWindows',
  'analyseDynamics', 'analysePair', 'applyLexiconOverrides', 'autoWorkers', 'betweenPersonCorrelation',
  'binsPerPerson', 'buildManifest', 'buildPersonSeries', 'buildReportData', 'buildSeedLexicon',
  'buildZoneTable', 'bundledLexiconNames', 'categoryScore', 'chatStampTime', 'cholesky',
  'chooseEmbeddingDimension', 'clusterBootstrap', 'compileDiaryHeading', 'compileLexicon',
  'convergentCrossMapping', 'correlationFromMoments', 'createBatchScores', 'createBurstMerger',
  'createDeduplicator', 'createPersonRowFilter', 'createPseudonymizer', 'createRedactor', 'createScorePool',
  'createSeriesState', 'cronbachAlpha', 'dataPackage', 'decodeTextLine', 'decodeWindows1252',
  'defaultStudyStages', 'delayEmbedding', 'diffLexicons', 'draftLexicon', 'dropTopTerms',
  'dynamicsStage', 'dynamicsTables', 'emptyImportReconciliation', 'entryLine', 'entryScoreColumns',
  'entryScoreFromRecord', 'entryTime', 'exitCodeFor', 'fCdf', 'fQuantile', 'fisherInterval',
  'forgetPerson', 'formatFromPath', 'formatLocal', 'formatUtc', 'groupBy', 'hitContributions',
  'importEntries', 'importReconciliationText', 'inferTableResource', 'inflectedForms', 'inputError',
  'intraclassCorrelation', 'isMboxSeparator', 'isNumber', 'isValidZone', 'isWildcard', 'itemAlpha',
  'keptText', 'kwicSnippet', 'lag1AutocorrelationAcf', 'lag1AutocorrelationPearson', 'lexiconHash',
  'linearMixedModel', 'loadLexicons', 'locateReportFiles', 'mailHeader', 'matchLexicon', 'mean',
  'minimizeNelderMead', 'minimizeScalar', 'moments', 'mssd', 'normalCdf', 'normalQuantile', 'normalTwoSidedP',
  'normalizeAddress', 'normalizeForDuplicates', 'normalizeSender', 'normsToLexicon', 'notEstimable',
  'oneWayIntraclassCorrelation', 'openImportSource', 'openWordNet', 'pairVerdict', 'parseAddressList',
  'parseBinSpec', 'parseChatLine', 'parseClockTime', 'parseColumnMapping', 'parseExcludedHours',
  'parseInstant', 'parseLexicon', 'parseLexiconOverrides', 'parseMailDate', 'parseMailMessage',
  'parseRatingScales', 'parseSeedFile', 'parseSeriesCsv', 'parseStudy', 'parseWordnetDataLine',
  'parseWordnetIndexLine', 'pearsonCorrelation', 'perPersonCorrelations', 'personMeans', 'personMentionPattern',
  'personVariableSummary', 'pooledVar1', 'positivePmi', 'pseudonymizePerson', 'quantile', 'random',
  'randomInteger', 'randomSlopeMixedModel', 'randomSlopeTest', 'ratingColumns', 'ratingValues', 'readByteLines', 'readChatLines', 'readChatTable',
  'readCorpus', 'readDecodedLines', 'readDiary', 'readEntries', 'readLexicon', 'readMailHeaders',
  'readMbox', 'readNamesFile', 'readPseudonymKey', 'readRatings', 'readRecords', 'readReportData',
  'readStudy', 'recordToEntry', 'removePersonFromJson', 'renderReport', 'repairMojibake',
  'repeatedMeasuresCorrelation', 'reservoir', 'reservoirAdd', 'resolveColumns', 'resolveWallClock',
  'runDynamics', 'runImport', 'runScore', 'runSeries', 'runStudy', 'runValidate', 'scoreColumns',
  'scoreEntry', 'scoreTextInto', 'scoreTexts', 'scoreVader', 'scoredEntryFrom', 'seedCooccurrence',
  'serializeLexicon', 'seriesBinFromRecord', 'seriesScoreColumns', 'settleDateOrder', 'shuffle',
  'simplexForecast', 'spearmanBrown', 'spearmanBrownFactor', 'splitByteLines',
  'splitHalfReliability', 'splitMbox', 'standardDeviation', 'stripMailQuotes', 'studentTCdf',
  'studentTQuantile', 'studentTTwoSidedP', 'studyInput', 'suggestTerms', 'suggestionReasonText',
  'tableFile', 'tableResource', 'tallyImportItem', 'termAuditFiles', 'termAuditor', 'termReliability',
  'timeWindow', 'tokenOffsets', 'tokenize', 'tokenizeEnglish', 'tokenizeSegmenter', 'topTerms', 'usageError',
  'validateSeries', 'validateStage', 'var1', 'variance', 'wordCountReliability', 'wordnetDictDir',
  'wordnetKey', 'wordnetPartsOfSpeech', 'wordnetRelatedLemmas', 'writeReport', 'writeStudyAudit',
  'writeTermAudit', 'zoneAtInstant', 'zoneOffset', 'zoneOnLocalDate'
];

describe('public API (src/index.ts)', () => {
  it('exports exactly the pinned list of runtime names, in sorted order', () => {
    const actual = Object.keys(api).sort();
    const added = actual.filter((n) => !EXPORTS.includes(n));
    const removed = EXPORTS.filter((n) => !actual.includes(n));
    expect({ added, removed }, 'update EXPORTS in test/index.test.ts when the API changes on purpose').toEqual({ added: [], removed: [] });
    expect(actual).toEqual([...EXPORTS].sort());
  });

  it('exports the series and study entry points', () => {
    for (const name of ['parseBinSpec', 'createSeriesState', 'addSeriesEntry', 'buildPersonSeries', 'runSeries', 'runStudy', 'parseStudy', 'dataPackage', 'buildManifest']) {
      expect(typeof (api as Record<string, unknown>)[name], name).not.toBe('undefined');
    }
  });
});
