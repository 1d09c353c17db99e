import type { Command } from 'commander';
import { exitCodeFor, LexichronError } from '../errors.js';
import { TOOL_VERSION } from '../version.js';
import { diagnosticText, ERROR_MAX_CHARS } from '../privacy/diagnostic-text.js';
import { readCoreModel } from '../io/read-core-model.js';
import { provideCoreModel } from '../text/core-model.js';
/** Each command file exports a function that adds its command to the program. */
type Register = (program: Command) => void;

/**
 * The commands, in help order, each loaded only when needed: a run of one command imports
 * that command's code alone (start-up stays short), while help and unknown commands load all.
 */
const COMMANDS: ReadonlyArray<[string, () => Promise<Register>]> = [
  ['run', async () => (await import('./run.js')).registerRun],
  ['score', async () => (await import('./score.js')).registerScore],
  ['series', async () => (await import('./series.js')).registerSeries],
  ['validate', async () => (await import('./validate.js')).registerValidate],
  ['dynamics', async () => (await import('./dynamics.js')).registerDynamics],
  ['terms', async () => (await import('./terms.js')).registerTerms],
  ['import', async () => (await import('./import.js')).registerImport],
  ['merge', async () => (await import('./merge.js')).registerMerge],
  ['forget', async () => (await import('./forget.js')).registerForget],
  ['report', async () => (await import('./report.js')).registerReport],
  ['lexicons', async () => (await import('./lexicons.js')).registerLexicons],
];

/** Arguments that need no command registered (the version alone is printed). */
const VERSION_FLAGS = new Set(['--version', '-V']);

/** Builds the commander program; with `only`, registers just that command when it exists (none for --version). */
export async function buildProgram(only?: string): Promise<Command> {
  const { Command } = await import('commander');
  const program = new Command('lexichron')
    .description('Per-person affect time series from timestamped text, validated against self-reports.')
    .version(TOOL_VERSION)
    .showHelpAfterError('(run with --help for the options)')
    .exitOverride();
  if (only !== undefined && VERSION_FLAGS.has(only)) return program;
  const chosen = COMMANDS.filter(([name]) => name === only);
  for (const [, load] of chosen.length > 0 ? chosen : COMMANDS) (await load())(program);
  return program;
}

/** Runs the command line; returns the exit code (0 ok, 1 internal, 2 usage, 3 bad input data). */
export async function main(argv: string[]): Promise<number> {
  // A scoring run starts its scoring thread first thing (it loads wink-nlp's model while the
  // rest of the start-up happens; commander is imported only after it for that reason).
  provideCoreModel(readCoreModel);
  const scoring = argv[2] === 'score' || argv[2] === 'run';
  const scorePool = scoring ? await import('../io/score-pool.js') : undefined;
  scorePool?.prestartScoreWorker();
  try {
    const program = await buildProgram(argv[2]);
    await program.parseAsync(argv);
    return typeof process.exitCode === 'number' ? process.exitCode : 0;
  } catch (error) {
    const { CommanderError } = await import('commander');
    if (error instanceof CommanderError) {
      if (error.exitCode === 0) return 0;
      return 2;
    }
    if (error instanceof LexichronError) {
      process.stderr.write(`lexichron: ${diagnosticText(error.message, ERROR_MAX_CHARS, true)}\n`);
      return exitCodeFor(error);
    }
    process.stderr.write(`lexichron: internal error, please report it with the command you ran: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    return 1;
  } finally {
    await scorePool?.releasePrestartedWorker();
  }
}
