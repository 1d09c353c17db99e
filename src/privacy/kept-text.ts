/** What may be kept of participants' text in outputs. */
export interface TextPolicy {
  /** Aggregates only: no text at all in any output (no `--keep-text` column, no samples, no text in rejects). */
  aggregatesOnly: boolean;
  /** Redaction applied to any text that is kept (createRedactor). */
  redact: (text: string) => string;
}

/**
 * The form in which a piece of participant text may appear in an output: undefined under an
 * aggregates-only policy, otherwise the redacted text. Every writer of kept text (entries with
 * `--keep-text`, keyword-in-context samples, reject messages) goes through this one function.
 */
export function keptText(text: string, policy: TextPolicy): string | undefined {
  return policy.aggregatesOnly ? undefined : policy.redact(text);
}
