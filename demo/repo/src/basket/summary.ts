import { flags, track } from '../flags';

export function renderBasketSummary(basket: { id: string; usualItems: string[] }): string {
  track('basket_viewed', { basketId: basket.id });
  if (basket.usualItems.length === 0) return '';
  const showReorder = flags.getBooleanValue('basket-reorder-shortcut', false);
  // Exposure in every arm, where the arms first differ: control logs it too.
  track('reorder_shortcut_shown', { basketId: basket.id, shortcut: showReorder });
  if (showReorder) {
    return `<button data-action="reorder">Add your usual ${basket.usualItems.length} items</button>`;
  }
  return '';
}

export function onReorderTapped(basketId: string): void {
  track('reorder_tapped', { basketId });
}
