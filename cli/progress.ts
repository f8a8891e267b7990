// A progress bar on stderr while a big input is read: bytes, rows and rate, drawn by cli-progress.
// Silent unless stderr is a terminal and the input is over a few megabytes; updates are throttled so
// the reading loop pays one clock read per callback at most.
import { createRequire } from 'node:module';
import type cliProgress from 'cli-progress';
import type { CliIO } from './io.js';

/** Inputs smaller than this read too fast for a bar to help (4 MiB). */
export const PROGRESS_MIN_BYTES = 4 * 1024 * 1024;
/** Redraws at most this often (ms). */
const REDRAW_MS = 100;

/** The callback handed to openTable's `onProgress`, plus `stop()` to clear the bar when reading ends. */
export interface Progress {
  /** Reports progress (the shape of openTable's `onProgress`); an absent or ≤ 0 total means unknown size (standard input). */
  onProgress(bytesRead: number, totalBytes: number | undefined, rowsRead?: number): void;
  /** Removes the bar; safe to call twice and when nothing was drawn. Call it in a `finally`. */
  stop(): void;
  /** True when a bar may be drawn at all (stderr is a terminal). */
  readonly active: boolean;
}

export interface ProgressOptions {
  /** Bytes below which nothing is drawn; default PROGRESS_MIN_BYTES. */
  minBytes?: number;
  /** Clock for tests; default Date.now. */
  now?: () => number;
  /** Label before the bar, e.g. the file name. */
  label?: string;
}

/** Formats a byte count in binary units (KiB, MiB, GiB — IEC 80000-13). */
export function formatBytes(bytes: number): string {
  const units = ['B', 'KiB', 'MiB', 'GiB', 'TiB'];
  let v = bytes;
  let i = 0;
  while (v >= 1024 && i < units.length - 1) {
    v /= 1024;
    i++;
  }
  return i === 0 ? `${v} B` : `${v.toFixed(v < 10 ? 1 : 0)} ${units[i]}`;
}

function groupDigits(n: number): string {
  return String(Math.round(n)).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

interface Payload {
  label: string;
  known: boolean;
  rows: number | undefined;
  bytes: number;
  total: number;
  start: number;
  now: () => number;
}

/** The line cli-progress draws: "visits.csv ███░░░ 42% 12.0 MiB of 28 MiB · 154,000 rows · 9.1 MiB/s". */
function formatLine(options: cliProgress.Options, params: cliProgress.Params, payload: Payload): string {
  const seconds = Math.max(0.001, (payload.now() - payload.start) / 1000);
  const rate = `${formatBytes(payload.bytes / seconds)}/s`;
  const rows = payload.rows === undefined ? '' : ` · ${groupDigits(payload.rows)} rows`;
  const label = payload.label ? `${payload.label} ` : '';
  if (!payload.known) return `${label}${formatBytes(payload.bytes)} read${rows} · ${rate}`;
  const bar = progressLibrary().Format.BarFormat(params.progress, options);
  const pct = `${Math.floor(params.progress * 100)}%`.padStart(4);
  return `${label}${bar} ${pct} ${formatBytes(payload.bytes)} of ${formatBytes(payload.total)}${rows} · ${rate}`;
}

/**
 * cli-progress, loaded when a bar is first drawn: it loads Node's readline, which a run with no bar (not a
 * terminal, or a small input) then never pays for.
 */
let library: typeof cliProgress | undefined;
function progressLibrary(): typeof cliProgress {
  return (library ??= createRequire(import.meta.url)('cli-progress') as typeof cliProgress);
}

/** A bar whose redraw timer never keeps the process alive, so a read that throws cannot hang the CLI. */
function unrefBar(options: cliProgress.Options): cliProgress.SingleBar {
  const bar = new (progressLibrary().SingleBar)(options);
  const render = bar.render.bind(bar);
  bar.render = (): void => {
    render();
    (bar as unknown as { timer?: { unref?: () => void } }).timer?.unref?.();
  };
  return bar;
}

const SILENT: Progress = { onProgress: () => {}, stop: () => {}, active: false };

/**
 * Builds the progress callback for one input; `totalBytes` may be left out (or ≤ 0) when the size is known
 * only to the reader, which then passes it with each call. Draws only when io.stderr is a terminal, and
 * only for inputs over `minBytes` (for inputs of unknown size, once that much has been read).
 */
export function makeProgress(io: CliIO, totalBytes?: number, options: ProgressOptions = {}): Progress {
  if (io.stderr.isTTY !== true) return SILENT;
  const minBytes = options.minBytes ?? PROGRESS_MIN_BYTES;
  const now = options.now ?? Date.now;
  const sized = (n: number | undefined): n is number => n !== undefined && Number.isFinite(n) && n > 0;
  if (sized(totalBytes) && totalBytes < minBytes) return SILENT;
  let bar: cliProgress.SingleBar | undefined;
  let last = -Infinity;
  let stopped = false;
  const payload: Payload = { label: options.label ?? '', known: false, rows: undefined, bytes: 0, total: 0, start: now(), now };
  return {
    active: true,
    onProgress(bytesRead, total, rowsRead) {
      if (stopped) return;
      const t = now();
      if (t - last < REDRAW_MS) return;
      last = t;
      payload.bytes = bytesRead;
      payload.rows = rowsRead;
      if (bar === undefined) {
        const size = sized(totalBytes) ? totalBytes : sized(total) ? total : undefined;
        if (size !== undefined ? size < minBytes : bytesRead < minBytes) return;
        payload.known = size !== undefined;
        payload.total = size ?? 0;
        bar = unrefBar({
          stream: io.stderr as unknown as NodeJS.WritableStream,
          format: formatLine as unknown as cliProgress.Options['format'],
          fps: 1000 / REDRAW_MS,
          barsize: 24,
          barCompleteChar: '█',
          barIncompleteChar: '░',
          clearOnComplete: true,
          hideCursor: false,
          linewrap: false,
        });
        bar.start(payload.known ? payload.total : 1, payload.known ? bytesRead : 0, payload);
        return;
      }
      bar.update(payload.known ? bytesRead : 0, payload);
      bar.render(); // already throttled above; draw now rather than on the next timer tick
    },
    stop() {
      if (stopped) return;
      stopped = true;
      bar?.stop();
    },
  };
}
