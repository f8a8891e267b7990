import { describe, expect, it } from 'vitest';
import { runCli } from './helpers/cli.js';

describe('run(argv, io)', () => {
  it('prints help with the cautions and exits 0', async () => {
    const r = await runCli(['--help']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('Usage: quern');
    expect(r.stdout).toContain('reporting authority');
  });

  it('exits 2 on an unknown command, with a one-line error', async () => {
    const r = await runCli(['no-such-command']);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/unknown command/);
    expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
  });
});
