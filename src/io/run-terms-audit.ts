import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { usageError } from '../errors.js';
import type { TimeOptions } from '../ingest/parse-instant.js';
import { compileLexicon, type CompiledLexicon } from '../lexicon/compile-lexicon.js';
import type { Lexicon } from '../lexicon/lexicon-types.js';
import { createRedactor } from '../privacy/create-redactor.js';
import { diagnosticText } from '../privacy/diagnostic-text.js';
import { csvDocument } from '../report/csv.js';
import { random } from '../stats/random.js';
import { termAuditor, type TermAudit } from '../terms/term-auditor.js';
import type { Diagnostic } from '../types.js';
import { writeFileAtomic } from './atomic-write.js';
import { collectCorpus } from './collect-corpus.js';
import { readLexicon } from './load-lexicon.js';
import { readCorpus, type ReadCorpusOptions } from './read-corpus.js';
import { readZoneFile } from './read-zone-file.js';
import { writeTermAudit } from './write-term-audit.js';

/** Options of {@link runTermsAudit} (`lexichron terms audit`). */
export interface RunTermsAuditOptions {
  /** A bundled lexicon name, a .lex.tsv file or a .over.tsv override file. */
  lexicon: string;
  /** The corpus and how to read it. */
  corpus: { path: string; options: ReadCorpusOptions };
  /** Folder for the audit files. */
  out: string;
  maxShare: number;
  minPersons: number;
  kwic: number;
  context: number;
  dropTop: number;
  /** Terms per category in top-terms.csv. */
  top: number;
  /** Reliability over entries, or over person-days (then `days` says how to place entries in days). */
  days?: { zones?: string; timeZone?: string; time: TimeOptions };
  /** A file of names (one per line) redacted from keyword-in-context samples. */
  namesFile?: string;
  /** Seed of the keyword-in-context sampling. */
  randomSeed: string;
}

/** What {@link runTermsAudit} found and wrote. */
export interface RunTermsAuditResult {
  lexicon: Lexicon;
  compiled: CompiledLexicon;
  audit: TermAudit;
  /** Corpus rows left out (also written to corpus-rejects.csv when there are any). */
  rejects: Diagnostic[];
  /** The files written. */
  written: string[];
}

/**
 * Audits a rules lexicon against a corpus (`termAuditor`: hits and shares per term, persons,
 * keyword-in-context, reliability, drop-top-k, wildcard matches) and writes the audit files.
 */
export async function runTermsAudit(options: RunTermsAuditOptions): Promise<RunTermsAuditResult> {
  const lexicon = await readLexicon(options.lexicon);
  if (lexicon.scoring === 'vader') throw usageError(`\`${lexicon.name}\` is scored with the VADER rules; audit a rules lexicon (its terms are matched one by one).`);
  const compiled = compileLexicon(lexicon);
  if (compiled.single.size + compiled.phrases.size + compiled.wildcards.size === 0) {
    throw usageError(`\`${lexicon.name}\` has no accepted terms; set the status of the terms you keep to accepted (pending and rejected terms are not matched).`);
  }
  const names = options.namesFile !== undefined ? (await readFile(options.namesFile, 'utf8')).split(/\r?\n/).map((n) => n.trim()).filter((n) => n !== '') : [];
  let bins: ReadCorpusOptions['bins'];
  if (options.days) {
    if (!options.days.timeZone && !options.days.zones) throw usageError('--over days needs each person\'s time zone: pass --time-zone ZONE or --zones FILE.');
    bins = { zones: await readZoneFile(options.days.zones, options.days.timeZone), time: options.days.time };
  }
  const auditor = termAuditor(compiled, {
    maxShare: options.maxShare,
    minPersons: options.minPersons,
    kwic: options.kwic,
    context: options.context,
    dropTop: options.dropTop,
    over: options.days ? 'bins' : 'entries',
    random: random(options.randomSeed),
    redact: createRedactor({ names }),
  });
  const { path } = options.corpus;
  const { rejects } = await collectCorpus(path, readCorpus(path, { ...options.corpus.options, ...(bins ? { bins } : {}) }), (e) => auditor.add(e));
  const audit = auditor.finish();
  const written = await writeTermAudit(options.out, audit, options.top);
  if (rejects.length > 0) {
    await writeFileAtomic(join(options.out, 'corpus-rejects.csv'), csvDocument(['file', 'line', 'code', 'message'], rejects.map((d) => [d.source?.file ?? '', String(d.source?.line ?? ''), d.code, diagnosticText(d.message)])));
  }
  return { lexicon, compiled, audit, rejects, written };
}
