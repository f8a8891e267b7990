// One smoke test of the built binary (CI builds before testing): `node dist/quern.cjs period …`.
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const main = fileURLToPath(new URL('../../dist/quern.cjs', import.meta.url));

describe('dist/quern.cjs period', () => {
  it.skipIf(!existsSync(main))('prints FY2024-Q1 as JSON from the built binary (31 U.S.C. §1102: FY2024 starts 2023-10-01)', () => {
    const out = execFileSync(process.execPath, [main, 'period', 'FY2024-Q1', '--json'], { encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
    expect(JSON.parse(out)).toMatchObject({ label: 'FY2024-Q1', start: '2023-10-01T00:00:00+00:00', end: '2024-01-01T00:00:00+00:00' });
  });
});
