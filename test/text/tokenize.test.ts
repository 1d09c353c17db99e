import { describe, expect, it } from 'vitest';
import { loadLexicons } from '../../src/io/load-lexicon.js';
import { readPlainPiece } from '../../src/fast/read-piece.js';
import { termNorms } from '../../src/text/term-norms.js';
import { tokenize } from '../../src/text/tokenize.js';
import { TokenKind } from '../../src/text/tokens.js';
import { tokenizeSegmenter } from '../../src/text/tokenize-segmenter.js';

describe('tokenize (English, wink-nlp)', () => {
  it('lower-cases words and counts them', () => {
    const t = tokenize('Slept WELL today');
    expect(t.norm).toEqual(['slept', 'well', 'today']);
    expect(t.raw).toEqual(['Slept', 'WELL', 'today']);
    expect(t.nWords).toBe(3);
  });

  it('expands contractions and counts each contraction as one word', () => {
    expect(tokenize("I can't stand it")).toMatchObject({ norm: ['i', 'can', 'not', 'stand', 'it'], nWords: 4 });
    expect(tokenize("won't don't isn't")).toMatchObject({ norm: ['will', 'not', 'do', 'not', 'is', 'not'], nWords: 3 });
    expect(tokenize('don’t worry')).toMatchObject({ norm: ['do', 'not', 'worry'], nWords: 2 });
  });

  it('expands contractions written without an apostrophe the same way', () => {
    expect(tokenize('cant dont cannot')).toMatchObject({ norm: ['can', 'not', 'do', 'not', 'can', 'not'], nWords: 3 });
  });

  it('keeps emoji whole as grapheme clusters: ZWJ family, skin tone, flag, variation selector', () => {
    const t = tokenize('family 👨‍👩‍👧 time 👍🏽 🇧🇪 ❤️ 😴');
    expect(t.norm).toEqual(['family', '👨‍👩‍👧', 'time', '👍🏽', '🇧🇪', '❤️', '😴']);
    expect(t.kind).toEqual([TokenKind.Word, TokenKind.Emoji, TokenKind.Word, TokenKind.Emoji, TokenKind.Emoji, TokenKind.Emoji, TokenKind.Emoji]);
    expect(t.nWords).toBe(2);
  });

  it('splits an emoji from a word it touches', () => {
    expect(tokenize('good🐝').norm).toEqual(['good', '🐝']);
  });

  it('keeps emoticons as single tokens that are not words', () => {
    const t = tokenize('happy :) sad :-( love <3');
    expect(t.norm).toEqual(['happy', ':)', 'sad', ':-(', 'love', '<3']);
    expect(t.kind.filter((k) => k === TokenKind.Emoticon)).toHaveLength(3);
    expect(t.nWords).toBe(3);
  });

  it('marks punctuation and does not count it, nor hyphens inside words', () => {
    const t = tokenize('Hello!!! well-being, fine.');
    expect(t.norm).toEqual(['hello', '!', '!', '!', 'well', '-', 'being', ',', 'fine', '.']);
    expect(t.nWords).toBe(4);
    expect(t.kind[1]).toBe(TokenKind.Punct);
  });

  it('counts hashtags, mentions, URLs and numbers as words', () => {
    expect(tokenize('#happy @sam http://example.org 3 hives').nWords).toBe(5);
  });

  it('gives no tokens for empty text', () => {
    expect(tokenize('')).toMatchObject({ norm: [], nWords: 0 });
  });
});

describe('tokenizeSegmenter (other languages, Intl.Segmenter)', () => {
  it('splits Dutch words and lower-cases them with the language rules', () => {
    expect(tokenize('Ik ben MOE, echt moe.', 'nl')).toMatchObject({ norm: ['ik', 'ben', 'moe', ',', 'echt', 'moe', '.'], nWords: 5 });
  });

  it('splits Japanese written without spaces into words', () => {
    const t = tokenizeSegmenter('今日は疲れた', 'ja');
    expect(t.nWords).toBeGreaterThanOrEqual(2);
    expect(t.norm.join('')).toBe('今日は疲れた');
  });
});

describe('termNorms (the tokens of a lexicon term, for its tables)', () => {
  it("equals tokenize(term).norm for every term of the bundled lexicons and for edge cases (tokenize is checked against wink-nlp's readDoc in test/fast/tokenize-english.test.ts)", async () => {
    const lexicons = await loadLexicons(['afinn-165', 'vader', 'daily-constructs', 'basic-emotions']);
    const terms = lexicons.flatMap((l) => l.lexicon.terms.map((t) => t.term));
    terms.push('cannot', 'Cannot', 'dont', 'AINT', 'cannot,', 'etc.', 'a.', 'x', 'Happy!', 'well...', "can't", 'kind of', '🐝', ':)', 'naïve', 'e.g.', '');
    expect(terms.length).toBeGreaterThan(11_000);
    let plain = 0;
    for (const term of terms) {
      expect(termNorms(term), term).toEqual(tokenize(term).norm);
      if (readPlainPiece(term) !== undefined) plain++;
    }
    // Most terms take the plain path (letters, or letters and one mark), so the equality above
    // checks that path and not only the fallback to tokenize.
    expect(plain).toBeGreaterThan(10_000);
    expect(termNorms('Cannot')).toEqual(['can', 'not']);
    expect(termNorms('cannot,')).toEqual(['cannot', ',']);
    // Other languages keep their own tokenizer.
    expect(termNorms('Straße', 'de')).toEqual(tokenize('Straße', 'de').norm);
  });
});
