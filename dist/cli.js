#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  VERSION
} from "./chunks/chunk-Q5T6YC3M.js";
import "./chunks/chunk-FUJ7I5KY.js";

// src/cli/bin.ts
import { readFileSync } from "node:fs";
import nodeModule from "node:module";
var args = process.argv.slice(2);
var canned = args.length <= 2 ? cannedHelp(args) : void 0;
if (args.length === 1 && (args[0] === "--version" || args[0] === "-V")) {
  process.stdout.write(`${VERSION}
`);
} else if (canned !== void 0) {
  process.stdout.write(canned);
} else {
  nodeModule.enableCompileCache?.();
  const { runCli } = await import("./chunks/main-FFWCEIBT.js");
  process.exitCode = await runCli(process.argv);
}
function cannedHelp(words) {
  const [first, second] = words;
  const isHelp = (word) => word === "--help" || word === "-h";
  const command = words.length === 1 && isHelp(first) ? "" : words.length === 2 && isHelp(second) && /^[a-z]+$/.test(first ?? "") ? first : void 0;
  if (command === void 0) return void 0;
  try {
    const texts = JSON.parse(readFileSync(new URL("./help.json", import.meta.url), "utf8"));
    const text = Object.hasOwn(texts, command) ? texts[command] : void 0;
    return typeof text === "string" ? text : void 0;
  } catch {
    return void 0;
  }
}
