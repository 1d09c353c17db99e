import type { Diagnostic } from '../types.js';

/**
 * The start of the message for a `no_zone` row when no zone was named at all: `what` (e.g. "the
 * entry") with its file and line, and why it cannot be placed (a time with no UTC offset, or an
 * epoch number, needs its person's zone: RFC 3339 section 4.2). Callers add what to pass.
 */
export function unplacedTime(diagnostic: Diagnostic, what: string): string {
  const where = diagnostic.source ? `\`${diagnostic.source.file}\` line ${diagnostic.source.line}` : 'a row';
  return `${what} on ${where} has a time with no UTC offset (or an epoch number)`;
}
