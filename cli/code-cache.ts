// How a bundle of the binary is run through V8's code cache: cli/bundle.mjs writes each bundle as a
// CommonJS file (<name>.bundle.cjs) and, beside it, the cache V8 made when compiling it
// (<name>.bundle.cache); the launcher <name>.cjs (cli/launch.ts) compiles the same wrapped text with that
// cache. V8 then skips parsing the bundle at every start: a one-row rebin took 0.21 s, 0.175 s with the
// cache (30 runs each, interleaved). V8 rejects a cache made by another Node version or under other V8
// flags, and the bundle is then compiled as usual.
import { readFileSync } from 'node:fs';
import vm from 'node:vm';

/** The function a bundle's text is wrapped in, as Node wraps a CommonJS module. */
const HEAD = '(function (exports, require, module, __filename, __dirname) { ';
const TAIL = '\n})';

/** The bundle a launcher runs: the launcher's path with .bundle.cjs for .cjs. */
export function bundlePathOf(launcher: string): string {
  return launcher.replace(/\.cjs$/, '.bundle.cjs');
}

/** The path of the cache beside the bundle `file` (a .cjs file). */
export function cachePathOf(file: string): string {
  return file.replace(/\.cjs$/, '.cache');
}

/** The bundle `file` read and compiled, with `cachedData` when given; `rejected` says V8 refused that cache. */
export function compileBundle(file: string, cachedData?: Buffer): { script: vm.Script; rejected: boolean } {
  // UTF-8: esbuild escapes non-ASCII text in strings, but not in regular expressions (/inf|∞/).
  const body = readFileSync(file, 'utf8');
  // A hashbang (kept by esbuild from cli/main.ts) is allowed only at the very start of a script.
  const text = HEAD + (body.startsWith('#!') ? `//${body.slice(2)}` : body) + TAIL;
  // Node 20.19+ (older ones lack the constant; import() in the bundle then fails, and nothing needs it).
  const dynamicImport = (vm.constants as Partial<typeof vm.constants> | undefined)?.USE_MAIN_CONTEXT_DEFAULT_LOADER;
  const script = new vm.Script(text, {
    filename: file,
    ...(cachedData !== undefined ? { cachedData } : {}),
    // import() inside the bundle (a range task named by URL) resolves as in any module of the main context.
    ...(dynamicImport !== undefined ? { importModuleDynamically: dynamicImport } : {}),
  });
  return { script, rejected: cachedData !== undefined && script.cachedDataRejected === true };
}
