// The commander program, testable in-process: run(argv, io) resolves to an exit status.
import { Command, CommanderError } from 'commander';
import { isQuernError } from '../src/errors.js';
import { terminalSafe } from '../src/report/terminal.js';
import type { CliIO } from './io.js';
import { EXIT_INTERNAL, EXIT_OK, EXIT_USAGE, exitStatusFor } from './exit.js';
import { loadCommands, type RegisterCommand } from './commands/index.js';

/** State shared by the actions of one run. */
export interface CommandContext {
  io: CliIO;
  /** An action sets a non-zero status this way (e.g. --check found problems). */
  setExit(status: number): void;
}

export const CAUTION =
  'Week, epidemiological-week and fiscal-year conventions differ between authorities: confirm against your ' +
  "reporting authority's calendar. Small counts may need suppression under local privacy rules. quern does " +
  "not replace a qualified analyst's judgement.";

/** Builds the program with the given commands (see `loadCommands`); exported for tests that inspect help text. */
export function buildProgram(ctx: CommandContext, commands: readonly RegisterCommand[]): Command {
  const program = new Command('quern');
  program
    .description('Get a table\'s time and number columns right before anyone charts them.')
    .version('0.1.0', '-V, --version')
    .showSuggestionAfterError(true)
    .exitOverride()
    .configureOutput({
      writeOut: (s) => ctx.io.stdout.write(s),
      writeErr: (s) => ctx.io.stderr.write(s),
      outputError: (s, write) => write(s),
    })
    .addHelpText('after', `\nCautions: ${CAUTION}\n`);
  for (const register of commands) register(program, ctx);
  for (const sub of program.commands) {
    sub.exitOverride().configureOutput({
      writeOut: (s) => ctx.io.stdout.write(s),
      writeErr: (s) => ctx.io.stderr.write(s),
    });
  }
  return program;
}

/** Runs quern with `argv` (without node and script), returning the exit status; never throws. */
export async function run(argv: readonly string[], io: CliIO): Promise<number> {
  let status = EXIT_OK;
  const ctx: CommandContext = { io, setExit: (s) => { status = Math.max(status, s); } };
  let program: Command;
  try {
    program = buildProgram(ctx, await loadCommands(argv));
  } catch (e) {
    io.stderr.write(`quern: internal error: ${terminalSafe(e instanceof Error ? e.message : String(e))}\n`);
    return EXIT_INTERNAL;
  }
  try {
    await program.parseAsync([...argv], { from: 'user' });
    return status;
  } catch (e) {
    if (e instanceof CommanderError) {
      if (e.code === 'commander.helpDisplayed' || e.code === 'commander.version' || e.code === 'commander.help') {
        return EXIT_OK;
      }
      return e.exitCode === 0 ? EXIT_OK : EXIT_USAGE;
    }
    if (isQuernError(e)) {
      // A message may quote a file name or a value from the data: never let it drive the terminal.
      io.stderr.write(`quern: ${terminalSafe(e.message)}\n`);
      if (e.hint) io.stderr.write(`hint: ${terminalSafe(e.hint)}\n`);
      return exitStatusFor(e.code);
    }
    if (isBrokenPipe(e)) return status;
    const msg = e instanceof Error ? e.message : String(e);
    io.stderr.write(`quern: internal error: ${terminalSafe(msg)}\n`);
    io.stderr.write('hint: this is a bug in quern; please report it with the command you ran.\n');
    return EXIT_INTERNAL;
  }
}

function isBrokenPipe(e: unknown): boolean {
  return typeof e === 'object' && e !== null && (e as { code?: string }).code === 'EPIPE';
}
