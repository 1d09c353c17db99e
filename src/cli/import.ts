import { SHARD_HELP, shardFrom } from './shard-option.js';
import { shardOfPerson } from '../shard/shard-of-person.js';
import { Option, type Command } from 'commander';
import { usageError } from '../errors.js';
import type { DedupeOptions } from '../ingest/import/create-deduplicator.js';
import { DEFAULT_DIARY_DATE_FORMAT, DEFAULT_DIARY_ENTRY_TIME_FORMAT, DEFAULT_DIARY_HEADING, EXAMPLE_DIARY_ENTRY_TIME } from '../ingest/import/read-diary.js';
import { IMPORT_FORMATS, type ImportFormat } from '../io/open-import-source.js';
import { PSEUDONYM_KEY_ENV, readPseudonymKey } from '../io/read-pseudonym-key.js';
import { readNamesFile } from '../io/read-names-file.js';
import { runImport } from '../io/run-import.js';
import { createRedactor } from '../privacy/create-redactor.js';
import { createPseudonymizer } from '../privacy/create-pseudonymizer.js';
import { importReconciliationText } from '../report/import-reconciliation-text.js';
import type { WallClockPolicy } from '../ingest/zone-offset.js';
import { timeWindow } from '../ingest/time-window.js';
import { dstGapOption, dstOverlapOption, timeWindowOption } from './common-options.js';

const collect = (value: string, previous: string[] = []): string[] => [...previous, value];

function positiveNumber(name: string, value: unknown): number | undefined {
  if (value === undefined) return undefined;
  const n = Number(value);
  if (!Number.isFinite(n) || n < 0) throw usageError(`${name} \`${String(value)}\` is not a number of 0 or more`);
  return n;
}

/** `lexichron import FORMAT INPUT --person ID --time-zone ZONE --out entries.jsonl` */
export function registerImport(program: Command): void {
  program
    .command('import')
    .description('turn a donated export (mail archive, diary, chat log) into the entries that `score` reads, keeping only the participant\'s own words')
    .addArgument(program.createArgument('<format>', 'mbox | diary | chat-lines | chat-table').choices([...IMPORT_FORMATS]))
    .argument('<input>', 'the export file')
    .requiredOption('--person <id>', 'the participant\'s id (pseudonymized when a key is given)')
    .requiredOption('-o, --out <file>', 'entries JSON Lines to write (rejects go to <file>.rejects.csv, counts to <file>.meta.json)')
    .requiredOption('--time-zone <zone>', 'the participant\'s IANA zone, e.g. Europe/Brussels (times without an offset are read in it)')
    .option('--address <addr>', 'mbox: an address the participant sends from (repeatable)', collect)
    .option('--sender <name>', 'chat-lines, chat-table: the participant\'s sender name as written in the export (repeatable)', collect)
    .addOption(new Option('--date-order <order>', 'chat-lines: order of day, month, year when the file cannot settle it').choices(['dmy', 'mdy', 'ymd']))
    .option('--heading <regex>', 'diary: pattern of a heading line, its first group (or group `date`) holding the date', DEFAULT_DIARY_HEADING)
    .option('--date-format <format>', 'diary: luxon format of the heading date', DEFAULT_DIARY_DATE_FORMAT)
    .option('--locale <locale>', 'diary: locale of month and day names in headings', 'en')
    .option('--entry-time <regex>', `diary: pattern of a line that starts a timed entry under a heading, its first group (or group \`time\`) holding the clock time, e.g. '${EXAMPLE_DIARY_ENTRY_TIME}'`)
    .option('--entry-time-format <format>', 'diary: luxon format of the entry time', DEFAULT_DIARY_ENTRY_TIME_FORMAT)
    .option('--sender-field <name>', 'chat-table: field holding the sender')
    .option('--time-field <name>', 'chat-table: field holding the time')
    .option('--text-field <name>', 'chat-table: field holding the text')
    .option('--time-format <format>', 'chat-table: luxon format of the time field (default: RFC 3339 / ISO 8601 or epoch)')
    .addOption(dstGapOption())
    .addOption(dstOverlapOption())
    .addOption(timeWindowOption())
    .option('--merge-burst <minutes>', 'merge the participant\'s messages that follow each other within this many minutes into one entry')
    .option('--dedupe', 'drop exact and near-duplicate entries (repeated or forwarded text)')
    .option('--near-threshold <jaccard>', 'with --dedupe: word-shingle Jaccard similarity that counts as a near duplicate', '0.8')
    .option('--pseudonym-key-file <file>', `file holding the key for pseudonymizing the person id (default: the ${PSEUDONYM_KEY_ENV} environment variable)`)
    .option('--redact-names <file>', 'file of names (one per line) to replace with [name] in the kept text')
    .option('--no-redact', 'keep e-mail addresses, phone numbers, URLs and @handles in the entries\' text (they are redacted by default)')
    .option('--aggregates-only', 'write no participant text into the rejects file (codes only)')
    .option('--shard <spec>', SHARD_HELP)
    .action(async (format: ImportFormat, input: string, opts: Record<string, unknown>) => {
      const key = await readPseudonymKey(opts.pseudonymKeyFile as string | undefined, process.env[PSEUDONYM_KEY_ENV]);
      const pseudonyms = key ? createPseudonymizer(key) : undefined;
      const person = pseudonyms ? pseudonyms.person(String(opts.person)) : String(opts.person);
      const shard = shardFrom(opts.shard);
      if (shard && shardOfPerson(person, shard.count) !== shard.index) {
        // An export is one person's: it belongs to exactly one shard, and the other shards write nothing for it.
        process.stderr.write(`this export's person belongs to shard ${shardOfPerson(person, shard.count)}/${shard.count}, not ${shard.index}/${shard.count}: nothing imported (the other shard imports it)\n`);
        return;
      }
      const names = await readNamesFile(opts.redactNames as string | undefined);
      const redactor = createRedactor({ names });
      const nameOnly = createRedactor({ emails: false, phones: false, urls: false, handles: false, names });
      const redact = opts.redact === false ? (names.length > 0 ? nameOnly : undefined) : redactor;
      const threshold = positiveNumber('--near-threshold', opts.nearThreshold) ?? 0.8;
      if (threshold > 1) throw usageError(`--near-threshold \`${String(opts.nearThreshold)}\` must lie between 0 and 1`);
      const dedupe: DedupeOptions | undefined = opts.dedupe ? { threshold } : undefined;
      const mergeBurstMinutes = positiveNumber('--merge-burst', opts.mergeBurst);
      const window = timeWindow(Date.now(), opts.timeWindow as string | undefined);
      const result = await runImport({
        source: {
          format,
          path: input,
          person,
          zone: String(opts.timeZone),
          addresses: opts.address as string[] | undefined,
          senders: opts.sender as string[] | undefined,
          dateOrder: opts.dateOrder as 'dmy' | 'mdy' | 'ymd' | undefined,
          heading: opts.heading as string,
          dateFormat: opts.dateFormat as string,
          locale: opts.locale as string,
          entryTime: opts.entryTime as string | undefined,
          entryTimeFormat: opts.entryTimeFormat as string,
          senderField: opts.senderField as string | undefined,
          timeField: opts.timeField as string | undefined,
          textField: opts.textField as string | undefined,
          timeFormat: opts.timeFormat as string | undefined,
          dstGap: opts.dstGap as WallClockPolicy,
          dstOverlap: opts.dstOverlap as WallClockPolicy,
          window,
        },
        steps: { window, ...(dedupe ? { dedupe } : {}), ...(mergeBurstMinutes !== undefined ? { mergeBurstMinutes } : {}), ...(redact ? { redact } : {}) },
        out: String(opts.out),
        ...(pseudonyms ? { pseudonyms } : {}),
        redactMessages: redactor,
        aggregatesOnly: opts.aggregatesOnly === true,
      });
      const lines = [importReconciliationText(result.reconciliation)];
      if (result.dateOrder) lines.push(`date order: ${result.dateOrder.order} (${result.dateOrder.evidence})`);
      lines.push(`entries: ${result.entriesPath}`, `rejects: ${result.rejectsPath}`, `sidecar: ${result.metaPath}`);
      process.stderr.write(`${lines.join('\n')}\n`);
    });
}
