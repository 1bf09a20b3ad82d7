#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/version.ts
var VERSION = "0.1.0";

export {
  VERSION
};
