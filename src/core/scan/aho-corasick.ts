/**
 * Aho–Corasick (1975) multi-pattern search over bytes: one pass over the text finds every
 * occurrence of every name, including names that lie inside other names, in time linear in the
 * text whatever the number of names. The automaton is a full transition table over a compressed
 * alphabet (bytes that occur in no name share one class), so the inner loop is one table lookup
 * per byte.
 */
export interface Automaton {
  readonly names: readonly string[];
  /** Byte length of each name. */
  readonly lengths: Int32Array;
  /** Calls `onMatch(nameIndex, endOffset)` for every occurrence in `bytes` (endOffset is the last byte). */
  search(bytes: Uint8Array, onMatch: (name: number, end: number) => void): void;
}

/** The largest search table given one entry per byte value (a few hundred names); larger ones use byte classes. */
const WIDE_TABLE_BYTES = 4 * 1024 * 1024;

export function buildAutomaton(names: readonly string[]): Automaton {
  const encoded = names.map((n) => new TextEncoder().encode(n));
  const classOf = new Uint8Array(256);
  let classes = 1;
  for (const bytes of encoded) for (const b of bytes) if (classOf[b] === 0) classOf[b] = classes++;
  if (classes > 255) throw new Error('too many distinct bytes in names');

  // Trie first; children as rows of the (future) transition table, -1 for "no edge yet".
  let capacity = 1 + encoded.reduce((s, b) => s + b.length, 0);
  let next = new Int32Array(capacity * classes).fill(-1);
  const output = new Int32Array(capacity).fill(-1);
  let states = 1;
  const duplicates: [number, number][] = [];
  encoded.forEach((bytes, index) => {
    let s = 0;
    for (const b of bytes) {
      const slot = s * classes + classOf[b]!;
      if (next[slot] === -1) next[slot] = states++;
      s = next[slot]!;
    }
    // Two equal names share a state; the second is reported through `duplicates`.
    if (output[s] === -1) output[s] = index;
    else duplicates.push([output[s]!, index]);
  });
  capacity = states;
  next = next.slice(0, capacity * classes);

  // Breadth-first: failure links, then fill every missing edge with the failure state's edge.
  const fail = new Int32Array(capacity);
  const dictionary = new Int32Array(capacity).fill(-1); // nearest proper suffix state with an output
  const queue = new Int32Array(capacity);
  let head = 0;
  let tail = 0;
  for (let c = 0; c < classes; c++) {
    const child = next[c]!;
    if (child === -1) next[c] = 0;
    else {
      fail[child] = 0;
      queue[tail++] = child;
    }
  }
  while (head < tail) {
    const s = queue[head++]!;
    const f = fail[s]!;
    dictionary[s] = output[f] !== -1 ? f : dictionary[f]!;
    for (let c = 0; c < classes; c++) {
      const slot = s * classes + c;
      const child = next[slot]!;
      if (child === -1) next[slot] = next[f * classes + c]!;
      else {
        fail[child] = next[f * classes + c]!;
        queue[tail++] = child;
      }
    }
  }

  // Rows of the search table: one per state. A small automaton gets a row of 256 entries, one per
  // byte, so the loop reads one table per byte instead of two (the byte's class, then the row); a
  // large one keeps rows of classes, as a 256-wide table would grow past the memory it saves time on.
  const wide = capacity * 256 * 4 <= WIDE_TABLE_BYTES;
  const width = wide ? 256 : classes;
  // Store row offsets instead of state numbers so the search loop does no multiplication.
  const delta = new Int32Array(capacity * width);
  for (let s = 0; s < capacity; s++) {
    for (let column = 0; column < width; column++) delta[s * width + column] = next[s * classes + (wide ? classOf[column]! : column)]! * width;
  }
  // Indexed by row offset, like delta, so the loop tests it without converting back to a state.
  const reports = new Uint8Array(capacity * width);
  for (let s = 0; s < capacity; s++) reports[s * width] = output[s] !== -1 || dictionary[s] !== -1 ? 1 : 0;
  const lengths = Int32Array.from(encoded, (b) => b.length);
  const twins = new Map<number, number[]>();
  for (const [first, other] of duplicates) twins.set(first, [...(twins.get(first) ?? []), other]);

  /** Reports each match found: its state's own name, then every shorter name that ends there too. */
  const report = (row: number, end: number, onMatch: (name: number, end: number) => void) => {
    const s = row / width;
    for (let t = output[s] !== -1 ? s : dictionary[s]!; t !== -1; t = dictionary[t]!) {
      const name = output[t]!;
      onMatch(name, end);
      const same = twins.get(name);
      if (same) for (const other of same) onMatch(other, end);
    }
  };
  // The loop only notes where matches end (state row, offset) in `found`; matches are reported after it, or when
  // `found` fills. A call inside the loop (a new callback for every file) would make V8 throw the loop's optimized
  // code away again and again, and run it unoptimized meanwhile.
  const found = new Int32Array(2 * 4096);
  return {
    names,
    lengths,
    search(bytes, onMatch) {
      let row = 0;
      let from = 0;
      for (;;) {
        const count = wide ? scanWide(delta, reports, bytes, from, row, found) : scanNarrow(delta, classOf, reports, bytes, from, row, found);
        for (let k = 0; k < count; k += 2) report(found[k]!, found[k + 1]!, onMatch);
        if (count < found.length) return;
        // `found` filled: go on from the byte after the last match noted, in the state it left.
        row = found[count - 2]!;
        from = found[count - 1]! + 1;
      }
    },
  };
}

/**
 * Runs the automaton (rows of 256 entries) over `bytes` from `from` in state row `row`, noting (row, offset) of each
 * reporting state in `found`; returns how many entries were written, stopping when `found` is full.
 */
function scanWide(delta: Int32Array, reports: Uint8Array, bytes: Uint8Array, from: number, row: number, found: Int32Array): number {
  let count = 0;
  const length = bytes.length;
  for (let i = from; i < length; i++) {
    row = delta[row + bytes[i]!]!;
    if (reports[row] === 0) continue;
    found[count++] = row;
    found[count++] = i;
    if (count === found.length) return count;
  }
  return count;
}

/** As `scanWide`, for rows of byte classes (large automata). */
function scanNarrow(delta: Int32Array, classOf: Uint8Array, reports: Uint8Array, bytes: Uint8Array, from: number, row: number, found: Int32Array): number {
  let count = 0;
  const length = bytes.length;
  for (let i = from; i < length; i++) {
    row = delta[row + classOf[bytes[i]!]!]!;
    if (reports[row] === 0) continue;
    found[count++] = row;
    found[count++] = i;
    if (count === found.length) return count;
  }
  return count;
}
