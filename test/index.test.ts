import { describe, expect, it } from 'vitest';
import * as api from '../src/index.js';

/**
 * The public library API (src/index.ts), pinned: adding or removing an export is a deliberate
 * change to this list. Engineers append exports to src/index.ts; the lead updates this list last.
 */
const EXPORTS = [
  'CAUTIONS', 'CHAT_TABLE_FIELDS', 'DEFAULT_DIARY_DATE_FORMAT', 'DEFAULT_DIARY_HEADING',
  'DEFAULT_MIN_LAG_PAIRS', 'DEFAULT_TIME_OPTIONS', 'DEFAULT_VALIDATE_OPTIONS', 'IMPORT_FORMATS',
  'LEXICON_SIGNATURE', 'LexichronError', 'MIN_PSEUDONYM_KEY_BYTES', 'PSEUDONYM_KEY_ENV', 'REDACTION_TOKENS',
  'REPORT_CAUTIONS', 'TOOL_VERSION', 'TokenKind', 'VERDICT_THRESHOLDS', 'addSeriesEntry',
  'alignRatingsToBins', 'alignRatingsToWindows', 'analyseDynamics', 'analyzePair',
  'betweenPersonCorrelation', 'binsPerPerson', 'buildManifest', 'buildPersonSeries', 'buildReportData',
  'buildZoneTable', 'bundledLexiconNames', 'chatStampTime', 'cholesky', 'chooseEmbeddingDimension',
  'clusterBootstrap', 'compileDiaryHeading', 'compileLexicon', 'convergentCrossMapping',
  'correlationFromMoments', 'createBurstMerger', 'createDeduplicator', 'createPersonRowFilter',
  'createRedactor', 'createSeriesState', 'cronbachAlpha', 'dataPackage', 'decodeTextLine',
  'decodeWindows1252', 'delayEmbedding', 'dynamicsTables', 'emptyImportReconciliation', 'entryLine',
  'entryScoreColumns', 'entryScoreFromRecord', 'entryTime', 'exitCodeFor', 'fCdf', 'fQuantile',
  'fisherInterval', 'forgetPerson', 'formatFromPath', 'formatLocal', 'formatUtc', 'groupBy', 'importEntries',
  'importReconciliationText', 'inputError', 'intraclassCorrelation', 'isMboxSeparator', 'isNumber',
  'isValidZone', 'isWildcard', 'keptText', 'lag1AutocorrelationAcf', 'lag1AutocorrelationPearson',
  'lexiconHash', 'linearMixedModel', 'loadLexicons', 'locateReportFiles', 'mailHeader', 'matchLexicon',
  'mean', 'minimizeScalar', 'moments', 'mssd', 'normalCdf', 'normalQuantile', 'normalTwoSidedP',
  'normalizeAddress', 'normalizeForDuplicates', 'normalizeSender', 'notEstimable',
  'oneWayIntraclassCorrelation', 'openImportSource', 'pairVerdict', 'parseAddressList', 'parseBinSpec',
  'parseChatLine', 'parseClockTime', 'parseColumnMapping', 'parseExcludedHours', 'parseInstant',
  'parseLexicon', 'parseMailDate', 'parseMailMessage', 'parseRatingScales', 'parseSeriesCsv', 'parseStudy',
  'pearsonCorrelation', 'perPersonCorrelations', 'personMeans', 'personVariableSummary', 'pooledVar1',
  'pseudonymizePerson', 'quantile', 'random', 'randomInteger', 'ratingColumns', 'ratingValues',
  'readByteLines', 'readChatLines', 'readChatTable', 'readDecodedLines', 'readDiary', 'readEntries',
  'readLexicon', 'readMailHeaders', 'readMbox', 'readPseudonymKey', 'readRatings', 'readRecords',
  'readReportData', 'readStudy', 'recordToEntry', 'removePersonFromJson', 'renderReport', 'repairMojibake',
  'repeatedMeasuresCorrelation', 'resolveColumns', 'resolveWallClock', 'runImport', 'runScore', 'runSeries',
  'runStudy', 'runValidate', 'scoreColumns', 'scoreEntry', 'scoreVader', 'serializeLexicon',
  'seriesBinFromRecord', 'seriesScoreColumns', 'settleDateOrder', 'shuffle', 'simplexForecast',
  'spearmanBrown', 'spearmanBrownFactor', 'splitByteLines', 'splitCsvRecord', 'splitHalfReliability',
  'splitMbox', 'standardDeviation', 'stripMailQuotes', 'studentTCdf', 'studentTQuantile',
  'studentTTwoSidedP', 'tableResource', 'tallyImportItem', 'tokenize', 'tokenizeEnglish',
  'tokenizeSegmenter', 'usageError', 'validateSeries', 'var1', 'variance', 'wordCountReliability',
  'writeReport', 'zoneAtInstant', 'zoneOffset', 'zoneOnLocalDate',
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
