/**
 * Suggests the known name nearest to a mistyped one ("did you mean ..."), or undefined when
 * nothing is close enough to be a plausible typo.
 */
export function closestName(typed: string, known: readonly string[]): string | undefined {
  const wanted = typed.toLowerCase();
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const candidate of known) {
    const distance = editDistance(wanted, candidate.toLowerCase());
    if (distance < bestDistance) {
      best = candidate;
      bestDistance = distance;
    }
  }
  // A third of the length (at least 2 edits) separates typos from different words in practice.
  const tolerance = Math.max(2, Math.floor(typed.length / 3));
  if (best !== undefined && bestDistance <= tolerance) return best;
  // Other spellings of the same word: camelCase or snake_case for kebab-case, singular for plural.
  return known.find((candidate) => stem(candidate) === stem(typed));
}

function stem(name: string): string {
  return name
    .replace(/[-_\s]/g, '')
    .toLowerCase()
    .replace(/ies$/, 'y')
    .replace(/s$/, '');
}

/** Optimal string alignment distance: Levenshtein plus adjacent transpositions, the commonest typo. */
function editDistance(a: string, b: string): number {
  const rows = a.length + 1;
  const cols = b.length + 1;
  const d: number[][] = Array.from({ length: rows }, (_, i) => Array.from({ length: cols }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)));
  for (let i = 1; i < rows; i++) {
    for (let j = 1; j < cols; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let value = Math.min(d[i - 1]![j]! + 1, d[i]![j - 1]! + 1, d[i - 1]![j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) {
        value = Math.min(value, d[i - 2]![j - 2]! + 1);
      }
      d[i]![j] = value;
    }
  }
  return d[a.length]![b.length]!;
}
