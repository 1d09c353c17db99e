/**
 * Shared data types of the lexichron pipeline.
 *
 * Time is always explicit: an instant is epoch milliseconds (UTC) and travels
 * with the IANA zone of the person it belongs to.
 */

/** Where a row came from: the file and the 1-based line (of its first physical line). */
export interface SourceRef {
  file: string;
  line: number;
}

/** The stage that raised a diagnostic. */
export type Stage = 'ingest' | 'privacy' | 'lexicon' | 'score' | 'series' | 'validate' | 'dynamics' | 'terms' | 'report';

/**
 * A row-level problem. Every row that does not reach the next stage leaves one
 * of these behind, with a fixed `code` that the reconciliation counts.
 */
export interface Diagnostic {
  code: string;
  message: string;
  source?: SourceRef;
  stage: Stage;
}

/** One text entry as read from an export, before scoring. */
export interface RawEntry {
  /** Entry id: the id column when given, otherwise `<file>:<line>`. */
  id: string;
  person: string;
  /** Epoch milliseconds, UTC. */
  instant: number;
  /** IANA zone of the person at that instant. */
  zone: string;
  /** UTC offset in minutes at that instant in that zone (or as written in the source). */
  offsetMinutes: number;
  text: string;
  source: SourceRef;
  /**
   * Set when `person` and `id` were already pseudonymized (at import): the key's check value
   * (Pseudonymizer.keyCheck). Such an entry is never pseudonymized again.
   */
  pseudonymKey?: string;
}

/**
 * What a reader yields: either an entry or a diagnostic for a rejected row. An entry may carry
 * notes, remarks on how it was read that are counted but change nothing (`time_iso_fallback`:
 * its time did not match the given time format and was read as RFC 3339 / ISO 8601).
 */
export type ReadItem<T = RawEntry> = { kind: 'entry'; entry: T; notes?: string[] } | { kind: 'reject'; diagnostic: Diagnostic };

/** The result of scoring one entry. */
export interface ScoredEntry {
  id: string;
  person: string;
  instant: number;
  zone: string;
  offsetMinutes: number;
  /** Word tokens (see text/tokenize for what counts as a word). */
  nWords: number;
  /**
   * Score per column `<lexicon>.<category>` (and VADER's `vader.compound` etc.).
   * `undefined` means "no score" (for example a rating category with no match), never 0.
   */
  scores: Record<string, number | undefined>;
  /** Matched terms per column `<lexicon>.<category>` (the `.n` columns). */
  matched: Record<string, number>;
  /** Negated hits per lexicon (the `<lexicon>.negated` columns). */
  negated: Record<string, number>;
  /** Present only when the caller asked to keep text. */
  text?: string;
  source: SourceRef;
}

/** Provenance of a lexicon used for a run. */
export interface LexiconRef {
  name: string;
  version: string;
  sha256: string;
  license: string;
  source: string;
}

/** Counts of a run's rows: read = kept + rejected (by reason) + dropped (by reason). */
export interface Reconciliation {
  read: number;
  scored: number;
  rejected: Record<string, number>;
  /** Rows removed on purpose, e.g. third-party messages or duplicates, by reason. */
  dropped: Record<string, number>;
  /**
   * Scored rows with a note, by note (`time_iso_fallback`: the time did not match the time format
   * and was read as RFC 3339 / ISO 8601; an importer's `mojibake`, …). Not part of the identity
   * read = scored + rejected + dropped: a noted row is also a scored one. Absent when none.
   */
  notes?: Record<string, number>;
  /** Only in one shard of a sharded run: rows of persons scored by another shard (and, outside shard 0, rejects and drops, which shard 0 counts). */
  otherShard?: number;
}
