import { setFlagsFromString } from 'node:v8';

/**
 * V8's tiering budget for scoring runs. V8 counts the bytecode a function runs and, each time
 * the count reaches `--interrupt-budget`, considers it for optimization; optimizing compiles run
 * on helper threads. At the start of a scoring run much code runs once, in long loops (parsing
 * lexicons, hashing them, loading wink-nlp's model, compiling the lexicons in each thread), and
 * with the default budget V8 optimizes it all, then throws some of it away again: measured on the
 * 200,000-message bench corpus (Node 20), helper threads spent 1.7 s of CPU, mostly compiling,
 * beside 2.3 s each for the reading and the scoring thread, on two cores. Raising the budget for
 * the start-up and restoring the default when the first scores are written (by then everything
 * that runs per entry has run) cut the helpers from 1.84 to 1.37 s and the run from 3.50 to
 * 3.27 s (medians of 8 interleaved rounds). Raised for the whole run instead, the reading and
 * scoring threads ran slower (their hot code was optimized later) and the gain mostly went.
 *
 * The numbers are V8 11.3's (Node 20, which the bench measured): on another V8 nothing is
 * changed, nor when the budget was set on the command line or in NODE_OPTIONS.
 */
const MEASURED_V8 = '11.3.';
/** V8 11.3's default budget, restored after the start-up. */
const DEFAULT_BUDGET = 67_584;
const STARTUP_BUDGET = 1_000_000;

/**
 * The V8 flags that raise the budget for the start-up and restore it, or undefined when nothing
 * is to change: another V8 than the one measured, or a budget the user set (`execArgv`, `NODE_OPTIONS`).
 */
export function jitBudgetFlags(v8Version: string, execArgv: readonly string[], nodeOptions: string | undefined): { raise: string; restore: string } | undefined {
  if (!v8Version.startsWith(MEASURED_V8)) return undefined;
  const given = [...execArgv, ...(nodeOptions ?? '').split(/\s+/)];
  if (given.some((arg) => /^--interrupt[-_]budget(=|$)/.test(arg))) return undefined;
  return { raise: `--interrupt-budget=${STARTUP_BUDGET}`, restore: `--interrupt-budget=${DEFAULT_BUDGET}` };
}

/** The flag that restores the budget, while it is raised. */
let restore: string | undefined;

/** Raises the budget for the start-up of a scoring run (see above); restoreJitBudget undoes it. */
export function raiseJitBudget(): void {
  if (restore !== undefined) return;
  const flags = jitBudgetFlags(process.versions.v8, process.execArgv, process.env.NODE_OPTIONS);
  if (flags === undefined) return;
  setFlagsFromString(flags.raise);
  restore = flags.restore;
}

/** Restores V8's default budget if raiseJitBudget raised it; safe to call more than once. */
export function restoreJitBudget(): void {
  if (restore === undefined) return;
  setFlagsFromString(restore);
  restore = undefined;
}
