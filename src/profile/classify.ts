// The measurement level and role of one column, from the evidence its accumulator gathered, with the
// reason in a few words. Checks run from the most specific role to the most general.
import { analyseColumn } from '../grain/analyse.js';
import type { ColumnGrain } from '../grain/types.js';
import { grainWords } from '../grain/words.js';
import { tryParseNumericRange } from '../ranges/labels.js';
import type { ProfileColumn } from './column.js';
import { countryCodeKind } from './country-codes.js';
import { matchVocabulary } from './vocabularies.js';
import type { ColumnProfile } from './types.js';

const COUNT_NAME = /(^|[^a-z])(count|counts|n|num|number|cases|deaths|visits|total|totals|sum|qty|quantity|freq|frequency|admissions|births|events|patients|persons|people|population|pop)([^a-z]|$)/i;
const MEASURE_NAME = /(age|minute|mins|second|secs|hour|hrs|days|duration|time|temp|weight|height|length|width|depth|size|score|price|cost|amount|rate|ratio|pct|percent|bmi|dose|speed|distance|kg|mg|ml)/i;
const ID_NAME = /((^|[^a-z])(id|uuid|guid|key)$|^id([^a-z]|$)|(^|[^a-z])(code|zip|zipcode|postcode|postal|fips|geoid|phone)([^a-z]|$))/i;
const LAT_NAME = /^(lat|latitude)$|(^|[^a-z])(lat|latitude)([^a-z]|$)/i;
const LON_NAME = /^(lon|lng|long|longitude)$|(^|[^a-z])(lon|lng|long|longitude)([^a-z]|$)/i;
const YEAR_NAME = /year|yr/i;

const BOOLEAN_SETS = [['true', 'false'], ['yes', 'no'], ['y', 'n'], ['t', 'f']];

function splitName(name: string): string {
  return name.replace(/([a-z])([A-Z])/g, '$1_$2');
}

function base(col: ProfileColumn): Omit<ColumnProfile, 'level' | 'role' | 'reason'> {
  const d = col.distinctCount();
  return { name: col.name, distinct: Math.min(col.values, d.count), distinctExact: d.exact, empty: col.empty, values: col.values, spatial: false };
}

function distinctValues(col: ProfileColumn, limit: number): string[] | null {
  if (!col.distinct.exact || col.distinct.count() > limit) return null;
  return [...col.distinct.counts.keys()];
}

function asBoolean(col: ProfileColumn): string | null {
  const d = distinctValues(col, 2);
  if (d === null || d.length !== 2) return null;
  const lower = d.map((x) => x.trim().toLowerCase()).sort();
  for (const set of BOOLEAN_SETS) if ([...set].sort().join() === lower.join()) return `two values: ${d.join(' / ')}`;
  if (lower.join() === '0,1' && !COUNT_NAME.test(splitName(col.name))) return 'two values: 0 / 1';
  return null;
}

function acceptTime(col: ProfileColumn, g: ColumnGrain): boolean {
  if (g.values.parsed < 0.8 * col.values) return false;
  if (g.format === 'iso-year') {
    const n = col.numeric?.s;
    return YEAR_NAME.test(col.name) || (n !== undefined && n.min >= 1900 && n.max <= 2100);
  }
  return true;
}

function rangeLabels(col: ProfileColumn): string[] | null {
  const d = distinctValues(col, 1000);
  if (d === null || d.length < 2) return null;
  const parsed: Array<[number, number, string]> = [];
  let spans = 0;
  for (const x of d) {
    const r = tryParseNumericRange(x);
    if (r === null) return null;
    const single = r.low !== null && r.high !== null && (r.discrete ? r.high - r.low === 1 : r.low === r.high);
    if (!single) spans++;
    parsed.push([r.low ?? -Infinity, r.high ?? Infinity, x]);
  }
  if (spans < d.length / 2) return null;
  return parsed.sort((a, b) => a[0] - b[0] || a[1] - b[1]).map(([, , x]) => x);
}

function timeReason(g: ColumnGrain): string {
  const what = g.level === 'ordinal' ? 'periods' : 'instants';
  const zone = g.zone !== null ? ` in ${g.zone}` : '';
  const bad = g.values.invalid > 0 ? `; ${g.values.invalid.toLocaleString('en-US')} invalid` : '';
  return `${what}: ${grainWords(g.grain!)}${zone}${bad}`;
}

function span(n: { min: number; max: number }): string {
  return `${n.min.toLocaleString('en-US')}–${n.max.toLocaleString('en-US')}`;
}

function numericRole(col: ProfileColumn): Pick<ColumnProfile, 'level' | 'role' | 'reason'> & { spatial?: boolean } {
  const n = col.numeric!.s;
  const name = splitName(col.name);
  const allIntegers = n.integers === n.numbers;
  if (n.zeroPadded > 0 && n.digitOnly === n.numbers) {
    const width = n.minWidth === n.maxWidth ? `${n.maxWidth}-digit ` : '';
    return { level: 'categorical', role: 'code', reason: `zero-padded ${width}codes (${n.zeroPaddedExample}): labels, not quantities` };
  }
  if (LAT_NAME.test(name) && n.min >= -90 && n.max <= 90) return { level: 'quantitative', role: 'latitude', reason: `named as latitude, values within ±90 (${span(n)})`, spatial: true };
  if (LON_NAME.test(name) && n.min >= -180 && n.max <= 180) return { level: 'quantitative', role: 'longitude', reason: `named as longitude, values within ±180 (${span(n)})`, spatial: true };
  const unique = col.distinct.exact ? col.distinct.count() === col.values : n.stepsOfOne === n.numbers - 1;
  if (allIntegers && unique && n.numbers >= 2 && n.max - n.min + 1 === n.numbers) {
    return { level: 'categorical', role: 'identifier', reason: `unique sequential integers ${span(n)}: they name rows, they do not measure` };
  }
  if (allIntegers && ID_NAME.test(name)) {
    return { level: 'categorical', role: unique ? 'identifier' : 'code', reason: `integers named as ${unique ? 'an identifier' : 'a code'}: labels, not quantities` };
  }
  if (allIntegers && n.negatives === 0) {
    if (MEASURE_NAME.test(name) && !COUNT_NAME.test(name)) return { level: 'quantitative', role: 'measure', reason: `non-negative integers (${span(n)}) named as a measure` };
    return { level: 'quantitative', role: 'count', reason: `non-negative integers (${span(n)}), like counts` };
  }
  const kind = allIntegers ? 'integers' : `numbers with up to ${n.maxDecimals} ${n.maxDecimals === 1 ? 'decimal' : 'decimals'}`;
  return { level: 'quantitative', role: 'measure', reason: `${kind} (${span(n)})${n.negatives > 0 ? ', some negative' : ''}` };
}

function countryCodes(col: ProfileColumn): string | null {
  const d = distinctValues(col, 400);
  if (d === null || d.length < 3) return null;
  const kinds = d.map(countryCodeKind);
  const hits = kinds.filter((k) => k !== null).length;
  const uniform = new Set(kinds.filter((k) => k !== null)).size === 1;
  if (!uniform || hits < 0.95 * d.length || d.some((x) => x !== x.toUpperCase())) return null;
  return `${hits} of ${d.length} distinct values are ISO 3166-1 ${kinds.find((k) => k !== null)} country codes`;
}

/** Level, role and reason of one column (latitude/longitude pairs by range are settled across columns later). */
export function classifyColumn(col: ProfileColumn): ColumnProfile {
  const b = base(col);
  if (col.values === 0) return { ...b, level: 'categorical', role: 'empty', reason: 'every value is empty' };
  const bool = asBoolean(col);
  if (bool) return { ...b, level: 'categorical', role: 'boolean', reason: bool };
  const g = analyseColumn(col.grain);
  if (g !== null && g.grain !== null && acceptTime(col, g)) {
    const level = g.level === 'ordinal' ? 'ordinal' : 'quantitative';
    return { ...b, level, role: 'time', reason: timeReason(g), grain: g };
  }
  const small = distinctValues(col, 50);
  const voc = small ? matchVocabulary(small) : null;
  if (voc) return { ...b, level: 'ordinal', role: 'ordered-vocabulary', reason: `${voc.vocabulary} terms, in order ${voc.order.join(' < ')}`, order: voc.order };
  const ranges = rangeLabels(col);
  if (ranges) return { ...b, level: 'ordinal', role: 'range-label', reason: `range labels, in order ${ranges.slice(0, 6).join(' < ')}${ranges.length > 6 ? ' < …' : ''}`, order: ranges };
  const n = col.numeric?.s;
  if (n && n.numbers >= 0.95 * col.values) {
    const r = numericRole(col);
    const others = col.values - n.numbers;
    if (others > 0) r.reason += `; ${others.toLocaleString('en-US')} ${others === 1 ? 'value is not a number' : 'values are not numbers'}`;
    // Integers that each follow the one before by one are unique: their distinct count is exact.
    const sequential = n.integers === col.values && n.stepsOfOne === col.values - 1;
    const distinct = sequential ? { distinct: col.values, distinctExact: true } : {};
    return { ...b, ...r, ...distinct, spatial: r.spatial ?? false, min: n.min, max: n.max };
  }
  const cc = countryCodes(col);
  if (cc) return { ...b, level: 'categorical', role: 'country-code', reason: cc, spatial: true };
  const top = col.distinct.top(5);
  if (col.distinct.exact && b.distinct === col.values && col.values >= 20 && col.totalLength / col.values < 30) {
    return { ...b, level: 'categorical', role: 'identifier', reason: `every value is different: they name rows` };
  }
  if (col.totalLength / col.values >= 30 && b.distinct >= 0.5 * col.values) {
    return { ...b, level: 'categorical', role: 'text', reason: `free text: long values (${Math.round(col.totalLength / col.values)} characters on average), mostly different` };
  }
  const mixed = n && n.numbers > 0.5 * col.values ? `; ${Math.round((100 * n.numbers) / col.values)}% of values are numbers, too few to read as quantities` : '';
  return { ...b, level: 'categorical', role: 'category', reason: `${b.distinctExact ? '' : 'about '}${b.distinct.toLocaleString('en-US')} distinct labels${mixed}`, top };
}
