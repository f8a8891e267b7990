// Group ids for `--by` columns: each distinct tuple of group values gets a small integer id.

// A trie of Maps, one level per `--by` column, so a row's group is found without building a key string.
type Trie = Map<string, Trie | number>;

/** Maps group tuples (the values of the `--by` columns) to dense integer ids. */
export class GroupIndex {
  private readonly ids = new Map<string, number>();
  private readonly trie: Trie = new Map();
  private readonly tuples: string[][] = [];
  readonly width: number;

  constructor(width: number) {
    this.width = width;
  }

  /** Id of the group with one value (the common case of one `--by` column). */
  idOf1(value: string): number {
    const id = this.ids.get(value);
    return id === undefined ? this.add(value, [value]) : id;
  }

  /** Id of the group named by `values[c][row]` for each `--by` column c in `cols`. */
  idOfRow(values: readonly (readonly string[])[], cols: readonly number[], row: number): number {
    if (cols.length === 0) return this.idOf1('');
    if (cols.length === 1) return this.idOf1(values[cols[0]!]![row]!);
    let node = this.trie;
    const last = cols.length - 1;
    for (let i = 0; i < last; i++) {
      const v = values[cols[i]!]![row]!;
      let next = node.get(v) as Trie | undefined;
      if (next === undefined) {
        next = new Map();
        node.set(v, next);
      }
      node = next;
    }
    const v = values[cols[last]!]![row]!;
    const id = node.get(v) as number | undefined;
    if (id !== undefined) return id;
    const fresh = this.tuples.length;
    this.tuples.push(cols.map((c) => values[c]![row]!));
    node.set(v, fresh);
    return fresh;
  }

  /** Id of the group whose values are `tuple` (one per `--by` column), as idOfRow gives it. */
  idOfTuple(tuple: readonly string[]): number {
    if (tuple.length <= 1) return this.idOf1(tuple[0] ?? '');
    return this.idOfRow(tuple.map((v) => [v]), tuple.map((_, i) => i), 0);
  }

  /** Number of groups seen. */
  get size(): number {
    return this.tuples.length;
  }

  /** The values of group `id`, one per `--by` column. */
  tuple(id: number): readonly string[] {
    return this.tuples[id]!;
  }

  /** Group ids in the order of their values (column by column, by code point), for stable output. */
  sortedIds(): number[] {
    const ids = this.tuples.map((_, i) => i);
    return ids.sort((a, b) => compareTuples(this.tuples[a]!, this.tuples[b]!));
  }

  private add(key: string, tuple: string[]): number {
    const id = this.tuples.length;
    this.ids.set(key, id);
    this.tuples.push(this.width === 0 ? [] : tuple);
    return id;
  }
}

function compareTuples(a: readonly string[], b: readonly string[]): number {
  for (let i = 0; i < a.length; i++) {
    const x = a[i]!;
    const y = b[i]!;
    if (x !== y) return x < y ? -1 : 1;
  }
  return 0;
}
