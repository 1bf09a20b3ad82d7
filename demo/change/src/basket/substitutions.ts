import { flags, track } from '../flags';

/** Offers a substitute when an item is out of stock. */
export function substituteFor(item: { id: string; inStock: boolean }, similar: string[]): string | undefined {
  if (item.inStock || !flags.getBooleanValue('basket-substitutions', false)) return undefined;
  track('substitute_offered', { itemId: item.id });
  return similar[0];
}
