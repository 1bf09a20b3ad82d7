#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  formatFieldPath,
  valueAt
} from "./chunk-4F4MJKFM.js";
import {
  describeValue
} from "./chunk-PDUGBP5Q.js";

// src/core/source/rule-context.ts
function runRules(value, source, rules) {
  const problems = [];
  const context = {
    value,
    report({ severity, code, path, message, expected, showFound, atKey }) {
      const found = showFound ? describeValue(valueAt(source.value, path)) : void 0;
      problems.push({
        severity,
        code,
        // A wrong key (an arm or metric name) is pointed at where the key is written, not at its value.
        ...atKey && path.length ? source.locateKey(path.slice(0, -1), String(path[path.length - 1])) : source.locate(path),
        field: formatFieldPath(path),
        message,
        ...expected ? { expected } : {},
        ...found ? { found } : {}
      });
    }
  };
  for (const rule of rules) rule(context);
  return problems;
}

export {
  runRules
};
