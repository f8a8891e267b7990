// The candidate set of IANA zones, under their current names, and the zone named first when several match.

/**
 * Old names some ICU builds still list, mapped to the names the IANA tz database now uses (its `backward`
 * file; pairs from memory).
 */
const CURRENT_NAME: Record<string, string> = {
  'Africa/Asmera': 'Africa/Asmara',
  'America/Buenos_Aires': 'America/Argentina/Buenos_Aires',
  'America/Catamarca': 'America/Argentina/Catamarca',
  'America/Coral_Harbour': 'America/Atikokan',
  'America/Cordoba': 'America/Argentina/Cordoba',
  'America/Godthab': 'America/Nuuk',
  'America/Indianapolis': 'America/Indiana/Indianapolis',
  'America/Jujuy': 'America/Argentina/Jujuy',
  'America/Louisville': 'America/Kentucky/Louisville',
  'America/Mendoza': 'America/Argentina/Mendoza',
  'Asia/Calcutta': 'Asia/Kolkata',
  'Asia/Katmandu': 'Asia/Kathmandu',
  'Asia/Rangoon': 'Asia/Yangon',
  'Asia/Saigon': 'Asia/Ho_Chi_Minh',
  'Atlantic/Faeroe': 'Atlantic/Faroe',
  'Europe/Kiev': 'Europe/Kyiv',
  'Pacific/Enderbury': 'Pacific/Kanton',
  'Pacific/Ponape': 'Pacific/Pohnpei',
  'Pacific/Truk': 'Pacific/Chuuk',
};

/** The current IANA name of a zone name (unchanged when it is current already). */
export function currentZoneName(name: string): string {
  return CURRENT_NAME[name] ?? name;
}

let cached: string[] | null = null;

/** Every IANA zone the runtime knows (Intl.supportedValuesOf, ECMA-402), plus UTC, under current names. */
export function candidateZoneNames(): readonly string[] {
  if (cached === null) {
    const names = new Set<string>(['UTC']);
    for (const n of Intl.supportedValuesOf('timeZone')) names.add(n);
    cached = [...names];
  }
  return cached;
}

/**
 * Zones named first when several behave identically over the data: the most widely used zone of each
 * offset pattern (common practice); otherwise the first name alphabetically.
 */
const PREFERRED = [
  'UTC', 'America/New_York', 'America/Chicago', 'America/Denver', 'America/Phoenix', 'America/Los_Angeles',
  'America/Anchorage', 'Pacific/Honolulu', 'America/Halifax', 'America/St_Johns', 'America/Toronto',
  'America/Vancouver', 'America/Mexico_City', 'America/Bogota', 'America/Lima', 'America/Santiago',
  'America/Sao_Paulo', 'America/Argentina/Buenos_Aires', 'America/Havana', 'Europe/London', 'Europe/Dublin',
  'Europe/Lisbon', 'Europe/Paris', 'Europe/Berlin', 'Europe/Madrid', 'Europe/Rome', 'Europe/Athens',
  'Europe/Helsinki', 'Europe/Kyiv', 'Europe/Istanbul', 'Europe/Moscow', 'Africa/Lagos', 'Africa/Cairo',
  'Africa/Johannesburg', 'Africa/Nairobi', 'Asia/Kolkata', 'Asia/Beirut', 'Asia/Jerusalem', 'Asia/Tehran', 'Asia/Dubai',
  'Asia/Karachi', 'Asia/Kathmandu', 'Asia/Dhaka', 'Asia/Bangkok', 'Asia/Jakarta',
  'Asia/Shanghai', 'Asia/Hong_Kong', 'Asia/Singapore', 'Asia/Manila', 'Asia/Tokyo', 'Asia/Seoul',
  'Australia/Perth', 'Australia/Eucla', 'Australia/Adelaide', 'Australia/Darwin', 'Australia/Brisbane',
  'Australia/Sydney', 'Australia/Melbourne', 'Australia/Lord_Howe', 'Pacific/Auckland', 'Pacific/Apia',
];

/** Sorts zones so the one to name comes first: preferred zones in their order, then alphabetically. */
export function byPreference(a: string, b: string): number {
  const ia = PREFERRED.indexOf(a);
  const ib = PREFERRED.indexOf(b);
  if (ia !== ib) return (ia < 0 ? Infinity : ia) - (ib < 0 ? Infinity : ib) || a.localeCompare(b);
  return a.localeCompare(b);
}
