/**
 * The one-of-a-kind pattern that both the sticky comment and the digest issue need: list ours,
 * create one if there is none, then list again (a racing run may have created its own) and keep
 * the oldest. The caller fixes the one kept and removes the rest.
 *
 * GitHub's listings can lag behind a write: the item just created may be missing from the second
 * listing. That is normal, not an error: the created item joins the listed ones, so this run keeps
 * the oldest it knows of, and a duplicate it could not see is tidied by the next run.
 */
export async function keepOldest<T extends { createdAt: string; id: number }>(options: {
  list: () => Promise<T[]>;
  create: () => Promise<T>;
}): Promise<{ keep: T; extra: T[]; created: boolean }> {
  const oldestFirst = (items: T[]) => items.sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.id - b.id);
  let found = oldestFirst(await options.list());
  const created = found.length === 0;
  if (created) {
    const made = await options.create();
    const listed = await options.list();
    found = oldestFirst(listed.some((item) => item.id === made.id) ? listed : [...listed, made]);
  }
  const [keep, ...extra] = found as [T, ...T[]];
  return { keep, extra, created };
}
