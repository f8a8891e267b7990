// `--report FILE.html` for every analysing command: one option, one call after the result is computed.
// The page is written atomically (a temporary file renamed over the target) through the table output.
import type { Command } from 'commander';
import { QuernError } from '../src/errors.js';
import { openOutput } from '../src/table/index.js';
import type { CliIO } from './io.js';

/** Help of the `--report <file.html>` option, the same on every command. */
export const REPORT_HELP = 'also write an HTML report of the result: one self-contained, offline, printable file';

/** Adds `--report <file.html>` to a command. */
export function addReportOption(command: Command): Command {
  return command.option('--report <file.html>', REPORT_HELP);
}

/** Writes the page made by `render` to `path` when the option was given; nothing otherwise. */
export async function writeReport(path: string | undefined, render: () => string | Promise<string>, io: CliIO): Promise<void> {
  if (path === undefined) return;
  if (path === '-' || path.trim() === '') {
    throw new QuernError('E_USAGE', '--report needs a file name', 'give --report report.html; standard output keeps the command\'s own output');
  }
  const out = await openOutput(path, { cwd: io.cwd });
  try {
    await out.write(await render());
    await out.commit();
  } catch (e) {
    await out.abort();
    throw e;
  }
}
