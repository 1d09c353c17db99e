import { Command, CommanderError } from 'commander';
import { exitCodeFor, LexichronError } from '../errors.js';
import { TOOL_VERSION } from '../version.js';
import { registerLexicons } from './lexicons.js';
import { registerScore } from './score.js';
import { registerSeries } from './series.js';
import { registerDynamics } from './dynamics.js';
import { registerRun } from './run.js';
import { registerImport } from './import.js';
import { registerForget } from './forget.js';
import { registerValidate } from './validate.js';
import { registerReport } from './report.js';
import { registerTerms } from './terms.js';

/** Each command file exports a function that adds its command to the program. */
type Register = (program: Command) => void;

const commands: Register[] = [registerRun, registerScore, registerSeries, registerValidate, registerLexicons, registerDynamics, registerImport, registerForget, registerReport, registerTerms];

/** Builds the commander program with every command registered. */
export function buildProgram(): Command {
  const program = new Command('lexichron')
    .description('Per-person affect time series from timestamped text, validated against self-reports.')
    .version(TOOL_VERSION)
    .showHelpAfterError('(run with --help for the options)')
    .exitOverride();
  for (const register of commands) register(program);
  return program;
}

/** Runs the command line; returns the exit code (0 ok, 1 internal, 2 usage, 3 bad input data). */
export async function main(argv: string[]): Promise<number> {
  const program = buildProgram();
  try {
    await program.parseAsync(argv);
    return typeof process.exitCode === 'number' ? process.exitCode : 0;
  } catch (error) {
    if (error instanceof CommanderError) {
      if (error.exitCode === 0) return 0;
      return 2;
    }
    if (error instanceof LexichronError) {
      process.stderr.write(`lexichron: ${error.message}\n`);
      return exitCodeFor(error);
    }
    process.stderr.write(`lexichron: internal error, please report it with the command you ran: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    return 1;
  }
}
