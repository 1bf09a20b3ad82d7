#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/run/repo-path.ts
import { isAbsolute, relative, sep } from "node:path";
function pathInRepository(root, written) {
  const path = isAbsolute(written) ? relative(root, written).split(sep).join("/") || "." : written;
  return path.replace(/^\.\//, "");
}

export {
  pathInRepository
};
