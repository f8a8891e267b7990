#!/usr/bin/env node
// Part of `npm run build`: bundles the compiled CLI (dist/cli/main.js, every command and the packages it
// uses) into one file, dist/quern.js, the `quern` binary. Node then reads one module instead of a few
// hundred: start-up measured 0.27 -> 0.21 s for a one-row rebin, 0.55 -> 0.21 s for --version
// (test/bench/run.mjs times whole runs through it). The worker threads get bundles of their own in
// dist/workers. Every `import.meta.url` in a bundle is rewritten to the URL of the file it came from, so
// the URLs built from it (worker files, range task modules) name the same files as before.
import { build } from 'esbuild';
import { readFile } from 'node:fs/promises';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const outfile = join(root, 'dist', 'quern.js');

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

async function bundle(entry, outfile) {
  await build({
    entryPoints: [entry],
    outfile,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    plugins: [moduleUrls(outfile)],
    logLevel: 'warning',
    // Packages written as CommonJS call require(); an ES module bundle has none of its own.
    banner: { js: "import { createRequire as __quernRequire } from 'node:module'; const require = __quernRequire(import.meta.url);" },
  });
}

await bundle(join(root, 'dist', 'cli', 'main.js'), outfile);
// The worker threads, one file each: src/parallel/workers.ts and src/profile/split.ts start these when they
// are there. A worker of the compiled modules took 0.15-0.16 s to load, a bundled one 0.09 s.
await bundle(join(root, 'dist', 'cli', 'range-worker.js'), join(root, 'dist', 'workers', 'range-worker.js'));
await bundle(join(root, 'dist', 'src', 'profile', 'column-worker.js'), join(root, 'dist', 'workers', 'column-worker.js'));
