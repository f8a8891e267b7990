// Every regular expression in src/ and cli/ is checked for catastrophic backtracking (ReDoS). Patterns are
// found two ways: regex literals by scanning the TypeScript syntax tree of each file, and patterns built
// with `new RegExp(…)` by recording the constructor's calls while every module loads (each call site found
// in the syntax tree must be matched by a recorded pattern). Each pattern goes to the recheck analyser
// (automata theory and fuzzing; pure-JS backend, time-capped) and then meets long adversarial strings under
// a time bound. A flagged pattern fails the test with its file and line.
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import ts from 'typescript';
import { afterAll, describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const RealRegExp = RegExp;

interface Pattern { source: string; flags: string; where: string }

function tsFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = join(dir, e.name);
    return e.isDirectory() ? tsFiles(p) : e.name.endsWith('.ts') && !e.name.endsWith('.d.ts') ? [p] : [];
  });
}
const FILES = [...tsFiles(join(ROOT, 'src')), ...tsFiles(join(ROOT, 'cli'))];
const rel = (p: string) => relative(ROOT, p).split('\\').join('/');

/** Regex literals and RegExp call sites of one file, from its syntax tree. */
function scan(file: string): { literals: Pattern[]; calls: string[] } {
  const sf = ts.createSourceFile(file, readFileSync(file, 'utf8'), ts.ScriptTarget.ES2022, true);
  const literals: Pattern[] = [];
  const calls: string[] = [];
  const where = (n: ts.Node) => `${rel(file)}:${sf.getLineAndCharacterOfPosition(n.getStart(sf)).line + 1}`;
  const visit = (n: ts.Node): void => {
    if (n.kind === ts.SyntaxKind.RegularExpressionLiteral) {
      const text = n.getText(sf);
      const end = text.lastIndexOf('/');
      literals.push({ source: text.slice(1, end), flags: text.slice(end + 1), where: where(n) });
    } else if ((ts.isNewExpression(n) || ts.isCallExpression(n)) && ts.isIdentifier(n.expression) && n.expression.text === 'RegExp') {
      calls.push(where(n));
    }
    ts.forEachChild(n, visit);
  };
  visit(sf);
  return { literals, calls };
}

/** Loads every module with the RegExp constructor recorded; returns patterns by call site. */
async function recordConstructed(): Promise<{ built: Pattern[]; failed: string[] }> {
  const built: Pattern[] = [];
  const record = (args: unknown[]) => {
    const frame = (new Error().stack ?? '').split('\n').slice(2).find((l) => l.includes(ROOT) && !l.includes('test/redos')) ?? '';
    const m = /\((.*):(\d+):\d+\)$|at (.*):(\d+):\d+$/.exec(frame.trim());
    const file = m ? (m[1] ?? m[3])! : '?';
    const line = m ? (m[2] ?? m[4])! : '?';
    const src = args[0] instanceof RealRegExp ? args[0].source : String(args[0]);
    const flags = args[1] !== undefined ? String(args[1]) : args[0] instanceof RealRegExp ? args[0].flags : '';
    built.push({ source: src, flags, where: `${rel(file.replace(/^file:\/\//, ''))}:${line}` });
  };
  (globalThis as { RegExp: RegExpConstructor }).RegExp = new Proxy(RealRegExp, {
    construct(target, args) { record(args); return Reflect.construct(target, args); },
    apply(target, _this, args) { record(args); return Reflect.apply(target, undefined, args); },
  });
  const failed: string[] = [];
  try {
    // cli/main.ts runs the program on import and cli/launch.ts runs a bundle (its one literal is scanned from
    // its syntax tree with the rest); everything else only defines.
    const runs = [join('cli', 'main.ts'), join('cli', 'launch.ts')];
    for (const f of FILES.filter((f) => !runs.some((r) => f.endsWith(r)))) {
      try {
        await import(pathToFileURL(f).href);
      } catch (e) {
        failed.push(`${rel(f)}: ${(e as Error).message.split('\n')[0]}`);
      }
    }
  } finally {
    (globalThis as { RegExp: RegExpConstructor }).RegExp = RealRegExp;
  }
  return { built, failed };
}

// Flagged by recheck but fed only short strings at their call site: each entry names the bound and why;
// the test replays recheck's attack cut to that length and requires it to stay fast. Keyed by file and
// pattern source, so a changed pattern or a new site is checked afresh.
const BOUNDED: { file: string; source: string; maxLength: number; why: string }[] = [
  { file: 'src/report/terminal.ts', source: String.raw`\B(?=(\d{3})+(?!\d))`, maxLength: 400, why: 'integer part of toFixed(): at most 309 digits (toFixed switches to exponent form at 1e21, ECMA-262 Number.prototype.toFixed)' },
  { file: 'src/report/terminal.ts', source: '0+$', maxLength: 3, why: 'fraction of toFixed(digits <= 3)' },
  { file: 'cli/progress.ts', source: String.raw`\B(?=(\d{3})+(?!\d))`, maxLength: 400, why: 'String(Math.round(byte count))' },
  { file: 'src/table/reference-csv.ts', source: String.raw`[\r\n]+$`, maxLength: 120, why: 'applied to raw.slice(0, 120)' },
];

const literals: Pattern[] = [];
const callSites: string[] = [];
for (const f of FILES) {
  const sc = scan(f);
  literals.push(...sc.literals);
  callSites.push(...sc.calls);
}
const { built, failed: loadFailures } = await recordConstructed();
const unique = (ps: Pattern[]) => [...new Map(ps.map((p) => [`${p.where} /${p.source}/${p.flags}`, p])).values()];
const ALL = unique([...literals, ...built.filter((b) => callSites.includes(b.where))]);
const { check } = await import('recheck');
process.env['RECHECK_BACKEND'] = 'pure'; // the pure-JS analyser: no native binary or Java needed
const tally = { safe: 0, bounded: 0, undecided: 0 };
afterAll(() => console.log(`redos: ${ALL.length} patterns checked by recheck (${literals.length} literals, ${callSites.length} RegExp call sites): ${tally.safe} safe, ${tally.bounded} flagged but fed bounded input, ${tally.undecided} undecided in time (left to the adversarial strings)`));

describe('regular expressions in src/ and cli/', () => {
  it('finds every pattern: each RegExp call site is matched by a pattern recorded while the modules load', () => {
    expect(loadFailures, 'modules that failed to load').toEqual([]);
    const recorded = new Set(built.map((b) => b.where));
    expect(callSites.filter((w) => !recorded.has(w)), 'RegExp call sites never run at load (build them at module level)').toEqual([]);
    expect(literals.length).toBeGreaterThan(20);
  });

  it.each(ALL.map((p) => [`${p.where} /${p.source}/${p.flags}`, p] as const))('recheck: %s is not vulnerable to catastrophic backtracking', async (_name, p) => {
    const r = await check(p.source, p.flags.replace(/[^dgimsuyv]/g, ''), { timeout: 5_000 });
    if (r.status === 'safe') { tally.safe++; return; }
    if (r.status === 'unknown') { tally.undecided++; expect(r.error.kind, p.where).toBe('timeout'); return; }
    const bound = BOUNDED.find((b) => p.where.startsWith(`${b.file}:`) && b.source === p.source);
    expect(bound, `${p.where}: ${r.complexity.type} backtracking, attack ${r.attack.pattern}`).toBeDefined();
    const attack = r.attack.string.slice(0, bound!.maxLength);
    const re = new RealRegExp(p.source, p.flags);
    const t0 = performance.now();
    for (let i = 0; i < 10; i++) { re.lastIndex = 0; re.test(attack); }
    expect((performance.now() - t0) / 10, `${p.where} on its attack cut to ${bound!.maxLength} chars`).toBeLessThan(20);
    tally.bounded++;
  }, 60_000);

  it.each(ALL.map((p) => [`${p.where} /${p.source}/${p.flags}`, p] as const))('%s takes under 250 ms on each long adversarial string', (_name, p) => {
    const units = ['a', '1', '0', ' ', '-', '.', ',', ':', '/', '\t', 'é', '+', 'e', 'Z', 'W', 'T', 'P', '1.', '1,', '1 ', '1-', 'a ', '0:', '"', '""', '\\', 'ab'];
    const bound = BOUNDED.find((b) => p.where.startsWith(`${b.file}:`) && b.source === p.source);
    const n = bound?.maxLength ?? 30_000;
    const re = new RealRegExp(p.source, p.flags);
    for (const u of units) {
      for (const tail of ['', '!', '\u0000']) {
        const text = u.repeat(Math.ceil(n / u.length)).slice(0, n) + tail;
        re.lastIndex = 0;
        const t0 = performance.now();
        re.test(text);
        expect(performance.now() - t0, `${JSON.stringify(u)}×${n}+${JSON.stringify(tail)}`).toBeLessThan(250);
      }
    }
  });
});
