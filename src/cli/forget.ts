import { createHash } from 'node:crypto';
import type { Command } from 'commander';
import { forgetPerson } from '../io/forget-person.js';
import { writeReport } from '../io/write-report.js';
import { PSEUDONYM_KEY_ENV, readPseudonymKey } from '../io/read-pseudonym-key.js';
import { pseudonymizePerson } from '../privacy/pseudonymize-person.js';

/** `lexichron forget PERSON --study DIR` */
export function registerForget(program: Command): void {
  program
    .command('forget')
    .description('remove a person from every output of a study folder (withdrawal of consent) and record the removal in its manifest')
    .argument('<person>', 'the person id as given to import/score (or the pseudonym itself)')
    .requiredOption('--study <dir>', 'the study\'s output folder')
    .option('--pseudonym-key-file <file>', `key used to pseudonymize the study (default: the ${PSEUDONYM_KEY_ENV} environment variable)`)
    .action(async (person: string, opts: Record<string, unknown>) => {
      const key = await readPseudonymKey(opts.pseudonymKeyFile as string | undefined, process.env[PSEUDONYM_KEY_ENV]);
      const pseudonym = key ? pseudonymizePerson(person, key) : undefined;
      const ids = pseudonym ? [person, pseudonym] : [person];
      // never write the raw id: record the pseudonym, or without a key an unkeyed digest marked as such
      const record = pseudonym ?? `sha256:${createHash('sha256').update(person.trim(), 'utf8').digest('hex').slice(0, 16)}`;
      const result = await forgetPerson(String(opts.study), { ids, record, at: new Date().toISOString() });
      const lines = [`recorded as ${record} in manifest.json`];
      for (const c of result.changed) lines.push(`removed ${c.removed} row(s) from ${c.file}`);
      for (const d of result.deleted) lines.push(`deleted ${d}`);
      if (result.changed.length === 0 && result.deleted.length === 0) lines.push('no output held this person');
      // The report is rebuilt from the cleaned files; other stale files are named for the researcher.
      const stale = [];
      for (const s of result.stale) {
        if (s === 'report.html') {
          await writeReport(String(opts.study));
          lines.push('rebuilt report.html from the remaining outputs');
        } else stale.push(s);
      }
      for (const s of stale) lines.push(`STILL MENTIONS THE PERSON (regenerate or delete it): ${s}`);
      if (result.changed.length > 0 || result.deleted.length > 0) {
        lines.push('note: statistics pooled over persons (validation statistics, pooled VAR, term-audit counts) still include this person; remove their input and run the study again to recompute them.');
      }
      process.stderr.write(`${lines.join('\n')}\n`);
    });
}
