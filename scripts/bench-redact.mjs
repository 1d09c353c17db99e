#!/usr/bin/env node
// Redaction speed (issue: redaction that is linear and complete): the time to redact 1 MB texts,
// ordinary prose and the pathological shapes that made the former backtracking patterns take
// quadratic time (a 100,000-character token took 45 s), with a names list. Target: each 1 MB text
// in under a second. Median of --rounds runs (default 3).
//
//   npm run build && node scripts/bench-redact.mjs [--rounds 3] [--size 1000000]
//
// Run by `npm run bench` (scripts/bench.mjs, HOOKS). Reads the library from dist/.
import { createRedactor } from '../dist/privacy/create-redactor.js';

const arg = (name, fallback) => {
  const i = process.argv.indexOf(name);
  return i === -1 ? fallback : Number(process.argv[i + 1]);
};
const rounds = arg('--rounds', 3);
const size = arg('--size', 1_000_000);
const sentence = 'Dear Ann, we met Jan de Vries at 10:30 near the station; call 020 7946 0958 or write to ann.lee@example.org, see https://example.org/x and @annlee. ';
const texts = [
  ['prose with addresses, phones and names', sentence.repeat(Math.ceil(size / sentence.length)).slice(0, size)],
  ['one long word', 'a'.repeat(size)],
  ['dotted atoms without @', 'a.'.repeat(size / 2)],
  ['a domain of labels', `x@${'a.'.repeat(size / 2)}`],
  ['hyphenated run', 'a-'.repeat(size / 2)],
  ['digits and spaces', '1 '.repeat(size / 2)],
  ['plus signs and digits', '+1'.repeat(size / 2)],
  ['digits and dots', '1.'.repeat(size / 2)],
  ['address specials', '!#'.repeat(size / 2)],
  ['@ signs', 'a@'.repeat(size / 2)],
  ['accented names and curly apostrophes', 'Zoë O’Brien  José\n'.repeat(Math.ceil(size / 18)).slice(0, size)],
];
const redact = createRedactor({ names: ['Jan de Vries', 'Jan', 'Ann', 'Zoe', "O'Brien", 'José'] });
console.log(`redaction, ${(size / 1e6).toFixed(1)} M characters per text, median of ${rounds} round(s), target < 1000 ms each`);
let worst = 0;
for (const [what, text] of texts) {
  const times = [];
  for (let r = 0; r < rounds; r++) {
    const started = performance.now();
    redact(text);
    times.push(performance.now() - started);
  }
  times.sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)];
  worst = Math.max(worst, median);
  console.log(`  ${what.padEnd(40)} ${median.toFixed(0).padStart(6)} ms`);
}
console.log(`  slowest: ${worst.toFixed(0)} ms, ${worst < 1000 ? 'target met' : 'TARGET MISSED'}`);
