import { Option, type Command } from 'commander';
import { inputError, usageError } from '../errors.js';
import { scoreWorkerCount, startScorePool } from '../io/score-pool.js';
import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import type { ZoneTable } from '../ingest/zone-table.js';
import type { Diagnostic } from '../types.js';
import { unplacedTime } from '../ingest/unplaced-time.js';
import { readNamesFile } from '../io/read-names-file.js';
import { PSEUDONYM_KEY_ENV, readPseudonymKey } from '../io/read-pseudonym-key.js';
import { createRedactor } from '../privacy/create-redactor.js';
import { createPseudonymizer } from '../privacy/create-pseudonymizer.js';
import { reconciliationText } from '../report/reconciliation-text.js';
import { SHARD_HELP, shardFrom } from './shard-option.js';
import { FILE_COLUMNS_HELP, fileColumnsFrom } from './file-columns-option.js';
import { addTimeOptions, delimiterFrom, parseMaxRejects, parseWorkers, progressReporter, timeOptionsFrom, tooManyRejects } from './common-options.js';

const collect = (value: string, previous: string[] = []): string[] => [...previous, value];

/**
 * With no --time-zone or --zones, a time written with its UTC offset is placed by that offset; the
 * first time without one (or an epoch number) stops the run, since no zone can place it (RFC 3339
 * section 4.2).
 */
function stopOnUnplacedTime(diagnostic: Diagnostic): void {
  if (diagnostic.code !== 'no_zone') return;
  throw usageError(`No time zone given, and ${unplacedTime(diagnostic, 'the entry')}: pass --time-zone ZONE (e.g. Europe/Brussels) or --zones FILE with each person's zone, or write every time with its offset (2026-03-29T08:15:00+02:00).`);
}

/** `lexichron score INPUT... --lexicon NAME_OR_PATH... --out FILE` */
export function registerScore(program: Command): void {
  const command = program
    .command('score')
    .description('score every entry of text exports with lexicons; one row per entry')
    .argument('<input...>', 'CSV, TSV, JSON Lines or JSON files with person, time and text')
    .option('-l, --lexicon <name-or-path>', 'a bundled lexicon name or a .lex.tsv file (repeatable; default afinn-165 and vader)', collect)
    .requiredOption('-o, --out <file>', 'scores CSV to write, e.g. out/scores.csv (rejects go to out/scores.rejects.csv, provenance to out/scores.csv.meta.json)')
    .option('--keep-text', 'also write each entry\'s text, redacted (off by default: outputs hold no raw text)')
    .option('--redact-names <file>', 'names (one per line) replaced by [name] in kept text; emails, phone numbers, URLs and @handles are always redacted')
    .option('--aggregates-only', 'write no participant text at all (refuses --keep-text)')
    .option('--pseudonym-key-file <file>', `pseudonymize person ids with a keyed hash (default key: the ${PSEUDONYM_KEY_ENV} environment variable, when set)`)
    .option('--workers <n>', 'scoring threads besides the one that reads and writes: a number (0 = none) or auto (by input size and cores)', 'auto')
    .option('--max-rejects <limit>', 'exit with code 3 when more rows than this are rejected: a count, a percentage, or none', '5%')
    .option('--shard <spec>', SHARD_HELP)
    .option('--file-columns <file=map>', FILE_COLUMNS_HELP, collect)
    .option('--parquet', 'also write the scores as Parquet (scores.parquet beside the CSV: UTC instant, local wall-clock time and IANA zone as separate typed columns)');
  addTimeOptions(command);
  command.addOption(new Option('--count-rate <unit>', 'unit of count categories, also written at the end of their column names: per100w (matched words per 100 words), per1000w or prop (share of words, 0–1)').choices(['per100w', 'per1000w', 'prop']).default('per100w'));
  command.addOption(new Option('--strict', 'exit with code 3 on the first rejected row\'s count (same as --max-rejects 0)'));
  command.action(async (inputs: string[], opts: Record<string, unknown>) => {
    if (opts.aggregatesOnly && opts.keepText) throw usageError('--aggregates-only and --keep-text contradict each other: drop one.');
    const key = await readPseudonymKey(opts.pseudonymKeyFile as string | undefined, process.env[PSEUDONYM_KEY_ENV]);
    const redact = createRedactor({ names: await readNamesFile(opts.redactNames as string | undefined) });
    const shard = shardFrom(opts.shard);
    const limit = opts.strict ? { count: 0 } : parseMaxRejects(String(opts.maxRejects));
    const fileColumns = fileColumnsFrom(opts.fileColumns as string[] | undefined, inputs);
    const scoreInputs = inputs.map((path) => ({ path, columns: fileColumns.get(path) ?? (opts.columns as string | undefined), format: opts.format as never, delimiter: delimiterFrom(opts.delimiter) }));
    // The scoring threads start now (one may have started already: see main.ts) and load
    // wink-nlp's model while this thread loads the code that reads and scores (imported only
    // now, for that reason) and the lexicons.
    const workers = await scoreWorkerCount(inputs, parseWorkers(String(opts.workers)));
    const pool = startScorePool(workers);
    let lexicons: CompiledLexicon[];
    let zones: ZoneTable;
    let runScore: typeof import('../io/run-score.js').runScore;
    try {
      const [score, lexiconLoader, zoneReader] = await Promise.all([import('../io/run-score.js'), import('../io/load-lexicon.js'), import('../io/read-zone-file.js')]);
      runScore = score.runScore;
      lexicons = await lexiconLoader.loadLexicons((opts.lexicon as string[] | undefined) ?? ['afinn-165', 'vader']);
      zones = await zoneReader.readZoneFile(opts.zones as string | undefined, opts.timeZone as string | undefined);
    } catch (error) {
      await pool?.close();
      throw error;
    }
    const progress = progressReporter('scored');
    const result = await runScore({
      inputs: scoreInputs,
      lexicons,
      zones,
      time: timeOptionsFrom(opts),
      out: String(opts.out),
      countRate: opts.countRate as 'per100w' | 'per1000w' | 'prop',
      keepText: opts.keepText === true && opts.aggregatesOnly !== true,
      redact,
      ...(key ? { pseudonyms: createPseudonymizer(key) } : {}),
      workers,
      pool,
      ...(shard ? { shard } : {}),
      onProgress: progress.update,
      ...(!opts.timeZone && !opts.zones ? { onReject: stopOnUnplacedTime } : {}),
    }).finally(progress.stop);
    process.stderr.write(`${reconciliationText(result.reconciliation)}\n`);
    process.stderr.write(`scores:  ${result.scoresPath}\nrejects: ${result.rejectsPath}\nsidecar: ${result.metaPath}\n`);
    if (opts.parquet) process.stderr.write(`parquet: ${await (await import('../io/write-parquet.js')).writeParquet(result.scoresPath, 'scores')}\n`);
    if (tooManyRejects(result.reconciliation, limit)) {
      throw inputError(`Too many rejected rows (limit ${String(opts.strict ? 0 : opts.maxRejects)}); see ${result.rejectsPath} for each row's reason, fix the input or raise --max-rejects.`);
    }
  });
}
