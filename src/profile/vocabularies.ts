// Ordered vocabularies: lists of terms that carry an order, as common practice writes them (ratings,
// sizes, agreement and frequency scales, severities), plus English month and weekday names in calendar
// order (ISO 8601 numbers months from January and weekdays from Monday). Matching ignores case and spacing.

export interface Vocabulary {
  name: string;
  /** Terms in order; each entry lists spellings of one rank. */
  terms: readonly (readonly string[])[];
  /** Fewest distinct terms a column must show to be read as this vocabulary. */
  minTerms: number;
}

const v = (name: string, terms: string[][], minTerms = 2): Vocabulary => ({ name, terms, minTerms });

/** The vocabularies quern recognises, each "common practice" unless a standard is named. */
export const VOCABULARIES: readonly Vocabulary[] = [
  v('low to high', [['very low'], ['low'], ['medium', 'moderate', 'mid'], ['high'], ['very high']]),
  v('size', [['extra small', 'x-small'], ['small'], ['medium'], ['large'], ['extra large', 'x-large']]),
  v('size letters', [['xxs'], ['xs'], ['s'], ['m'], ['l'], ['xl'], ['xxl'], ['xxxl', '3xl']], 3),
  v('agreement', [['strongly disagree'], ['disagree'], ['neither agree nor disagree', 'neutral', 'undecided'], ['agree'], ['strongly agree']]),
  v('satisfaction', [['very dissatisfied'], ['dissatisfied'], ['neutral', 'neither satisfied nor dissatisfied'], ['satisfied'], ['very satisfied']]),
  v('frequency', [['never'], ['rarely', 'seldom'], ['sometimes', 'occasionally'], ['often', 'usually'], ['always']]),
  v('quality', [['very poor'], ['poor'], ['fair'], ['good'], ['very good'], ['excellent']]),
  v('severity', [['none'], ['mild', 'minor'], ['moderate'], ['severe', 'major'], ['critical', 'life-threatening']]),
  v('likelihood', [['very unlikely'], ['unlikely'], ['possible'], ['likely'], ['very likely', 'almost certain']]),
  v('priority', [['lowest'], ['low'], ['normal'], ['high'], ['highest', 'urgent']], 3),
  v('education level', [['primary'], ['secondary'], ['tertiary']]),
  v('ordinal words', [['first'], ['second'], ['third'], ['fourth'], ['fifth'], ['sixth'], ['seventh'], ['eighth'], ['ninth'], ['tenth']]),
  v('month names', [['january', 'jan'], ['february', 'feb'], ['march', 'mar'], ['april', 'apr'], ['may'], ['june', 'jun'],
    ['july', 'jul'], ['august', 'aug'], ['september', 'sep', 'sept'], ['october', 'oct'], ['november', 'nov'], ['december', 'dec']], 3),
  v('weekday names', [['monday', 'mon'], ['tuesday', 'tue', 'tues'], ['wednesday', 'wed'], ['thursday', 'thu', 'thur', 'thurs'],
    ['friday', 'fri'], ['saturday', 'sat'], ['sunday', 'sun']], 3),
];

function norm(s: string): string {
  return s.trim().toLowerCase().replace(/[\s_]+/g, ' ');
}

/** A column's vocabulary and its terms in order (as written in the column), or null. */
export interface VocabularyMatch {
  vocabulary: string;
  order: string[];
}

/**
 * The vocabulary that holds every distinct value of a column (`distinct`, as written), or null. Values
 * must all belong to one list; the order found is the list's, restricted to the values present.
 */
export function matchVocabulary(distinct: readonly string[]): VocabularyMatch | null {
  if (distinct.length < 2) return null;
  for (const voc of VOCABULARIES) {
    if (distinct.length < voc.minTerms) continue;
    const rankOf = new Map<string, number>();
    voc.terms.forEach((spellings, rank) => spellings.forEach((s) => rankOf.set(s, rank)));
    const ranked: Array<[number, string]> = [];
    let ok = true;
    for (const d of distinct) {
      const r = rankOf.get(norm(d));
      if (r === undefined) {
        ok = false;
        break;
      }
      ranked.push([r, d]);
    }
    if (!ok) continue;
    if (new Set(ranked.map(([r]) => r)).size < Math.min(2, voc.minTerms)) continue;
    ranked.sort((a, b) => a[0] - b[0] || a[1].localeCompare(b[1]));
    return { vocabulary: voc.name, order: ranked.map(([, d]) => d) };
  }
  return null;
}
