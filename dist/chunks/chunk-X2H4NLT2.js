#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/core/stats/result.ts
var ok = (value) => ({ ok: true, value });
var fail = (input, message) => ({ ok: false, error: { input, message } });
function finite(value, input, what) {
  return Number.isFinite(value) ? ok(value) : fail(input, `${what} cannot be computed for these inputs`);
}

export {
  ok,
  fail,
  finite
};
