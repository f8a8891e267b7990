// A cheap one-off reading of a zone's offset through Intl (ECMA-402 'longOffset' names), used only to rule
// zones out before the exact transition tables of src/time/zone.ts confirm the few that remain. Building an
// exact table costs milliseconds per zone; ruling out ~400 zones this way costs about as much in total.

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterOf(zone: string): Intl.DateTimeFormat {
  let f = formatters.get(zone);
  if (f === undefined) {
    f = new Intl.DateTimeFormat('en-US', { timeZone: zone, timeZoneName: 'longOffset', year: 'numeric' });
    formatters.set(zone, f);
  }
  return f;
}

/** Offset of `zone` at instant `ms` in milliseconds, from its Intl name ("GMT-05:00", "GMT+05:45", "GMT"). */
export function probeOffsetMs(zone: string, ms: number): number {
  const text = formatterOf(zone).format(ms);
  const m = /GMT([+-\u2212])(\d{2}):(\d{2})(?::(\d{2}))?/.exec(text);
  if (m === null) return 0; // "GMT" alone: offset zero
  const sign = m[1] === '+' ? 1 : -1;
  return sign * ((Number(m[2]) * 60 + Number(m[3])) * 60 + Number(m[4] ?? 0)) * 1000;
}
