import type { SizingPolicy } from '../stats/plan-sizing.js';
import type { Settings } from './schema.js';

/** The sizing conventions the settings file chooses. */
export function sizingPolicy(settings: Settings): SizingPolicy {
  return {
    guardrailAlpha: settings.sizing.guardrailAlpha,
    guardrailPower: settings.sizing.guardrailPower,
    guardrailArmCorrection: settings.sizing.guardrailArmCorrection,
    longestDays: settings.sizing.longestWindowDays,
  };
}
