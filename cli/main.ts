#!/usr/bin/env node
// The only file that touches `process`: binds the CLI to the real streams and exits with run()'s status.
import { abortOpenOutputsSync } from '../src/table/output.js';
import { run } from './program.js';

// Ctrl-C or a kill: remove any half-written temporary output (--out, --report) and exit as signals do.
for (const [signal, status] of [['SIGINT', 130], ['SIGTERM', 143]] as const) {
  process.once(signal, () => {
    abortOpenOutputsSync();
    process.exit(status);
  });
}

process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  if (e.code === 'EPIPE') process.exit(0);
  throw e;
});

// No top-level await: the binary runs this file from a CommonJS bundle (cli/bundle.mjs).
void run(process.argv.slice(2), {
  stdout: process.stdout,
  stderr: process.stderr,
  stdin: process.stdin,
  env: process.env,
  cwd: process.cwd(),
}).then((status) => {
  process.exitCode = status;
});
