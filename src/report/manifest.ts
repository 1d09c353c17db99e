import type { LexiconRef, Reconciliation } from '../types.js';

/** One file a run read or wrote. */
export interface FileRecord {
  path: string;
  sha256?: string;
  bytes?: number;
  rows?: number;
}

/** The provenance record of a run (manifest.json). */
export interface Manifest {
  tool: { name: 'lexichron'; version: string };
  /** Run time (ISO 8601 UTC): the only field that differs between identical runs. */
  created: string;
  command: string;
  inputs: FileRecord[];
  lexicons: LexiconRef[];
  parameters: Record<string, unknown>;
  reconciliation?: Reconciliation;
  stages: Record<string, unknown>;
  outputs: FileRecord[];
  /** Persons removed after the run by `lexichron forget` (withdrawal of consent): pseudonymous record, time, files changed. */
  forgotten: Array<{ person: string; at: string; files: string[] }>;
  cautions: string[];
}

/** Cautions written into every manifest and report. */
export const CAUTIONS: readonly string[] = [
  'Text-derived scores are research measures, not clinical assessments; do not use them to judge any individual\'s mental health or risk.',
  'Dictionary methods miss sarcasm, context and dialect; treat every score as a noisy indicator and check it against self-reports.',
  'Message archives contain other people\'s words: collect them only with consent and ethics approval, and keep third parties\' messages out of the analysis.',
  'Follow the data-protection law that applies to you and your ethics committee\'s conditions; they take precedence over anything this tool does by default.',
];

/** Builds a manifest; `created` comes from the caller (the clock is read only at the edge). */
export function buildManifest(fields: Omit<Manifest, 'tool' | 'forgotten' | 'cautions'> & { version: string }): Manifest {
  const { version, ...rest } = fields;
  return { tool: { name: 'lexichron', version }, ...rest, forgotten: [], cautions: [...CAUTIONS] };
}
