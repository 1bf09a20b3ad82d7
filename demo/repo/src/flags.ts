// Bramblecart web app: one OpenFeature client for the whole app.
import { OpenFeature } from '@openfeature/web-sdk';

export const flags = OpenFeature.getClient('bramblecart-web');

export function track(event: string, properties: Record<string, unknown> = {}): void {
  window.dispatchEvent(new CustomEvent('bramblecart:track', { detail: { event, properties } }));
}
