import { basename } from 'node:path';
import { Option, type Command } from 'commander';
import { inputError, usageError } from '../errors.js';
import type { ReadCorpusOptions } from '../io/read-corpus.js';
import { runTermsAudit } from '../io/run-terms-audit.js';
import { runTermsDiff } from '../io/run-terms-diff.js';
import { runTermsFromNorms } from '../io/run-terms-from-norms.js';
import { runTermsSuggest } from '../io/run-terms-suggest.js';
import { diagnosticText } from '../privacy/diagnostic-text.js';
import { formatNumber } from '../report/format-number.js';
import { suggestionReasonText } from '../terms/suggest-terms.js';
import type { WordNetRelation } from '../terms/wordnet-related-lemmas.js';
import type { Diagnostic } from '../types.js';
import { addTimeOptions, delimiterFrom, timeOptionsFrom } from './common-options.js';

function numberOption(name: string, min: number, max: number, integer = false): (value: string) => number {
  return (value) => {
    const n = Number(value);
    if (!Number.isFinite(n) || n < min || n > max || (integer && !Number.isInteger(n))) {
      throw usageError(`${name} \`${value}\` must be ${integer ? 'a whole number' : 'a number'} from ${min} to ${max}`);
    }
    return n;
  };
}

function corpusOptions(opts: Record<string, unknown>): ReadCorpusOptions {
  return { columns: opts.columns as string | undefined, format: opts.format as never, delimiter: delimiterFrom(opts.delimiter) };
}

function printRejects(rejects: readonly Diagnostic[]): void {
  if (rejects.length === 0) return;
  process.stderr.write(`${rejects.length} corpus row${rejects.length === 1 ? '' : 's'} left out, for example:\n`);
  for (const d of rejects.slice(0, 5)) process.stderr.write(`  ${d.source?.file}:${d.source?.line}: ${diagnosticText(d.message)}\n`);
}

function registerSuggest(terms: Command): void {
  const command = terms
    .command('suggest')
    .description('suggest terms for a construct from seed words: WordNet relations, inflected forms, and corpus co-occurrence (positive PMI)')
    .requiredOption('--seed <words>', 'comma-separated seed words, e.g. worry,anxious,nervous')
    .option('--corpus <file>', 'your own texts (.txt one entry per line, or CSV/TSV/JSONL with a text column) for co-occurrence')
    .option('-o, --out <file>', 'write a draft lexicon (.lex.tsv: seeds accepted, suggestions pending) and <file>.reasons.csv')
    .option('--name <name>', 'name of the draft lexicon and of its category (default: draft, category the first seed)')
    .option('--category <name>', 'category of the draft lexicon (default: --name, else the first seed)')
    .option('--min-count <n>', 'fewest entries a corpus word must share with the seeds (fewer: no corpus suggestion, no association strength)', numberOption('--min-count', 1, 1e9, true), 3)
    .option('--min-pmi <bits>', 'lowest positive PMI (log2) of a corpus suggestion', numberOption('--min-pmi', 0, 100), 1)
    .option('--max-corpus <n>', 'at most this many corpus suggestions', numberOption('--max-corpus', 0, 1e6, true), 50)
    .option('--senses <n>', 'follow the first n WordNet senses of each seed per part of speech (default 1: the most frequent sense; rarer senses bring unrelated words)', numberOption('--senses', 1, 1000, true))
    .option('--relations <list>', 'WordNet relations to follow: synonym,similar,see-also,derived,pertainym', 'synonym,similar,see-also,derived,pertainym')
    .option('--no-wordnet', 'no WordNet or inflection suggestions (corpus only)')
    .option('--show <n>', 'suggestions printed', numberOption('--show', 0, 1e6, true), 40)
    .option('--columns <map>', 'corpus columns: text=COL[,person=COL,id=COL]')
    .addOption(new Option('--format <format>', 'corpus format when the extension does not tell').choices(['csv', 'tsv', 'jsonl', 'json']))
    .option('--delimiter <char>', 'field delimiter of the corpus');
  command.action(async (opts: Record<string, unknown>) => {
    const seeds = String(opts.seed).split(',').map((s) => s.trim().toLowerCase()).filter((s) => s !== '');
    if (seeds.length === 0) throw usageError('--seed needs at least one word, e.g. --seed worry,anxious,nervous');
    const relations = String(opts.relations).split(',').map((r) => r.trim()) as WordNetRelation[];
    const known = ['synonym', 'similar', 'see-also', 'derived', 'pertainym'];
    const bad = relations.find((r) => !known.includes(r));
    if (bad) throw usageError(`--relations: unknown relation \`${bad}\`; use ${known.join(', ')}`);
    const corpusPath = opts.corpus ? String(opts.corpus) : undefined;
    const result = await runTermsSuggest({
      seeds,
      ...(corpusPath !== undefined ? { corpus: { path: corpusPath, options: corpusOptions(opts) } } : {}),
      wordnet: opts.wordnet !== false,
      relations,
      ...(opts.senses ? { maxSenses: Number(opts.senses) } : {}),
      minCount: Number(opts.minCount),
      minPmi: Number(opts.minPmi),
      maxCorpus: Number(opts.maxCorpus),
      ...(opts.out ? { out: { path: String(opts.out), name: String(opts.name ?? 'draft'), category: String(opts.category ?? opts.name ?? seeds[0]) } } : {}),
    });
    const { suggestions } = result;
    printRejects(result.rejects);
    if (corpusPath !== undefined && result.cooccurrence?.seedEntries === 0) process.stderr.write(`No entry of \`${basename(corpusPath)}\` contains a seed (${seeds.join(', ')}); there are no corpus suggestions. Check the spelling of the seeds or the text column.\n`);
    const shown = suggestions.slice(0, Number(opts.show));
    for (const s of shown) process.stdout.write(`${String(s.rank).padStart(4)}  ${s.term.padEnd(24)} ${s.reasons.map(suggestionReasonText).join('; ')}\n`);
    if (suggestions.length > shown.length) process.stdout.write(`… ${suggestions.length - shown.length} more${opts.out ? ' in the draft' : ' (use --out to keep them all)'}\n`);
    if (suggestions.length === 0) process.stderr.write('No suggestions: WordNet does not know the seeds and the corpus gave none; try other seed words or a lower --min-count.\n');
    if (result.written) process.stderr.write(`draft:   ${result.written.draft} (${seeds.length} seeds accepted, ${suggestions.length} suggestions pending review)\nreasons: ${result.written.reasons}\n`);
  });
}

function registerAudit(terms: Command): void {
  const command = terms
    .command('audit')
    .description('audit a term list against a corpus: hits and shares per term, persons, keyword-in-context, reliability, drop-top-k, wildcard matches')
    .argument('<lexicon>', 'a bundled lexicon name, a .lex.tsv file or a .over.tsv override file')
    .requiredOption('--corpus <file>', 'your texts (.txt one entry per line, or CSV/TSV/JSONL/JSON with person, text[, time])')
    .requiredOption('-o, --out <dir>', 'folder for the audit files')
    .option('--max-share <share>', 'flag a term holding more than this share of its category\'s hits', numberOption('--max-share', 0, 1), 0.2)
    .option('--min-persons <n>', 'flag a term used by fewer persons than this', numberOption('--min-persons', 1, 1e6, true), 3)
    .option('--kwic <n>', 'keyword-in-context samples per term', numberOption('--kwic', 0, 1000, true), 5)
    .option('--context <n>', 'words of context on each side', numberOption('--context', 0, 50, true), 6)
    .option('--drop-top <k>', 'largest k of the drop-top-k check', numberOption('--drop-top', 0, 100, true), 3)
    .option('--top <n>', 'terms per category in top-terms.csv', numberOption('--top', 1, 1e6, true), 10)
    .addOption(new Option('--over <unit>', 'reliability with terms as items over entries or over person-days (needs time and zone)').choices(['entries', 'days']).default('entries'))
    .option('--names <file>', 'names to redact from keyword-in-context samples (one per line)')
    .option('--random-seed <seed>', 'seed of the keyword-in-context sampling', '1');
  addTimeOptions(command);
  command.action(async (lexiconName: string, opts: Record<string, unknown>) => {
    const days = opts.over === 'days';
    const { lexicon, compiled, audit, rejects, written } = await runTermsAudit({
      lexicon: lexiconName,
      corpus: { path: String(opts.corpus), options: corpusOptions(opts) },
      out: String(opts.out),
      maxShare: Number(opts.maxShare),
      minPersons: Number(opts.minPersons),
      kwic: Number(opts.kwic),
      context: Number(opts.context),
      dropTop: Number(opts.dropTop),
      top: Number(opts.top),
      ...(days ? { days: { ...(opts.zones !== undefined ? { zones: String(opts.zones) } : {}), ...(opts.timeZone ? { timeZone: String(opts.timeZone) } : {}), time: timeOptionsFrom(opts) } } : {}),
      ...(opts.names ? { namesFile: String(opts.names) } : {}),
      randomSeed: String(opts.randomSeed),
    });
    printRejects(rejects);
    process.stderr.write(`audited ${lexicon.name} (sha256 ${compiled.ref.sha256.slice(0, 12)}…) on ${audit.entries} entries of ${audit.persons} persons\n`);
    for (const c of audit.categories) {
      const r = c.reliability;
      process.stderr.write(`  ${c.category}: ${c.hits} hits, ${c.termsWithHits}/${c.terms} terms matched; alpha ${r.alpha === undefined ? `n/a (${r.alphaReason})` : formatNumber(r.alpha, 3)}, split-half ${r.splitHalf === undefined ? 'n/a' : formatNumber(r.splitHalf, 3)} over ${r.rows} ${days ? 'person-days' : 'entries'}\n`);
    }
    for (const w of audit.warnings) process.stderr.write(`warning: ${w}\n`);
    process.stderr.write(`files:   ${written.join(', ')}\n`);
  });
}

function registerDiff(terms: Command): void {
  terms
    .command('diff')
    .description('compare two versions of a lexicon: added, removed and reweighted terms, and both content hashes')
    .argument('<before>', 'lexicon name or file (.lex.tsv or .over.tsv)')
    .argument('<after>', 'lexicon name or file')
    .option('-o, --out <file>', 'also write the changes as CSV (.csv) or JSON (.json)')
    .action(async (beforeName: string, afterName: string, opts: Record<string, unknown>) => {
      const d = await runTermsDiff(beforeName, afterName, opts.out !== undefined ? String(opts.out) : undefined);
      const count = (c: string): number => d.changes.filter((x) => x.change === c).length;
      process.stdout.write(`before: ${d.before.name} ${d.before.version}  sha256 ${d.before.sha256}  (${d.before.terms} terms)\nafter:  ${d.after.name} ${d.after.version}  sha256 ${d.after.sha256}  (${d.after.terms} terms)\n`);
      process.stdout.write(d.identical ? 'identical content\n' : `${count('added')} added, ${count('removed')} removed, ${count('reweighted')} reweighted, ${count('status')} status changed\n`);
      if (d.categoriesAdded.length) process.stdout.write(`categories added: ${d.categoriesAdded.join(', ')}\n`);
      if (d.categoriesRemoved.length) process.stdout.write(`categories removed: ${d.categoriesRemoved.join(', ')}\n`);
      if (d.metadataChanged.length) process.stdout.write(`metadata changed: ${d.metadataChanged.join(', ')}\n`);
      const w = (v: number | undefined): string => (v === undefined ? '' : formatNumber(v));
      for (const c of d.changes) {
        const detail = c.change === 'reweighted' ? `${w(c.weightBefore)} → ${w(c.weightAfter)}` : c.change === 'status' ? `${c.statusBefore} → ${c.statusAfter}` : c.change === 'added' ? w(c.weightAfter) : w(c.weightBefore);
        process.stdout.write(`  ${c.change.padEnd(10)} ${c.category}\t${c.term}\t${detail}\n`);
      }
    });
}

function registerFromNorms(terms: Command): void {
  terms
    .command('from-norms')
    .description('convert a table of word norms (ratings per word) into a lexicon with one rating category per column')
    .argument('<file>', 'CSV, TSV, JSONL or JSON table, one row per word')
    .requiredOption('--word <column>', 'column holding the word')
    .requiredOption('--rating <columns>', 'rating columns, comma-separated; NAME=COLUMN names the category (default: the column name)')
    .requiredOption('--name <name>', 'name of the lexicon (its score columns are <name>.<category>)')
    .option('--license <license>', 'license of the norms (required), e.g. "CC BY 4.0"')
    .option('--source <citation>', 'citation of the norms (required): authors, year, title, DOI')
    .requiredOption('-o, --out <file>', 'the lexicon file to write (.lex.tsv)')
    .option('--list-version <version>', 'version of the lexicon', '1')
    .option('--language <bcp47>', 'language of the words', 'en')
    .option('--scale <low,high>', 'declared rating scale, e.g. 1,9 (default: lowest and highest rating in the data)')
    .addOption(new Option('--duplicates <rule>', 'a word listed twice with different ratings: stop, keep the first, or average').choices(['error', 'first', 'mean']).default('error'))
    .addOption(new Option('--negation <rule>', 'what a negator before a word does').choices(['ignore', 'flip', 'drop']).default('ignore'))
    .option('--decimal-comma', 'ratings use a comma as decimal mark (5,25)')
    .addOption(new Option('--format <format>', 'table format when the extension does not tell').choices(['csv', 'tsv', 'jsonl', 'json']))
    .option('--delimiter <char>', 'field delimiter')
    .action(async (file: string, opts: Record<string, unknown>) => {
      const license = String(opts.license ?? '').trim();
      const source = String(opts.source ?? '').trim();
      if (!license || !source) {
        throw usageError(`Not writing \`${String(opts.out)}\`: ${!license ? '--license' : ''}${!license && !source ? ' and ' : ''}${!source ? '--source' : ''} missing. A lexicon must say under which license the norms may be used and where they come from, e.g. --license "CC BY 4.0" --source "Author, A. (2020). Title. Journal. doi:…".`);
      }
      const ratings = String(opts.rating).split(',').map((part) => {
        const [a, ...b] = part.split('=');
        const column = (b.length ? b.join('=') : a ?? '').trim();
        const category = (b.length ? a ?? '' : column).trim().replace(/[^\p{L}\p{N}_-]+/gu, '_');
        if (!column || !category) throw usageError(`--rating \`${String(opts.rating)}\`: \`${part}\` is not COLUMN or NAME=COLUMN`);
        return { column, category };
      });
      let scale: [number, number] | undefined;
      if (opts.scale) {
        const s = String(opts.scale).split(',').map(Number);
        if (s.length !== 2 || s.some((v) => !Number.isFinite(v)) || (s[0] as number) >= (s[1] as number)) throw usageError(`--scale \`${String(opts.scale)}\` must be two numbers low,high with low < high, e.g. 1,9`);
        scale = [s[0] as number, s[1] as number];
      }
      const out = String(opts.out);
      const result = await runTermsFromNorms({
        file,
        ...(opts.format !== undefined ? { format: opts.format as never } : {}),
        ...(opts.delimiter !== undefined ? { delimiter: delimiterFrom(opts.delimiter) as string } : {}),
        out,
        word: String(opts.word),
        ratings,
        name: String(opts.name),
        version: String(opts.listVersion),
        license,
        source,
        language: String(opts.language),
        ...(scale ? { scale } : {}),
        duplicates: opts.duplicates as 'error' | 'first' | 'mean',
        decimalComma: opts.decimalComma === true,
        negation: opts.negation as 'ignore' | 'flip' | 'drop',
      });
      const { diagnostics } = result;
      for (const d of diagnostics.slice(0, 10)) process.stderr.write(`  ${basename(file)} line ${d.source?.line}: ${diagnosticText(d.message)}\n`);
      if (diagnostics.length > 10) process.stderr.write(`  … and ${diagnostics.length - 10} more\n`);
      if (!result.lexicon) {
        const shown = result.problems.slice(0, 20).map((p) => `  ${p.line > 0 ? `line ${p.line}: ` : ''}${diagnosticText(p.message, 300)}`).join('\n');
        throw inputError(`Not writing \`${out}\`: ${result.problems.length} problem${result.problems.length === 1 ? '' : 's'} in \`${basename(file)}\`:\n${shown}`);
      }
      const lex = result.lexicon;
      process.stderr.write(`wrote ${out}: ${lex.categories.map((c) => `${c.name} ${lex.terms.filter((t) => t.category === c.name).length} words`).join(', ')}; scale ${lex.scale[0]} to ${lex.scale[1]}; ${diagnostics.length} row problem${diagnostics.length === 1 ? '' : 's'}\n`);
    });
}

/** `lexichron terms …`: build, audit, compare and convert term lists (lexicons). */
export function registerTerms(program: Command): void {
  const terms = program.command('terms').description('build, audit and compare term lists: suggest, audit, diff, from-norms');
  registerSuggest(terms);
  registerAudit(terms);
  registerDiff(terms);
  registerFromNorms(terms);
}
