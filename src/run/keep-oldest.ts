/**
 * The one-of-a-kind pattern that both the sticky comment and the digest issue need: list ours,
 * create one if there is none, then list again (a racing run may have created its own) and keep
 * the oldest. The caller fixes the one kept and removes the rest.
 */
export async function keepOldest<T extends { createdAt: string; id: number }>(options: {
  list: () => Promise<T[]>;
  create: () => Promise<unknown>;
}): Promise<{ keep: T; extra: T[]; created: boolean }> {
  const sorted = async () => (await options.list()).sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.id - b.id);
  let found = await sorted();
  const created = found.length === 0;
  if (created) {
    await options.create();
    found = await sorted();
  }
  const [keep, ...extra] = found;
  if (!keep) throw new Error('the item just created is not listed');
  return { keep, extra, created };
}
