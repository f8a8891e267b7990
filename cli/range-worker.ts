// The binary's range worker thread: cli/bundle.mjs bundles it, with every range task the commands split
// over threads, into dist/workers/range-worker.bundle.cjs (run by the launcher range-worker.cjs), one file
// that starts in about half the time of the compiled modules (src/parallel/workers.ts picks it when it is
// there). No top-level await: it is bundled as CommonJS.
import type { RangeTask } from '../src/parallel/index.js';
import { serveRanges } from '../src/parallel/worker.js';
import { bucketRange } from '../src/bins/range-task.js';
import { rebinRange } from '../src/rebin/range-task.js';

void serveRanges({ rebinRange: rebinRange as RangeTask<unknown, unknown>, bucketRange: bucketRange as RangeTask<unknown, unknown> });
