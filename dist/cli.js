#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/cli/bin.ts
import nodeModule from "node:module";
nodeModule.enableCompileCache?.();
var { runCli } = await import("./chunks/main-EJZMDWLO.js");
process.exitCode = await runCli(process.argv);
