import { flags, track } from '../flags';

const PAYMENTS_KILL_SWITCH = 'payments-kill-switch';

export function paymentOptions(savedWallets: string[]): string[] {
  if (flags.getBooleanValue(PAYMENTS_KILL_SWITCH, false)) return [];
  track('checkout_payment_viewed');
  // Saved wallets first for everyone: checkout-wallet-first won (see its outcome).
  return [...savedWallets, 'card'];
}

export function tipOptions(orderTotal: number): number[] {
  const variant = flags.getStringValue('checkout-tip-prompt', 'off');
  if (variant === 'off') return [];
  track('tip_prompt_shown', { variant });
  return variant === 'percent' ? [0.05, 0.1, 0.15].map((p) => Math.round(orderTotal * p)) : [1, 2, 3];
}

export function onOrderPlaced(orderId: string, tip: number): void {
  track('order_placed', { orderId });
  if (tip > 0) track('tip_added', { orderId, tip });
}
