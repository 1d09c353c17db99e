/**
 * The one error class of lexichron. Thrown only for configuration, usage or
 * programmer errors; row-level problems become Diagnostics instead.
 *
 * `kind` decides the exit code in cli/: usage → 2, input → 3, internal → 1.
 */
export type ErrorKind = 'usage' | 'input' | 'internal';

export class LexichronError extends Error {
  readonly kind: ErrorKind;
  constructor(message: string, kind: ErrorKind = 'usage') {
    super(message);
    this.name = 'LexichronError';
    this.kind = kind;
  }
}

/** A usage or configuration error (exit code 2). */
export function usageError(message: string): LexichronError {
  return new LexichronError(message, 'usage');
}

/** A bad-input-data error (exit code 3). */
export function inputError(message: string): LexichronError {
  return new LexichronError(message, 'input');
}

/** Exit code for an error raised anywhere in the program. */
export function exitCodeFor(error: unknown): number {
  if (error instanceof LexichronError) return error.kind === 'usage' ? 2 : error.kind === 'input' ? 3 : 1;
  return 1;
}
