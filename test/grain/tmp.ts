// Fresh file names in one temporary folder of the system for the generated inputs of grain tests.
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const dir = mkdtempSync(join(tmpdir(), 'quern-grain-bytes-'));
let n = 0;

/** A new file name in the folder, with the extension `ext`. */
export function tmpFile(ext: string): string {
  return join(dir, `f${++n}.${ext}`);
}
