import type { DynamicsProgress } from '../io/run-dynamics.js';

/** Runs whose estimate is at least this long get a warning before they start (seconds). */
export const LONG_CROSS_MAP_SECONDS = 60;

/** A duration for people: "40 s", "3 min 20 s", "1 h 05 min". */
export function formatDuration(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${s} s`;
  if (s < 3600) return `${Math.floor(s / 60)} min${s % 60 ? ` ${String(s % 60).padStart(2, '0')} s` : ''}`;
  return `${Math.floor(s / 3600)} h ${String(Math.round((s % 3600) / 60)).padStart(2, '0')} min`;
}

/** The warning printed before a long cross-mapping run, or undefined for a short one. */
export function longRunWarning(event: Extract<DynamicsProgress, { kind: 'start' }>): string | undefined {
  if (event.estimatedSeconds < LONG_CROSS_MAP_SECONDS) return undefined;
  const threads = event.workers > 0 ? `${event.workers} worker threads` : 'one thread';
  return (
    `Warning: cross mapping ${event.persons} persons × ${event.directions} directions will take about ${formatDuration(event.estimatedSeconds)} with ${threads} (a rough estimate). ` +
    'To do less, name pairs with --pair, lower --surrogates or --libraries, or skip it with --no-cross-mapping.\n'
  );
}

/** One progress line: persons done, time so far and the time left at the rate so far. */
export function progressLine(done: number, total: number, elapsedMs: number): string {
  const left = done > 0 ? ((elapsedMs / done) * (total - done)) / 1000 : undefined;
  return `cross mapping: ${done} of ${total} persons, ${formatDuration(elapsedMs / 1000)} so far${done < total && left !== undefined ? `, about ${formatDuration(left)} left` : ''}`;
}

/**
 * Prints cross-mapping progress on `stream` (stderr): the warning before a long run, then on a
 * terminal one line rewritten after each person, elsewhere (pipes, log files) a line every 10% of
 * the persons or 30 s. Runs estimated under 5 s print nothing.
 */
export function crossMapProgress(stream: NodeJS.WriteStream = process.stderr): (event: DynamicsProgress) => void {
  let quiet = true;
  let lastShare = 0;
  let lastAt = 0;
  return (event) => {
    if (event.kind === 'start') {
      quiet = event.estimatedSeconds < 5;
      const warning = longRunWarning(event);
      if (warning) stream.write(warning);
      return;
    }
    if (quiet) return;
    const line = progressLine(event.done, event.total, event.elapsedMs);
    if (stream.isTTY) {
      stream.write(`\r${line}\u001b[K${event.done === event.total ? '\n' : ''}`);
      return;
    }
    const share = Math.floor((10 * event.done) / event.total);
    if (event.done === event.total || share > lastShare || event.elapsedMs - lastAt >= 30000) {
      stream.write(`${line}\n`);
      lastShare = share;
      lastAt = event.elapsedMs;
    }
  };
}
