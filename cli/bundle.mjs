#!/usr/bin/env node
// Part of `npm run build`: bundles the compiled CLI (dist/cli/main.js, every command and the packages it
// uses) into one file, dist/quern.js, the `quern` binary. Node then reads one module instead of a few
// hundred: start-up measured 0.27 -> 0.21 s for a one-row rebin, 0.55 -> 0.21 s for --version
// (test/bench/run.mjs times whole runs through it). Worker threads still load the compiled modules in
// dist/src: every `import.meta.url` in the bundle is rewritten to the URL of the file it came from, so
// the URLs built from it (worker entry modules, range tasks) name the same files as before.
import { build } from 'esbuild';
import { readFile } from 'node:fs/promises';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const outfile = join(root, 'dist', 'quern.js');

const moduleUrls = {
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
};

await build({
  entryPoints: [join(root, 'dist', 'cli', 'main.js')],
  outfile,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  plugins: [moduleUrls],
  logLevel: 'warning',
  // Packages written as CommonJS call require(); an ES module bundle has none of its own.
  banner: { js: "import { createRequire as __quernRequire } from 'node:module'; const require = __quernRequire(import.meta.url);" },
});
