// openOutput on a target that is not a regular file: written in place, never replaced by a rename.
import { statSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { openOutput } from '../../src/table/output.js';

describe('openOutput(device)', () => {
  // POSIX: /dev/null is a character special file that discards what is written (common practice).
  it.runIf(process.platform !== 'win32')('openOutput("/dev/null") writes in place and leaves the character device', async () => {
    const out = await openOutput('/dev/null');
    await out.write('a,b\n1,2\n'.repeat(20_000));
    await out.commit();
    expect(statSync('/dev/null').isCharacterDevice()).toBe(true);
    const again = await openOutput('/dev/null');
    await again.write('x');
    await again.abort();
    expect(statSync('/dev/null').isCharacterDevice()).toBe(true);
  });
});
