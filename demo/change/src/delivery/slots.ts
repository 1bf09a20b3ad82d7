import { flags, track } from '../flags';

export function slotPicker(slots: { id: string; greenSlot: boolean; vanNearby: boolean }[]): { id: string; badge?: string }[] {
  track('slot_picker_viewed');
  const nudge = flags.getBooleanValue('delivery-slot-nudge', false);
  return slots.map((slot) => {
    if (nudge && slot.vanNearby) {
      track('slot_nudge_shown', { slotId: slot.id });
      return { id: slot.id, badge: 'Van already nearby' };
    }
    return { id: slot.id };
  });
}

export function onSlotBooked(slotId: string, greenSlot: boolean): void {
  track('slot_booked', { slotId, greenSlot });
}
