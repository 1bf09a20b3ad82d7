import { flags, track } from '../flags';

export function slotPicker(slots: { id: string; greenSlot: boolean }[]): { id: string; badge?: string }[] {
  track('slot_picker_viewed');
  const nudge = flags.getBooleanValue('delivery-slot-nudge', false);
  return slots.map((slot) => (nudge && slot.greenSlot ? { id: slot.id, badge: 'Van already nearby' } : { id: slot.id }));
}

export function onSlotBooked(slotId: string, greenSlot: boolean): void {
  track('slot_booked', { slotId, greenSlot });
}
