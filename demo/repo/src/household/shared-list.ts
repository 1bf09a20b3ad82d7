import { flags, track } from '../flags';

export function sharedListHeader(householdId: string, members: number): string {
  const invite = flags.getBooleanValue('shared-list-invite', false);
  track('shared_list_viewed', { householdId });
  return invite && members < 2 ? 'Invite someone to shop with you' : `${members} people share this list`;
}

export function onListItemAdded(householdId: string): void {
  track('shared_list_item_added', { householdId });
}
