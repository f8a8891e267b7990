// The start of the binary (dist/quern.cjs) and of its worker threads (dist/workers/*.cjs): runs the bundle
// with this file's name and the extension .bundle.cjs, through the code cache beside it (see
// code-cache.ts). Built as CommonJS, like the bundles: Node starts a CommonJS file without setting up its
// ES module loader, 5-9 ms sooner for the binary (a one-row rebin and --version, 40 runs each,
// interleaved) and about 8 ms sooner for a worker thread (a one-line worker file each way).
import { readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { bundlePathOf, cachePathOf, compileBundle } from './code-cache.js';

const file = bundlePathOf(fileURLToPath(import.meta.url));
let cached: Buffer | undefined;
try {
  cached = readFileSync(cachePathOf(file));
} catch {
  cached = undefined; // no cache (a build that made none): the bundle is compiled as usual
}
const { script } = compileBundle(file, cached);
// The build's training run (cli/bundle.mjs): the cache written at exit holds every function this run
// compiled, not only the bundle's top level, and made a one-row rebin start about 15 ms sooner still.
const trainOut = process.env['QUERN_CODE_CACHE_OUT'];
if (trainOut !== undefined && trainOut !== '') process.once('exit', () => writeFileSync(trainOut, script.createCachedData()));
const wrapped = script.runInThisContext() as (exports: object, require: NodeJS.Require, module: object, filename: string, dir: string) => void;
const module = { exports: {} };
wrapped.call(module.exports, module.exports, createRequire(file), module, file, dirname(file));
