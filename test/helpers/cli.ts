// Runs the CLI in-process through run(), capturing its output.
import { Readable } from 'node:stream';
import { run } from '../../cli/program.js';

export interface CliResult {
  status: number;
  stdout: string;
  stderr: string;
}

export interface CliRunOptions {
  stdin?: string | Buffer;
  env?: Record<string, string | undefined>;
  tty?: boolean;
  cwd?: string;
}

/** Runs `quern ...argv` in this process and returns its exit status and captured output. */
export async function runCli(argv: string[], options: CliRunOptions = {}): Promise<CliResult> {
  let stdout = '';
  let stderr = '';
  const tty = options.tty ?? false;
  const status = await run(argv, {
    stdout: { write: (s: string) => { stdout += s; return true; }, isTTY: tty, columns: 100 },
    stderr: { write: (s: string) => { stderr += s; return true; }, isTTY: tty, columns: 100 },
    stdin: Readable.from(options.stdin === undefined ? [] : [Buffer.from(options.stdin)]),
    env: options.env ?? {},
    cwd: options.cwd ?? process.cwd(),
  });
  return { status, stdout, stderr };
}
