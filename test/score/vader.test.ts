import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { compileLexicon } from '../../src/lexicon/compile-lexicon.js';
import { parseLexicon } from '../../src/lexicon/parse-lexicon.js';
import { scoreVaderPieces } from '../../src/fast/score-vader-pieces.js';
import { tokenizeEnglishPieces, type Piece } from '../../src/fast/tokenize-english.js';
import { scoreVader, type VaderScores } from '../../src/score/score-vader.js';
import { vaderTokens } from '../../src/score/vader-tokens.js';
import { vaderSentences } from './vader-sentences.js';

// Reference library: the npm package `vader-sentiment` 1.1.3 (a port of the VADER
// reference implementation, Hutto & Gilbert 2014). Its lexicon file is the
// VADER lexicon (MIT License, C.J. Hutto); until lexicons/vader.tsv exists the
// tests build the map from it directly.
const require = createRequire(import.meta.url);
const { lexicon: lexiconObject } = require('vader-sentiment/src/vader_lexicon.js') as {
  lexicon: Record<string, number>;
};
const npmVader = require('vader-sentiment') as {
  SentimentIntensityAnalyzer: { polarity_scores(text: string): { compound: number; pos: number; neu: number; neg: number } };
};
const lexicon: ReadonlyMap<string, number> = new Map(Object.entries(lexiconObject));
const npmScores = (text: string) => npmVader.SentimentIntensityAnalyzer.polarity_scores(text);

/** The reference's display rounding: compound to 4 decimals, shares to 3. */
function rounded(s: VaderScores) {
  const r = (x: number, d: number) => Math.round(x * 10 ** d) / 10 ** d;
  return { compound: r(s.compound, 4), pos: r(s.pos, 3), neu: r(s.neu, 3), neg: r(s.neg, 3) };
}

type Expected = { compound: number; pos: number; neu: number; neg: number };

describe('scoreVader on the examples published in the VADER reference README', () => {
  // Source: README.rst of github.com/cjhutto/vaderSentiment, section "Output for the
  // above example code" (read from a stored copy of the repository at commit
  // 0180de61728c715aec95831e97e4cc5a2f5541b6, not from memory). The same values are
  // asserted by vader-sentiment 1.1.3's own tests ("match original demo output").
  const published: [string, Expected][] = [
    ['VADER is smart, handsome, and funny.', { pos: 0.746, compound: 0.8316, neu: 0.254, neg: 0.0 }],
    ['VADER is smart, handsome, and funny!', { pos: 0.752, compound: 0.8439, neu: 0.248, neg: 0.0 }],
    ['VADER is very smart, handsome, and funny.', { pos: 0.701, compound: 0.8545, neu: 0.299, neg: 0.0 }],
    ['VADER is VERY SMART, handsome, and FUNNY.', { pos: 0.754, compound: 0.9227, neu: 0.246, neg: 0.0 }],
    ['VADER is VERY SMART, handsome, and FUNNY!!!', { pos: 0.767, compound: 0.9342, neu: 0.233, neg: 0.0 }],
    ['VADER is VERY SMART, uber handsome, and FRIGGIN FUNNY!!!', { pos: 0.706, compound: 0.9469, neu: 0.294, neg: 0.0 }],
    ['VADER is not smart, handsome, nor funny.', { pos: 0.0, compound: -0.7424, neu: 0.354, neg: 0.646 }],
    ['The book was good.', { pos: 0.492, compound: 0.4404, neu: 0.508, neg: 0.0 }],
    ["At least it isn't a horrible book.", { pos: 0.363, compound: 0.431, neu: 0.637, neg: 0.0 }],
    ['The book was only kind of good.', { pos: 0.303, compound: 0.3832, neu: 0.697, neg: 0.0 }],
    [
      'The plot was good, but the characters are uncompelling and the dialog is not great.',
      { pos: 0.094, compound: -0.7042, neu: 0.579, neg: 0.327 },
    ],
    ['Today SUX!', { pos: 0.0, compound: -0.5461, neu: 0.221, neg: 0.779 }],
    ['Make sure you :) or :D today!', { pos: 0.706, compound: 0.8633, neu: 0.294, neg: 0.0 }],
  ];
  it.each(published)('gives the published scores for "%s" (README.rst of cjhutto/vaderSentiment)', (text, expected) => {
    expect(rounded(scoreVader(text, lexicon))).toEqual(expected);
  });

  // Three README examples were produced by a later Python release than the one whose
  // rules and lexicon vader-sentiment 1.1.3 ports (and lexichron follows, for parity
  // with it). lexichron gives the npm package's values; the README value is kept here
  // with the reason for the difference.
  const laterRelease: [string, Expected, number, string][] = [
    [
      "Today only kinda sux! But I'll get by, lol",
      { compound: 0.2228, pos: 0.251, neu: 0.569, neg: 0.179 },
      0.5249,
      'the ported release applies the contrastive rule only to "but" or "BUT"; the later release lower-cases first, so "But" counts',
    ],
    [
      'Not bad at all',
      { compound: -0.5423, pos: 0, neu: 0.462, neg: 0.538 },
      0.431,
      'the ported release matches negators case-sensitively, so "Not" does not negate; the later release lower-cases ("Capitalized negation")',
    ],
    [
      'Catch utf-8 emoji such as 💘 and 💋 and 😁',
      { compound: 0, pos: 0, neu: 1, neg: 0 },
      0.7003,
      'the later release replaces emoji by their descriptions (emoji_utf8_lexicon.txt); the ported release and its lexicon have no emoji',
    ],
  ];
  it.each(laterRelease)(
    'gives the npm vader-sentiment 1.1.3 scores for "%s" where the README shows a later release (confirmed with the npm package)',
    (text, expected, readmeCompound, reason) => {
      expect(reason).not.toBe('');
      expect(rounded(scoreVader(text, lexicon))).toEqual(expected);
      expect(npmScores(text)).toEqual(expected);
      expect(Math.abs(expected.compound - readmeCompound)).toBeGreaterThan(0.1);
    },
  );
});

describe('scoreVader on the other example sentences of the VADER reference implementation', () => {
  // Sentences: the "tricky sentences" of the demo in vaderSentiment.py (__main__) and
  // the npm package's own test sentence "The book was kind of good.". The reference
  // publishes no numbers for them; the values below were printed by vader-sentiment
  // 1.1.3 (confirmed with the npm package) and are also compared live.
  const confirmedWithNpm: [string, Expected][] = [
    ['The book was kind of good.', { neg: 0, neu: 0.657, pos: 0.343, compound: 0.3832 }],
    ['Sentiment analysis has never been good.', { neg: 0.325, neu: 0.675, pos: 0, compound: -0.3412 }],
    ['Sentiment analysis has never been this good!', { neg: 0, neu: 0.621, pos: 0.379, compound: 0.5672 }],
    ['Most automated sentiment analysis tools are shit.', { neg: 0.375, neu: 0.625, pos: 0, compound: -0.5574 }],
    ['With VADER, sentiment analysis is the shit!', { neg: 0, neu: 0.583, pos: 0.417, compound: 0.6476 }],
    ['Other sentiment analysis tools can be quite bad.', { neg: 0.351, neu: 0.649, pos: 0, compound: -0.5849 }],
    ['On the other hand, VADER is quite bad ass', { neg: 0, neu: 0.423, pos: 0.577, compound: 0.802 }],
    ['VADER is such a badass!', { neg: 0.387, neu: 0.613, pos: 0, compound: -0.2244 }],
    ['Without a doubt, excellent idea.', { neg: 0.305, neu: 0.244, pos: 0.451, compound: 0.296 }],
    ['Roger Dodger is one of the most compelling variations on this theme.', { neg: 0, neu: 0.834, pos: 0.166, compound: 0.2944 }],
    ['Roger Dodger is at least compelling as a variation on the theme.', { neg: 0, neu: 0.84, pos: 0.16, compound: 0.2263 }],
    ['Roger Dodger is one of the least compelling variations on this theme.', { neg: 0.132, neu: 0.868, pos: 0, compound: -0.1695 }],
    ['Not such a badass after all.', { neg: 0.286, neu: 0.714, pos: 0, compound: -0.1531 }],
  ];
  it.each(confirmedWithNpm)('gives the scores of npm vader-sentiment 1.1.3 for "%s"', (text, expected) => {
    expect(rounded(scoreVader(text, lexicon))).toEqual(expected);
    expect(npmScores(text)).toEqual(expected);
  });
});

describe('scoreVader applies each published rule with its published constant', () => {
  // Expected values computed by hand from the rules and constants of Hutto & Gilbert
  // (2014) and the reference implementation: booster 0.293, caps 0.733, negation
  // −0.74, distance 1/0.95/0.9, "!" 0.292, "?" 0.18/0.96, normalisation x/√(x²+15).
  const good = lexicon.get('good')!;
  const bad = lexicon.get('bad')!;
  const compoundOf = (x: number) => x / Math.sqrt(x * x + 15);
  const close = (actual: number, expected: number) => expect(actual).toBeCloseTo(expected, 12);

  it('reads the valences of "good" (1.9) and "bad" (−2.5) from the VADER lexicon', () => {
    expect(good).toBe(1.9);
    expect(bad).toBe(-2.5);
  });

  it('normalises a single word as x / sqrt(x² + 15) and gives it the whole positive share', () => {
    const s = scoreVader('good', lexicon);
    close(s.compound, compoundOf(1.9));
    expect([s.pos, s.neu, s.neg, s.tokens, s.matched]).toEqual([1, 0, 0, 1, 1]);
  });

  it('adds 0.293 for a booster right before the word and counts pos as (v + 1) over the total', () => {
    const s = scoreVader('very good', lexicon);
    close(s.compound, compoundOf(1.9 + 0.293));
    close(s.pos, (1.9 + 0.293 + 1) / (1.9 + 0.293 + 1 + 1));
    close(s.neu, 1 / (1.9 + 0.293 + 1 + 1));
  });

  it('scales a booster by 0.95 two tokens back and by 0.9 three tokens back', () => {
    close(scoreVader('very zz good', lexicon).compound, compoundOf(1.9 + 0.293 * 0.95));
    close(scoreVader('very zz vv good', lexicon).compound, compoundOf(1.9 + 0.293 * 0.9));
  });

  it('turns a dampener against the sign of a negative word ("slightly bad" is less negative)', () => {
    close(scoreVader('slightly bad', lexicon).compound, compoundOf(-2.5 + 0.293));
  });

  it('adds 0.733 to an ALL-CAPS word when the other words are not in capitals, and nothing when all are', () => {
    close(scoreVader('GOOD day', lexicon).compound, compoundOf(1.9 + 0.733));
    close(scoreVader('GOOD DAY', lexicon).compound, compoundOf(1.9));
    close(scoreVader('VERY good day', lexicon).compound, compoundOf(1.9 + 0.293 + 0.733));
  });

  it('multiplies by −0.74 for a negator within 3 tokens before the word, also for "n\'t" contractions', () => {
    close(scoreVader('not good', lexicon).compound, compoundOf(1.9 * -0.74));
    close(scoreVader("isn't zz good", lexicon).compound, compoundOf(1.9 * -0.74));
    close(scoreVader('never zz vv good', lexicon).compound, compoundOf(1.9 * -0.74));
    close(scoreVader('never zz vv yy good', lexicon).compound, compoundOf(1.9));
  });

  it('multiplies by 1.5 for "never so good" and by 1.25 for "never so zz good"', () => {
    close(scoreVader('never so good', lexicon).compound, compoundOf((1.9 + 0.293) * 1.5));
    close(scoreVader('never so zz good', lexicon).compound, compoundOf((1.9 + 0.293 * 0.95) * 1.25));
  });

  it('halves sentiment before "but" and multiplies sentiment after it by 1.5', () => {
    const s = scoreVader('good but bad', lexicon);
    close(s.compound, compoundOf(1.9 * 0.5 + -2.5 * 1.5));
    close(s.neg, (2.5 * 1.5 + 1) / (1.9 * 0.5 + 1 + 1 + 2.5 * 1.5 + 1));
  });

  it('negates after "least" unless it follows "at" or "very"', () => {
    close(scoreVader('least good', lexicon).compound, compoundOf(1.9 * -0.74));
    close(scoreVader('the least good', lexicon).compound, compoundOf(1.9 * -0.74));
    close(scoreVader('at least good', lexicon).compound, compoundOf(1.9));
  });

  it('replaces the valence by a special idiom ("the shit" = 3) and dampens after "kind of" by 0.293', () => {
    close(scoreVader('it is the shit', lexicon).compound, compoundOf(3));
    close(scoreVader('it was kind of good', lexicon).compound, compoundOf(1.9 - 0.293));
    expect(scoreVader('kind of', lexicon).matched).toBe(0);
  });

  it('adds 0.292 per exclamation mark up to 4, and 0.18 per question mark for 2–3 or 0.96 beyond', () => {
    close(scoreVader('good day!', lexicon).compound, compoundOf(1.9 + 0.292));
    close(scoreVader('good day!!!!!!', lexicon).compound, compoundOf(1.9 + 4 * 0.292));
    close(scoreVader('good day?', lexicon).compound, compoundOf(1.9));
    close(scoreVader('good day??', lexicon).compound, compoundOf(1.9 + 2 * 0.18));
    close(scoreVader('bad day????', lexicon).compound, compoundOf(-2.5 - 0.96));
  });

  it('gives shares that add up to 1 and a compound within [−1, 1]', () => {
    const s = scoreVader('GREAT GREAT GREAT awesome amazing wonderful love love love!!!!', lexicon);
    close(s.pos + s.neu + s.neg, 1);
    expect(s.compound).toBeLessThanOrEqual(1);
    expect(s.compound).toBeGreaterThan(0.99);
  });

  it('returns all zeros with tokens 0 for a text without VADER tokens, as the reference does', () => {
    expect(scoreVader('', lexicon)).toEqual({ compound: 0, pos: 0, neu: 0, neg: 0, tokens: 0, matched: 0 });
    expect(scoreVader(' a ! ? ', lexicon).tokens).toBe(0);
  });

  it('gives compound 0 and neu 1 to a text with tokens but no lexicon word', () => {
    expect(scoreVader('the meeting is at noon', lexicon)).toEqual({ compound: 0, pos: 0, neu: 1, neg: 0, tokens: 5, matched: 0 });
  });
});

describe('vaderTokens follows the tokenisation of the VADER reference implementation', () => {
  // Rule of vaderSentiment.py (_words_and_emoticons with _words_plus_punc), in the
  // release ported by vader-sentiment 1.1.3: split on whitespace, drop tokens of
  // length ≤ 1, and replace a token that is exactly punctuation-from-the-list + word
  // or word + punctuation-from-the-list by the word, when the word has no punctuation
  // and at least 2 characters. Cases derived by hand from that rule.
  const cases: [string, string[]][] = [
    ['VADER is smart, handsome, and funny.', ['VADER', 'is', 'smart', 'handsome', 'and', 'funny']],
    ['a I ! ok.', ['ok']],
    ['x. (funny) good!!!! good!!! ?!?!good', ['x.', '(funny)', 'good!!!!', 'good', 'good']],
    ["don't, it's \"quoted\" 'single", ["don't,", "it's", '"quoted"', 'single']],
    [':) :D :-( <3 ...', [':)', ':D', ':-(', '<3', '...']],
    ['one\ttwo\u00a0three\n\nfour  five', ['one', 'two', 'three', 'four', 'five']],
    ['well-being, -good- #tag @name', ['well-being,', '-good-', '#tag', '@name']],
  ];
  it.each(cases)('splits %j as the reference does', (text, tokens) => {
    expect(vaderTokens(text)).toEqual(tokens);
  });
});

describe('scoreVaderPieces (the scoring path) equals scoreVader', () => {
  // The scorer hands VADER the memoised pieces of the wink tokenizer; VADER's whitespace split
  // must give the same tokens from them as from the whole text, whatever the whitespace.
  const viaPieces = (text: string): VaderScores => {
    const pieces: Piece[] = [];
    tokenizeEnglishPieces(text, pieces);
    return scoreVaderPieces(pieces, text, lexicon);
  };

  it('on the 2,000 parity sentences below, scored twice (memoised pieces the second time)', () => {
    for (const text of vaderSentences(20140601, [...lexicon.keys()], 2000)) {
      expect(viaPieces(text), text).toEqual(scoreVader(text, lexicon));
      expect(viaPieces(text), text).toEqual(scoreVader(text, lexicon));
    }
  });

  it('on texts longer than the scratch arrays start (hundreds of tokens), equal to npm vader-sentiment 1.1.3', () => {
    const sentences = vaderSentences(20261202, [...lexicon.keys()], 120);
    for (const count of [10, 40, 120]) {
      const text = sentences.slice(0, count).join(' ');
      const ours = viaPieces(text);
      expect(ours).toEqual(scoreVader(text, lexicon));
      expect(Math.abs(ours.compound - npmScores(text).compound)).toBeLessThanOrEqual(0.001);
    }
  });

  it('on texts with every whitespace character JavaScript splits on, inside and between pieces', () => {
    const spaces = ['\t', '\n', '\v', '\f', '\r', ' ', '\u00a0', '\u1680', '\u2000', '\u2005', '\u2007', '\u200a', '\u2028', '\u2029', '\u202f', '\u205f', '\u3000', '\ufeff'];
    for (const space of spaces) {
      const text = `VERY good${space}but not${space}${space}great!! :)${space}sad`;
      expect(viaPieces(text), JSON.stringify(space)).toEqual(scoreVader(text, lexicon));
    }
  });
});

describe('scoreVader parity with npm vader-sentiment 1.1.3 on 2,000 generated sentences', () => {
  // Sentences from a seeded generator (test/score/vader-sentences.ts) mixing lexicon
  // words, boosters and dampeners, negators (also "Not"/"NOT"), ALL CAPS, "but",
  // "least", "never so/this", the special idioms, "kind of", emoticons, emoji,
  // attached punctuation, "!"/"?" runs and unusual whitespace.
  const sentences = vaderSentences(20140601, [...lexicon.keys()], 2000);
  const results = sentences.map((text) => ({ text, ours: scoreVader(text, lexicon), npm: npmScores(text) }));

  // Sentences where lexichron and the npm package differ by more than 0.001, each
  // with its explanation. None: lexichron follows the rules of the release the npm
  // package ports (with its fixes of two Python bugs: repeated words and duplicate
  // sentiments in the "but" rule are handled by position, as the npm port does).
  // The remaining difference is display rounding (npm rounds compound to 4 and the
  // shares to 3 decimals), at most 0.0005.
  const knownDifferences: { text: string; reason: string }[] = [];

  it('exercises every rule many times', () => {
    const count = (re: RegExp) => sentences.filter((s) => re.test(s)).length;
    expect(count(/\b(very|really|extremely|totally|quite|barely|slightly|somewhat|kinda)\b/i)).toBeGreaterThan(500);
    expect(count(/\b(not|never|don't|isn't|cant|without)\b/)).toBeGreaterThan(500);
    expect(count(/\b(Not|NOT|Never|NEVER|Don't|DON'T)\b/)).toBeGreaterThan(100);
    expect(count(/\b(but|BUT)\b/)).toBeGreaterThan(100);
    expect(count(/\bBut\b/)).toBeGreaterThan(50);
    expect(count(/\bleast\b/)).toBeGreaterThan(100);
    expect(count(/\bnever (so|this)\b/)).toBeGreaterThan(20);
    expect(count(/\b(the shit|the bomb|bad ass|yeah right|cut the mustard|kiss of death|hand to mouth)\b/)).toBeGreaterThan(200);
    expect(count(/\b(kind of|sort of|just enough)\b/i)).toBeGreaterThan(100);
    expect(count(/\b[A-Z]{3,}\b/)).toBeGreaterThan(500);
    expect(count(/!/)).toBeGreaterThan(500);
    expect(count(/\?\?/)).toBeGreaterThan(100);
    expect(count(/:\)|:\(|:D|<3|😁/)).toBeGreaterThan(200);
    expect(results.filter((r) => r.npm.compound !== 0).length).toBeGreaterThan(1800);
  });

  it('gives a compound within 0.001 of the npm package for at least 99% of sentences, every difference explained', () => {
    const differing = results.filter((r) => Math.abs(r.ours.compound - r.npm.compound) > 0.001).map((r) => r.text);
    expect(differing.length / results.length).toBeLessThanOrEqual(0.01);
    expect(differing).toEqual(knownDifferences.map((d) => d.text));
    const maxDiff = Math.max(...results.map((r) => Math.abs(r.ours.compound - r.npm.compound)));
    expect(maxDiff).toBeLessThanOrEqual(0.00005 + 1e-12);
  });

  it('gives pos, neu and neg within 0.001 of the npm package for at least 99% of sentences, every difference explained', () => {
    const differing = results
      .filter((r) => Math.abs(r.ours.pos - r.npm.pos) > 0.001 || Math.abs(r.ours.neu - r.npm.neu) > 0.001 || Math.abs(r.ours.neg - r.npm.neg) > 0.001)
      .map((r) => r.text);
    expect(differing.length / results.length).toBeLessThanOrEqual(0.01);
    expect(differing).toEqual(knownDifferences.map((d) => d.text));
    const maxDiff = Math.max(...results.flatMap((r) => [r.ours.pos - r.npm.pos, r.ours.neu - r.npm.neu, r.ours.neg - r.npm.neg].map(Math.abs)));
    expect(maxDiff).toBeLessThanOrEqual(0.0005 + 1e-12);
  });
});

describe('scoreVader with the bundled lexicon lexicons/vader.lex.tsv', () => {
  // Source of the expected map: the VADER lexicon as shipped in npm vader-sentiment 1.1.3.
  it('reads the same term → valence map as the npm package and scores the README example alike', () => {
    const file = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../lexicons/vader.lex.tsv');
    const parsed = parseLexicon(readFileSync(file, 'utf8'));
    expect(parsed.problems).toEqual([]);
    const bundled = compileLexicon(parsed.lexicon!).valence;
    expect(new Map([...bundled].sort())).toEqual(new Map([...lexicon].sort()));
    expect(rounded(scoreVader('VADER is smart, handsome, and funny.', bundled)).compound).toBe(0.8316);
  });
});

// The README's "Which VADER" list: each documented behaviour, checked against the npm package
// vader-sentiment 1.1.3 (the release lexichron follows) where it applies.
describe('VADER: the rules the README says lexichron follows', () => {
  it.each(['Not bad', 'not bad', 'happy 😊', 'never so good', 'it is never so good', 'well it is so good', 'Good But bad', 'good but bad'])('scores %j as vader-sentiment 1.1.3 does', (text) => {
    expect(rounded(scoreVader(text, lexicon))).toEqual(rounded({ ...npmScores(text), tokens: 0, matched: 0 } as VaderScores));
  });
  it('does not negate a capitalised "Not", counts an emoji as a token without sentiment, and strengthens "never so good" ×1.5', () => {
    expect(scoreVader('Not bad', lexicon).compound).toBeLessThan(0);
    expect(scoreVader('not bad', lexicon).compound).toBeGreaterThan(0);
    expect(scoreVader('happy 😊', lexicon).compound).toBe(scoreVader('happy', lexicon).compound);
    expect(scoreVader('happy 😊', lexicon).neu).toBeGreaterThan(0);
    const good = lexicon.get('good') as number;
    const x = (good + 0.293) * 1.5; // "so" boosts by 0.293 (one back), then ×1.5 for "never so"
    expect(scoreVader('never so good', lexicon).compound).toBeCloseTo(x / Math.sqrt(x * x + 15), 12);
  });
});
