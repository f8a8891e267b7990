// The one table from error codes to exit statuses (documented in README "Exit codes").
import type { ErrorCode } from '../src/index.js';

export const EXIT_OK = 0;
/** `--check` found gaps, duplicates, overlaps or holes. */
export const EXIT_FOUND = 1;
export const EXIT_USAGE = 2;
export const EXIT_INPUT = 3;
export const EXIT_OUTPUT = 4;
export const EXIT_INTERNAL = 70;

const statusByCode: Record<ErrorCode, number> = {
  E_USAGE: EXIT_USAGE,
  E_UNIT: EXIT_USAGE,
  E_ZONE: EXIT_USAGE,
  E_LABEL: EXIT_USAGE,
  E_VALUE: EXIT_USAGE,
  E_FILE: EXIT_INPUT,
  E_HEADER: EXIT_INPUT,
  E_COLUMN: EXIT_INPUT,
  E_FORMAT: EXIT_INPUT,
  E_DATA: EXIT_INPUT,
  E_POLICY: EXIT_INPUT,
  E_OUTPUT: EXIT_OUTPUT,
  E_INTERNAL: EXIT_INTERNAL,
};

export function exitStatusFor(code: ErrorCode): number {
  return statusByCode[code];
}
