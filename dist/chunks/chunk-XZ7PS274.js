#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/core/config/sizing-policy.ts
function sizingPolicy(settings) {
  return {
    guardrailAlpha: settings.sizing.guardrailAlpha,
    guardrailPower: settings.sizing.guardrailPower,
    guardrailArmCorrection: settings.sizing.guardrailArmCorrection,
    longestDays: settings.sizing.longestWindowDays
  };
}

export {
  sizingPolicy
};
