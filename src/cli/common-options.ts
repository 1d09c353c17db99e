import { Option, type Command } from 'commander';
import cliProgress from 'cli-progress';
import { usageError } from '../errors.js';
import { EPOCH_UNITS, type TimeOptions } from '../ingest/parse-instant.js';
import { timeWindow } from '../ingest/time-window.js';
import type { WallClockPolicy } from '../ingest/zone-offset.js';
import type { Reconciliation } from '../types.js';

/** `--dst-gap`: what to do with a local time skipped by a clock change (shared by every command that reads times). */
export function dstGapOption(): Option {
  return new Option('--dst-gap <policy>', 'a local time skipped by a clock change: reject it (a counted reject with its reason), or take the earlier/later instant').choices(['reject', 'earlier', 'later']).default('reject');
}

/** `--dst-overlap`: what to do with a local time repeated by a clock change. */
export function dstOverlapOption(): Option {
  return new Option('--dst-overlap <policy>', 'a local time repeated by a clock change: reject it (a counted reject with its reason), or take the earlier/later instant').choices(['reject', 'earlier', 'later']).default('reject');
}

/** Adds the options shared by every command that reads timestamped rows. */
export function addTimeOptions(command: Command): Command {
  return command
    .option('--columns <map>', 'which columns hold person, time, text (and id, zone): person=COL,time=COL,text=COL[,id=COL][,zone=COL]')
    .option('--time-zone <zone>', 'IANA zone for every person (times without an offset are read in it)')
    .option('--zones <file>', 'CSV with columns person, zone[, from] giving each person\'s IANA zone (from: local date a move takes effect)')
    .option('--time-format <format>', 'luxon format of the time column, e.g. "dd/MM/yyyy HH:mm" (default: RFC 3339 / ISO 8601 or epoch)')
    .addOption(new Option('--epoch <unit>', 'unit of numeric times (auto: told apart by magnitude; us = microseconds)').choices([...EPOCH_UNITS]).default('auto'))
    .addOption(timeWindowOption())
    .addOption(dstGapOption())
    .addOption(dstOverlapOption())
    .option('--delimiter <char>', 'field delimiter of delimited text (default: , for .csv, tab for .tsv)')
    .addOption(new Option('--format <format>', 'input format when the extension does not tell').choices(['csv', 'tsv', 'jsonl', 'json']));
}

/** `--time-window FROM/TO`: the plausible times (shared by every command that reads times). */
export function timeWindowOption(): Option {
  return new Option('--time-window <from/to>', 'plausible times, FROM/TO as dates YYYY-MM-DD or times with an offset; a side left empty keeps its default (1970-01-01 / ten years from today); times outside are rejected as time_outside_window');
}

/** Time options from parsed commander options; `now` (the clock, read here in the shell) sets the default window. */
export function timeOptionsFrom(opts: Record<string, unknown>, now: number = Date.now()): TimeOptions {
  return {
    window: timeWindow(now, opts.timeWindow as string | undefined),
    format: opts.timeFormat as string | undefined,
    epoch: (opts.epoch as TimeOptions['epoch']) ?? 'auto',
    gap: (opts.dstGap as WallClockPolicy) ?? 'reject',
    overlap: (opts.dstOverlap as WallClockPolicy) ?? 'reject',
  };
}

/** A delimiter option with `\t` and `tab` understood as a tab. */
export function delimiterFrom(value: unknown): string | undefined {
  if (value === undefined) return undefined;
  const text = String(value);
  return text === '\\t' || text.toLowerCase() === 'tab' ? '\t' : text;
}

/** Parses `--max-rejects`: a count (`25`), a share of rows read (`5%`), or `none`. */
export function parseMaxRejects(value: string): { count?: number; share?: number } {
  if (value === 'none') return {};
  const share = /^(\d+(?:\.\d+)?)%$/.exec(value);
  if (share) return { share: Number(share[1]) / 100 };
  if (/^\d+$/.test(value)) return { count: Number(value) };
  throw usageError(`--max-rejects \`${value}\` is not a count (25), a percentage (5%) or none`);
}

/** True when the rejects exceed the limit. */
export function tooManyRejects(r: Reconciliation, limit: { count?: number; share?: number }): boolean {
  const rejected = Object.values(r.rejected).reduce((a, b) => a + b, 0);
  if (limit.count !== undefined && rejected > limit.count) return true;
  if (limit.share !== undefined && r.read > 0 && rejected / r.read > limit.share) return true;
  return false;
}

/** A row counter on stderr when stderr is a terminal; silent otherwise (CI, pipes, files). */
export function progressReporter(label: string): { update: (rows: number) => void; stop: () => void } {
  if (!process.stderr.isTTY) return { update: () => undefined, stop: () => undefined };
  const bar = new cliProgress.SingleBar(
    { format: `${label} {value} rows`, stream: process.stderr, hideCursor: true, clearOnComplete: true, noTTYOutput: false },
    cliProgress.Presets.shades_classic,
  );
  bar.start(0, 0);
  return { update: (rows) => bar.update(rows), stop: () => bar.stop() };
}

/** `--workers`: `auto` or a whole number from 0 to 16. */
export function parseWorkers(value: string): number | 'auto' {
  if (value === 'auto') return 'auto';
  if (!/^\d+$/.test(value) || Number(value) > 16) throw usageError(`--workers \`${value}\` must be auto or a whole number from 0 to 16.`);
  return Number(value);
}
