#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  VERSION
} from "./chunks/chunk-Q5T6YC3M.js";
import "./chunks/chunk-FUJ7I5KY.js";

// src/cli/bin.ts
import nodeModule from "node:module";
var args = process.argv.slice(2);
if (args.length === 1 && (args[0] === "--version" || args[0] === "-V")) {
  process.stdout.write(`${VERSION}
`);
} else {
  nodeModule.enableCompileCache?.();
  const { runCli } = await import("./chunks/main-N3QQGEQJ.js");
  process.exitCode = await runCli(process.argv);
}
