// The plain sentences that explain each finding of a column, kept in the result so every rendering
// (text, JSON, HTML) says the same thing.
import { civilFromDays, daysFromCivil, MS_PER_DAY } from '../calendar/civil.js';
import { getZone } from '../time/zone.js';
import { isPeriodGrain } from './candidates.js';
import type { Cadence, ColumnGrain, Grain, ZoneFinding } from './types.js';
import { boundaryWords, count, grainWords, percent, unitPlural, utcOffset } from './words.js';

/** "UTC−06:00 in winter, UTC−05:00 in summer" for a zone with daylight saving, judged in the data's first year. */
export function offsetWords(f: ZoneFinding, firstMs: number): string {
  const offs = f.offsets;
  if (offs.length === 0) return '';
  if (offs.length === 1) return utcOffset(offs[0]!);
  if (offs.length === 2 && f.zone !== null && f.zone.includes('/')) {
    const year = Number.isFinite(firstMs) ? civilFromDays(Math.floor(firstMs / MS_PER_DAY))[0]! : 2024;
    const z = getZone(f.zone);
    const jan = z.offsetAt(daysFromCivil(year, 1, 15) * MS_PER_DAY);
    const jul = z.offsetAt(daysFromCivil(year, 7, 15) * MS_PER_DAY);
    if (jan !== jul) {
      const [winter, summer] = jul > jan ? [jan, jul] : [jul, jan];
      return `${utcOffset(winter)} in winter, ${utcOffset(summer)} in summer`;
    }
  }
  return offs.map(utcOffset).join(', ');
}

function alsoZones(f: ZoneFinding): string {
  const alt = f.alternatives;
  if (alt.length === 0) return '';
  const shown = alt.slice(0, 4).join(', ');
  return `; ${alt.length === 1 ? 'one other zone matches' : `${count(alt.length)} other zones match`} equally (${shown}${alt.length > 4 ? ', …' : ''})`;
}

function zoneSentence(c: ColumnGrain, firstMs: number, kinds: { instant: number; local: number }): string {
  const f = c.zoneFinding;
  const where = offsetWords(f, firstMs);
  switch (f.basis) {
    case 'none': return kinds.local === 0
      ? 'The values name calendar dates or periods, which carry no offset or zone.'
      : 'The values carry no offset: they are wall-clock readings, not placed in any zone (give --zone to place them).';
    case 'given': return `Read in ${f.zone}${where ? ` (${where})` : ''}, as asked with --zone.`;
    case 'offsets': return f.zone === null
      ? `The written offsets (${where}) do not change the way any IANA zone's offsets do.`
      : `The written offsets (${where}) change exactly as ${f.zone}'s daylight-saving rules do${alsoZones(f)}.`;
    case 'written': return f.zone === 'UTC'
      ? 'Every value is written in UTC, and no other zone puts enough of them on coarser local boundaries to claim it.'
      : `Every value is written with the offset ${where}${f.alternatives.length ? `, as ${f.alternatives.slice(0, 4).join(', ')}${f.alternatives.length > 4 ? ' …' : ''} keep over these dates` : ''}.`;
    case 'aligned': return '';
  }
}

/** "The only value", "Both values", "All 12 values": the subject of a sentence about every value. */
function allValues(n: number): string {
  return n === 1 ? 'The only value' : n === 2 ? 'Both values' : `All ${count(n)} values`;
}

function grainSentence(c: ColumnGrain, g: Grain, firstMs: number): string {
  const cov = c.coverage!;
  const on = boundaryWords(g);
  const where = c.zoneFinding.basis === 'aligned' || c.zoneFinding.basis === 'given'
    ? ` in ${c.zone}${c.zoneFinding.offsets.length ? ` (${offsetWords(c.zoneFinding, firstMs)})` : ''}` : '';
  const local = where && (g.unit === 'day' || isPeriodGrain(g)) ? `local ${on}` : on;
  const byNotation = c.notationUnit !== null && g.step === 1 && g.anchor === 'start'
    && (g.unit === c.notationUnit || (g.unit === 'fiscal-year' && c.notationUnit === 'fiscal-year'));
  if (byNotation && cov.exceptions === 0 && !isPeriodGrain(g)) {
    // Instants and readings written to the second (or minute, hour): the notation is the floor.
    const written = `${allValues(cov.onGrain)} ${cov.onGrain === 1 ? 'is' : 'are'} written`;
    const few = cov.onGrain === 1 ? 'one value is too few' : 'too few of them lie on coarser boundaries';
    return `${written} to the ${g.unit}, and ${few} to claim a coarser grain, so this column holds ${grainWords(g)}.`;
  }
  if (byNotation && cov.exceptions === 0) {
    return `${allValues(cov.onGrain)} ${cov.onGrain === 1 ? 'names' : 'name'} ${unitPlural(c.notationUnit!)} by their notation, and no coarser grain holds, so this column holds ${grainWords(g)}.`;
  }
  const head = cov.exceptions === 0
    ? `${allValues(cov.onGrain)} ${cov.onGrain === 1 ? 'falls' : 'fall'} on ${local}${where}`
    : `${count(cov.onGrain)} of ${count(cov.onGrain + cov.exceptions)} values (${percent(cov.share)}) fall on ${local}${where}`;
  let s = `${head}, so this column holds ${grainWords(g)}`;
  if (c.zoneFinding.basis === 'aligned') s += alsoZones(c.zoneFinding);
  if (g.unit === 'week' && g.step === 1 && g.weekStart === 7) s += ' — the same boundaries as epidemiological weeks';
  if (g.unit === 'week' && g.step === 1 && g.weekStart === 1) s += ' — the same boundaries as ISO 8601 weeks';
  s += '.';
  if (cov.exceptions > 0) {
    const ex = cov.examples.slice(0, 3).map((e) => `line ${e.line} ${JSON.stringify(e.value)}`).join(', ');
    s += ` ${count(cov.exceptions)} ${cov.exceptions === 1 ? 'value does' : 'values do'} not (${ex}${cov.exceptions > 3 ? ', …' : ''}); at least 99% must, so they are reported, not followed.`;
  }
  return s;
}

function levelReason(g: Grain): string {
  return isPeriodGrain(g)
    ? `Periods (${unitPlural(g.unit)}, a day or longer): ordinal — each value names a calendar period, an ordered category.`
    : `Instants (finer than a day: ${grainWords(g)}): quantitative — differences between values are durations.`;
}

function cadenceSentence(c: Cadence, g: Grain, first: string | null, last: string | null): string {
  const span = first !== null && last !== null ? ` from ${first} to ${last}` : '';
  const periods = `${c.distinctExact ? '' : 'about '}${count(c.distinct)} distinct ${c.distinct === 1 ? 'period' : 'periods'}`;
  const extra = [
    c.missing > 0 ? `${count(c.missing)} missing` : '',
    c.repeated > 0 ? `${count(c.repeated)} ${c.repeated === 1 ? 'row shares' : 'rows share'} a period with another` : '',
  ].filter(Boolean).join(', ');
  const tail = `${periods}${span}${extra ? ` (${extra})` : ''}.`;
  switch (c.kind) {
    case 'single': return `Cadence: a single period${span}.`;
    case 'regular': return `Cadence: regular, one every ${c.every === 1 ? unitPlural(c.unit ?? g.unit).replace(/s$/, '') : `${c.every} ${unitPlural(c.unit ?? g.unit)}`}; ${tail}`;
    case 'weekdays': return `Cadence: weekdays only (Monday to Friday); ${tail}`;
    case 'weekly': return `Cadence: one day in each week, on varying weekdays; ${tail}`;
    case 'monthly': return `Cadence: one day in each month, on varying days; ${tail}`;
    case 'irregular': return c.distinctExact
      ? `Cadence: irregular${c.typicalGap !== null ? ` (most common gap ${count(c.typicalGap)} ${unitPlural(g.unit)})` : ''}; ${tail}`
      : `Cadence: not computed — too many distinct values to keep; ${tail}`;
  }
}

function formatSentence(c: ColumnGrain): string {
  const v = c.values;
  const inv = c.invalidExamples[0];
  const invalid = v.invalid === 0 ? '' : `, ${count(v.invalid)} invalid (first: line ${inv!.line} ${JSON.stringify(inv!.value)}: ${inv!.reason ?? 'not readable'})`;
  return `Format: ${c.formatLabel}; ${count(v.parsed)} values parsed, ${count(v.empty)} empty${invalid}.`;
}

/** Fills `findings` and `levelReason` of a column result; returns it. */
export function explainColumn(c: ColumnGrain, kinds: { instant: number; local: number }, firstMs: number): ColumnGrain {
  const out: string[] = [formatSentence(c)];
  if (c.formatEvidence && !/^\d+ of \d+ values are [^;]*$/.test(c.formatEvidence)) out.push(`Why this format: ${c.formatEvidence}.`.replace(/\.\.$/, '.').replace(/: (\d+) of \1 values are /, (_m, n: string) => `: the first ${count(Number(n))} values are all `));
  if (c.ambiguity) out.push(`The values fit ${c.ambiguity.join(' and ')} equally; the grain below is computed under the first — pass --day-first or --month-first to settle it.`);
  const z = zoneSentence(c, firstMs, kinds);
  if (z) out.push(z);
  if (c.grain !== null && c.coverage !== null) {
    out.push(grainSentence(c, c.grain, firstMs));
    c.levelReason = levelReason(c.grain);
    out.push(c.levelReason);
  } else {
    c.levelReason = 'No value parsed, so no grain or level can be given.';
    out.push(c.levelReason);
  }
  if (c.cadence && c.grain) out.push(cadenceSentence(c.cadence, c.grain, c.first, c.last));
  c.findings = out;
  return c;
}
