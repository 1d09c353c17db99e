import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { inputError, usageError } from '../errors.js';
import type { Command } from 'commander';
import { forgetPerson } from '../io/forget-person.js';
import { writeReport } from '../io/write-report.js';
import { PSEUDONYM_KEY_ENV, readPseudonymKey } from '../io/read-pseudonym-key.js';
import { pseudonymizePerson } from '../privacy/pseudonymize-person.js';

/** Whether the study's manifest (or its scores sidecar) says person ids were pseudonymized. */
async function studyIsPseudonymized(dir: string): Promise<boolean> {
  for (const [file, pick] of [
    ['manifest.json', (m: Record<string, any>) => m.parameters?.privacy?.pseudonymized],
    ['scores.csv.meta.json', (m: Record<string, any>) => m.options?.pseudonymized],
  ] as const) {
    try {
      if (pick(JSON.parse(await readFile(join(dir, file), 'utf8')) as Record<string, any>) === true) return true;
    } catch {
      // no such file, or not JSON: look at the next
    }
  }
  return false;
}

/** Whether `id` has the shape of a pseudonym (pseudonymizePerson: `p` and 16 hex digits). */
const looksPseudonymous = (id: string): boolean => /^p[0-9a-f]{16}$/.test(id);

/** `lexichron forget PERSON --study DIR` */
export function registerForget(program: Command): void {
  program
    .command('forget')
    .description('remove a person from every output of a study folder (withdrawal of consent) and record the removal in its manifest')
    .argument('<person>', 'the person id as given to import/score/run (pseudonymized with the key when one is given); without a key, the pseudonym itself')
    .requiredOption('--study <dir>', 'the study\'s output folder')
    .option('--pseudonym-key-file <file>', `key used to pseudonymize the study (default: the ${PSEUDONYM_KEY_ENV} environment variable)`)
    .action(async (person: string, opts: Record<string, unknown>) => {
      const study = String(opts.study);
      const key = await readPseudonymKey(opts.pseudonymKeyFile as string | undefined, process.env[PSEUDONYM_KEY_ENV]);
      const pseudonymizedStudy = await studyIsPseudonymized(study);
      if (!key && !looksPseudonymous(person.trim()) && pseudonymizedStudy) {
        throw usageError(`The outputs in \`${study}\` hold pseudonyms, not raw ids: pass the study's key with --pseudonym-key-file (or set ${PSEUDONYM_KEY_ENV}) so that \`${person}\` can be found, or give the person's pseudonym itself.`);
      }
      // With a key, only the pseudonym is a person value of the outputs; the raw id is never matched as text.
      const id = key ? pseudonymizePerson(person, key) : person.trim();
      // Never write the raw id (nor an unkeyed digest, which short ids make easy to reverse).
      const record = key || looksPseudonymous(id) ? id : 'withdrawn person (outputs not pseudonymized; id not recorded)';
      const result = await forgetPerson(study, { ids: [id], record, at: new Date().toISOString() });
      const notes: string[] = [];
      for (const link of result.symlinks) notes.push(`symbolic link not followed (what it points to was not checked): ${link}`);
      if (!result.found) {
        for (const s of result.stale) notes.push(`mentions \`${person}\` as a word, but not as a person (not changed): ${s}`);
        process.stderr.write(notes.map((n) => `${n}\n`).join(''));
        const hint = !key ? ' (and pass the key if the study used pseudonyms)' : pseudonymizedStudy ? ' and the key' : `; the key was used to pseudonymize it, but these outputs do not say they hold pseudonyms: if they hold raw ids, run forget without the key (unset ${PSEUDONYM_KEY_ENV})`;
        throw inputError(`No output in \`${study}\` holds the person \`${person}\`: nothing was removed and nothing was recorded. Check the id as written in the inputs${hint}.`);
      }
      const lines = [`recorded as ${record} in manifest.json`];
      for (const c of result.changed) lines.push(`removed ${c.removed} row(s) from ${c.file}`);
      for (const d of result.deleted) lines.push(`deleted ${d}`);
      for (const t of result.temporaries) lines.push(`removed ${t} (left by an interrupted run)`);
      // The report is rebuilt from the cleaned files; other files that still mention the id are named for the researcher.
      const stale = [];
      for (const s of result.stale) {
        if (s === 'report.html') {
          await writeReport(study);
          lines.push('rebuilt report.html from the remaining outputs');
        } else stale.push(s);
      }
      for (const s of stale) lines.push(`STILL MENTIONS THE PERSON (regenerate or delete it): ${s}`);
      lines.push(...notes);
      lines.push('note: statistics pooled over persons (validation statistics, pooled VAR, term-audit counts) still include this person; remove their input and run the study again to recompute them.');
      process.stderr.write(`${lines.join('\n')}\n`);
    });
}
