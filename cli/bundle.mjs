#!/usr/bin/env node
// Part of `npm run build`: bundles the compiled CLI (dist/cli/main.js, every command and the packages it
// uses) into one file, the `quern` binary. Node then reads one module instead of a few hundred: start-up
// measured 0.27 -> 0.21 s for a one-row rebin, 0.55 -> 0.21 s for --version (test/bench/run.mjs times
// whole runs through it). The worker threads get bundles of their own in dist/workers. Every
// `import.meta.url` in a bundle is rewritten to the URL of the file it came from, so the URLs built from it
// (worker files, range task modules) name the same files as before.
//
// Each bundle is CommonJS (<name>.bundle.cjs), minified, with the code cache V8 makes when compiling it
// (<name>.bundle.cache); <name>.cjs is the launcher (cli/launch.ts) that runs it through that cache, so
// that no start parses the bundle again: a one-row rebin 0.21 -> 0.175 s (see cli/code-cache.ts).
//
// The build also writes the zone atlas (dist/zone-atlas.bin, src/grain/zone-atlas.ts) that grain and
// profile look zone offsets up in.
import { build } from 'esbuild';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { readFile } from 'node:fs/promises';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { bundlePathOf, cachePathOf, compileBundle } from '../dist/cli/code-cache.js';
import { encodeZoneAtlas, readZoneAtlas } from '../dist/src/grain/zone-atlas.js';
import { intlOffsetMs } from '../dist/src/grain/zone-probe.js';
import { candidateZoneNames } from '../dist/src/grain/zone-names.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

/** Rewrites `import.meta.url` in each bundled module to the URL of the file it came from, seen from `outfile`. */
const moduleUrls = (outfile) => ({
  name: 'module-urls',
  setup(b) {
    b.onLoad({ filter: /[\\/]dist[\\/].*\.js$/ }, async (args) => {
      let text = await readFile(args.path, 'utf8');
      if (text.includes('import.meta.url')) {
        const rel = relative(dirname(outfile), args.path).split('\\').join('/');
        text = text.replaceAll('import.meta.url', `new URL(${JSON.stringify(`./${rel}`)}, import.meta.url).href`);
      }
      return { contents: text, loader: 'js' };
    });
  },
});

/** Strict mode, and `__quernUrl` (what `import.meta.url` becomes in CommonJS output): the file's own URL. */
const URL_BANNER = '"use strict";var __quernUrl=require("node:url").pathToFileURL(__filename).href;';

/**
 * What the bundles and their launchers share: CommonJS for Node 20. ES modules are strict, and so is their
 * bundle; `import.meta.url` is the file's own URL where the moduleUrls plugin does not rewrite it.
 */
const COMMONJS = {
  bundle: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  logLevel: 'warning',
  define: { 'import.meta.url': '__quernUrl' },
};

/** Bundles `entry` into `<name>.bundle.cjs` with its code cache, and writes the launcher `<name>.cjs`. */
async function bundle(entry, launcher, shebang = false) {
  const outfile = bundlePathOf(launcher);
  await build({
    ...COMMONJS,
    entryPoints: [entry],
    outfile,
    minify: true,
    keepNames: true,
    charset: 'ascii',
    plugins: [moduleUrls(outfile)],
    banner: { js: URL_BANNER },
  });
  const { script } = compileBundle(outfile);
  writeFileSync(cachePathOf(outfile), script.createCachedData());
  await build({
    ...COMMONJS,
    entryPoints: [join(root, 'dist', 'cli', 'launch.js')],
    outfile: launcher,
    banner: { js: `${shebang ? '#!/usr/bin/env node\n' : ''}${URL_BANNER}` },
  });
}

/**
 * Runs the binary once on a small table, a rebin by ISO week with a group, a count and a sum, and keeps
 * the code cache it writes at exit (cli/launch.ts): one that holds the functions a run compiles, not only
 * the bundle's top level. Left as it was when the run fails.
 */
async function trainBinary(launcher) {
  const dir = mkdtempSync(join(tmpdir(), 'quern-build-'));
  try {
    const table = join(dir, 'train.csv');
    const rows = ['ts,site,amount'];
    for (let i = 0; i < 500; i++) rows.push(`2024-01-${String(1 + (i % 28)).padStart(2, '0')}T${String(i % 24).padStart(2, '0')}:15:00Z,s${i % 3},${i}.5`);
    writeFileSync(table, rows.join('\n') + '\n');
    const out = join(dir, 'quern.cache');
    const run = spawnSync(process.execPath, [launcher, 'rebin', table, '--time', 'ts', '--unit', 'iso-week', '--by', 'site', '--agg', 'count', '--agg', 'sum:amount'], {
      env: { ...process.env, QUERN_CODE_CACHE_OUT: out, NO_COLOR: '1' }, encoding: 'utf8',
    });
    if (run.status === 0 && existsSync(out)) renameSync(out, cachePathOf(bundlePathOf(launcher)));
    else console.warn(`bundle: the training run failed (status ${run.status}); the code cache holds the top level only\n${run.stderr}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await bundle(join(root, 'dist', 'cli', 'main.js'), join(root, 'dist', 'quern.cjs'), true);
await trainBinary(join(root, 'dist', 'quern.cjs'));
// The worker threads, one file each: src/parallel/workers.ts and src/profile/split.ts start these when they
// are there. A worker of the compiled modules took 0.15-0.16 s to load, a bundled one 0.09 s.
await bundle(join(root, 'dist', 'cli', 'range-worker.js'), join(root, 'dist', 'workers', 'range-worker.cjs'));
await bundle(join(root, 'dist', 'src', 'profile', 'column-worker.js'), join(root, 'dist', 'workers', 'column-worker.cjs'));

/** Years the zone atlas covers; the probe asks Intl itself about instants outside them. */
const ATLAS_FROM = Date.UTC(1970, 0, 1);
const ATLAS_TO = Date.UTC(2040, 0, 1);

/**
 * Reads every candidate zone's offsets over ATLAS_FROM..ATLAS_TO into dist/zone-atlas.bin (about 3 s),
 * which grain and profile read instead of building an Intl formatter per zone in each run (see
 * src/grain/zone-probe.ts). Without it they ask Intl, with the same results.
 */
function writeZoneAtlas() {
  const atlas = readZoneAtlas(candidateZoneNames(), ATLAS_FROM, ATLAS_TO, intlOffsetMs);
  writeFileSync(join(root, 'dist', 'zone-atlas.bin'), encodeZoneAtlas(atlas));
}

writeZoneAtlas();
