import { Option, type Command } from 'commander';
import { join } from 'node:path';
import { usageError } from '../errors.js';
import { writeFileAtomic } from '../io/atomic-write.js';
import { readZoneFile } from '../io/read-zone-file.js';
import { runValidate } from '../io/run-validate.js';
import { dataPackage } from '../report/data-dictionary.js';
import { addTimeOptions, delimiterFrom, timeOptionsFrom } from './common-options.js';
import { windowMinutes } from '../validate/window-minutes.js';

const collect = (value: string, previous: string[] = []): string[] => [...previous, ...value.split(',').map((v) => v.trim()).filter(Boolean)];

function positiveInteger(name: string, value: unknown, allowZero = false): number {
  const n = Number(value);
  if (!Number.isInteger(n) || n < (allowZero ? 0 : 1)) throw usageError(`${name} \`${String(value)}\` is not a ${allowZero ? 'whole number ≥ 0' : 'positive whole number'}.`);
  return n;
}

/** `lexichron validate SERIES --ratings FILE --scale NAME=MIN:MAX --out DIR` */
export function registerValidate(program: Command): void {
  const command = program
    .command('validate')
    .description('check text scores against the same people\'s self-reports, within and between persons')
    .argument('[series]', 'long series CSV written by `lexichron series` (needed for --align bins)')
    .requiredOption('-r, --ratings <file>', 'self-reports: CSV, TSV, JSON Lines or JSON with person, time and rating columns')
    .requiredOption('-o, --out <dir>', 'folder for the validation tables, validation.json and datapackage.json')
    .option('--rating <column>', 'a rating column to validate (repeatable or comma-separated; default: every column but person, time, zone, id)', collect)
    .option('--missing <codes>', 'missing-value codes of the rating columns, comma-separated (e.g. NA,-99): read as missing, not as errors (default NA; none: only empty cells)')
    .option('--scale <scales>', 'declared scale of each rating, NAME=MIN:MAX, comma-separated (e.g. mood=0:100,calm=1:7; *=1:7 for all); values outside are rejected')
    .option('--score <column>', 'a text score column to validate (repeatable or comma-separated; default: all)', collect)
    .addOption(new Option('--align <how>', 'pair by the series\' bins, or by the text written in a window before each self-report').choices(['bins', 'window']).default('bins'))
    .option('--window <duration>', 'window before each self-report for --align window', '3h')
    .option('--min-words <n>', 'fewest words in a window for a text score (--align window)', '1')
    .option('--events <file>', 'entry-level scores: the series event file (…events.csv); needed for --align window and for the word-count reliability')
    .option('--seed <seed>', 'seed of the bootstrap and the random split halves', '1')
    .option('--replicates <n>', 'bootstrap resamples of persons (0 skips the bootstrap)', '2000')
    .option('--min-pairs <n>', 'fewest pairs for a person\'s own correlation', '10')
    .option('--reliability <r>', 'target reliability for the recommended --min-words', '0.7')
    .addOption(new Option('--model-inference <how>', 'intervals of the mixed model\'s fixed effects').choices(['between-within-t', 'wald-z']).default('between-within-t'))
    .addOption(new Option('--random-slopes <when>', 'let each person\'s within-person slope vary in the mixed model: auto (when the likelihood-ratio test favours it), always or never').choices(['auto', 'always', 'never']).default('auto'));
  addTimeOptions(command);
  command.action(async (series: string | undefined, opts: Record<string, unknown>) => {
    const reliability = Number(opts.reliability);
    if (!(reliability > 0 && reliability < 1)) throw usageError(`--reliability \`${String(opts.reliability)}\` must be a number between 0 and 1, e.g. 0.7.`);
    if (!opts.scale) throw usageError('Declare the scale of each rating with --scale, e.g. --scale mood=0:100,calm=1:7, so that out-of-scale values can be rejected.');
    const zones = await readZoneFile(opts.zones as string | undefined, opts.timeZone as string | undefined);
    const result = await runValidate({
      series,
      events: opts.events as string | undefined,
      ratings: String(opts.ratings),
      columns: opts.columns as string | undefined,
      format: opts.format as never,
      delimiter: delimiterFrom(opts.delimiter),
      zones,
      time: timeOptionsFrom(opts),
      ratingColumns: opts.rating as string[] | undefined,
      missing: opts.missing === undefined ? undefined : String(opts.missing).trim() === 'none' ? [] : String(opts.missing).split(','),
      scales: String(opts.scale),
      scoreColumns: opts.score as string[] | undefined,
      out: String(opts.out),
      validate: {
        align: opts.align as 'bins' | 'window',
        windowMinutes: windowMinutes(String(opts.window)),
        minWords: positiveInteger('--min-words', opts.minWords, true),
        seed: /^\d+$/.test(String(opts.seed)) ? Number(opts.seed) : String(opts.seed),
        replicates: positiveInteger('--replicates', opts.replicates, true),
        minPairs: positiveInteger('--min-pairs', opts.minPairs),
        reliability,
        inference: opts.modelInference as 'between-within-t' | 'wald-z',
        randomSlopes: opts.randomSlopes as 'auto' | 'always' | 'never',
      },
    });
    await writeFileAtomic(join(String(opts.out), 'datapackage.json'), JSON.stringify(dataPackage('lexichron-validation', 'lexichron validation', result.resources), null, 2) + '\n');
    const r = result.reconciliation;
    const byCode: Record<string, number> = {};
    for (const d of result.result.diagnostics) byCode[d.code] = (byCode[d.code] ?? 0) + 1;
    const problems = Object.entries(byCode).map(([k, v]) => `${k} ${v}`).join(', ') || 'none';
    const lines = [
      `${r.read} self-report rows read, ${r.kept} with a usable time and person (single values out of scale or not numeric are left out on their own); diagnostics (see validation-diagnostics.csv): ${problems}`,
      `missing ratings (${r.codes.length > 0 ? `empty or a missing-value code: ${r.codes.join(', ')}` : 'empty cells only'}): ${result.ratingColumns.map((c) => `${c} ${r.missing[c] ?? 0}`).join(', ')}`,
      ...(r.notes?.time_iso_fallback ? [`${r.notes.time_iso_fallback} read by the RFC 3339 / ISO 8601 fallback of --time-format`] : []),
      `${result.result.counts.rows} occasions paired (${result.result.counts.rowsWithText} with text) for ${result.result.counts.persons} persons`,
    ];
    for (const { score, rating, analysis } of result.result.pairs) {
      lines.push('', `${score} × ${rating}: ${analysis.verdict.text}`);
      for (const w of analysis.verdict.warnings) lines.push(`  warning (${w.code}): ${w.message}`);
    }
    for (const rel of result.result.reliability) {
      lines.push('', rel.text);
      if (rel.warning) lines.push(`  warning (min_words_below_reliability): ${rel.warning}`);
    }
    lines.push('', ...Object.entries(result.files).filter(([, p]) => p).map(([k, p]) => `${k}: ${p}`));
    process.stderr.write(lines.join('\n') + '\n');
  });
}
