import type { SourceRef } from '../types.js';

/** One self-report: a person's ratings at one instant. */
export interface Rating {
  person: string;
  /** Epoch milliseconds, UTC. */
  instant: number;
  zone: string;
  offsetMinutes: number;
  /** Value per rating column; `undefined` when empty or rejected. */
  values: Record<string, number | undefined>;
  source: SourceRef;
}
