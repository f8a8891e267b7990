// The entry module of a range worker thread run from the compiled modules (the binary has its own bundle).
import { serveRanges } from './worker.js';

await serveRanges();
