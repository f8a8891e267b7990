// Zone names as people write them: IANA names, fixed offsets, and the nearest known name for a typo.
import { IANAZone } from 'luxon';

/** The IANA name as written (with its canonical letter case), or null when the platform does not know it. */
export function ianaName(text: string): string | null {
  if (!/^[A-Za-z]/.test(text) || !IANAZone.isValidZone(text)) return null;
  try {
    const resolved = new Intl.DateTimeFormat('en-US', { timeZone: text }).resolvedOptions().timeZone;
    return resolved.toLowerCase() === text.toLowerCase() ? resolved : text;
  } catch {
    return null;
  }
}

/** Parses '+05:30', '-0300', '+05', 'UTC+5:30' to milliseconds; null when the text is not an offset. */
export function parseFixedOffset(text: string): number | null {
  const m = /^(?:utc|gmt)?([+\u2212-])(\d{1,2})(?::?(\d{2}))?$/i.exec(text);
  if (!m) return null;
  const hours = Number(m[2]);
  const minutes = m[3] === undefined ? 0 : Number(m[3]);
  if (hours > 18 || minutes > 59 || (hours === 18 && minutes > 0)) return null;
  const sign = m[1] === '+' ? 1 : -1;
  return sign * (hours * 60 + minutes) * 60_000;
}

/** Formats an offset in minutes as ±HH:MM (±HH:MM:SS when it has seconds, as RFC 9557 allows). */
export function formatOffset(minutes: number): string {
  const totalSeconds = Math.round(Math.abs(minutes) * 60);
  const sign = minutes < 0 && totalSeconds > 0 ? '-' : '+';
  const h = Math.floor(totalSeconds / 3600);
  const m = Math.floor((totalSeconds % 3600) / 60);
  const s = totalSeconds % 60;
  const base = `${sign}${pad2(h)}:${pad2(m)}`;
  return s === 0 ? base : `${base}:${pad2(s)}`;
}

function pad2(n: number): string {
  return n < 10 ? `0${n}` : String(n);
}

export function nearestZoneName(text: string): string | null {
  const lower = text.toLowerCase();
  if (lower.length < 3) return null;
  let best: string | null = null;
  let bestDistance = Math.max(2, Math.floor(lower.length / 4)) + 1;
  for (const candidate of Intl.supportedValuesOf('timeZone')) {
    const d = editDistance(lower, candidate.toLowerCase(), bestDistance);
    if (d < bestDistance) {
      best = candidate;
      bestDistance = d;
    }
  }
  return best;
}

function editDistance(a: string, b: string, limit: number): number {
  if (Math.abs(a.length - b.length) >= limit) return limit;
  let prev = Array.from({ length: b.length + 1 }, (_, i) => i);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++) {
      cur[j] = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + (a[i - 1] === b[j - 1] ? 0 : 1));
    }
    prev = cur;
  }
  return prev[b.length]!;
}

