import type { Command } from 'commander';
import { bundledLexiconNames, readLexicon } from '../io/load-lexicon.js';

/** `lexichron lexicons`: lists bundled lexicons with license, categories and term counts. */
export function registerLexicons(program: Command): void {
  program
    .command('lexicons')
    .description('list the bundled lexicons with their license, categories and term counts')
    .argument('[paths...]', 'also describe these lexicon files')
    .action(async (paths: string[]) => {
      const names = [...(await bundledLexiconNames()), ...paths];
      for (const name of names) {
        const lex = await readLexicon(name);
        const accepted = lex.terms.filter((t) => t.status === 'accepted');
        const cats = lex.categories.map((c) => `${c.name} (${c.aggregation}, ${accepted.filter((t) => t.category === c.name).length} terms)`);
        process.stdout.write(`${lex.name}  version ${lex.version}\n  license:    ${lex.license}\n  source:     ${lex.source}\n  language:   ${lex.language}   scoring: ${lex.scoring}   negation: ${lex.negation} (window ${lex.window})\n  categories: ${cats.join('; ')}\n${lex.notes.map((n) => `  note:       ${n}\n`).join('')}\n`);
      }
    });
}
