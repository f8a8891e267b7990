// `--from` and `--until` as typed on a command line: any time value quern reads, placed in the zone.
import { parseTimeText } from '../time/text.js';
import { getZone } from '../time/zone.js';

/**
 * The instant a typed time value names in `zone`: an instant as written; a wall-clock reading or the
 * first moment of a period (a date, a week label, a month) under quern's local-time rule. The period
 * holding that instant is the first (`--from`) or last (`--until`) one included.
 * Throws QuernError 'E_VALUE' for text that is not a time value.
 */
export function boundInstant(text: string, zone: string): number {
  const t = parseTimeText(text);
  if (t.kind === 'instant') return t.ms;
  return getZone(zone).fromWall(t.ms);
}
