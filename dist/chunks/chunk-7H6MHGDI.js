#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/core/report/markdown-safe.ts
var ZERO_WIDTH_SPACE = "\u200B";
function inert(text) {
  return text.replace(/@(?=[A-Za-z0-9_-])/g, `@${ZERO_WIDTH_SPACE}`).replace(/#(?=\d)/g, `#${ZERO_WIDTH_SPACE}`);
}
function oneLine(text) {
  return text.replace(/\r\n?|\n/g, " ");
}
function escapePlain(text) {
  return inert(text).replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/[\\`*_[\]~!]/g, (c) => `\\${c}`).replace(/(www)\./gi, "$1\\.").replace(/:(?=\/\/)/g, "\\:");
}
function escapeCode(text) {
  return text.replace(/<!--/g, `<${ZERO_WIDTH_SPACE}!--`);
}
function safeText(text) {
  return escapePlain(oneLine(text));
}
function safeMessage(text) {
  const clean = oneLine(text);
  let out = "";
  let at = 0;
  const runs = [...clean.matchAll(/`+/g)];
  for (let i = 0; i < runs.length; i++) {
    const open = runs[i];
    if (open.index < at) continue;
    const close = runs.slice(i + 1).find((r) => r[0].length === open[0].length);
    out += escapePlain(clean.slice(at, open.index));
    if (!close) {
      out += open[0].replace(/`/g, "\\`");
      at = open.index + open[0].length;
      continue;
    }
    const inner = clean.slice(open.index + open[0].length, close.index);
    out += `${open[0]}${escapeCode(inner)}${close[0]}`;
    at = close.index + close[0].length;
    i = runs.indexOf(close);
  }
  return out + escapePlain(clean.slice(at));
}
function inCell(markdown) {
  return markdown.replace(/\|/g, "\\|");
}
function safeCell(text) {
  return inCell(safeText(text));
}
function codeSpan(text) {
  const clean = escapeCode(oneLine(text));
  const longest = Math.max(0, ...[...clean.matchAll(/`+/g)].map((m) => m[0].length));
  const fence = "`".repeat(longest + 1);
  const pad = clean.startsWith("`") || clean.endsWith("`") || /^ .* $/.test(clean) ? " " : "";
  return clean === "" ? "` `" : `${fence}${pad}${clean}${pad}${fence}`;
}
function codeCell(text) {
  return inCell(codeSpan(text));
}
function urlPath(path) {
  return path.split("/").map((segment) => encodeURIComponent(segment).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`)).join("/");
}
function linkTarget(url) {
  return url.replace(/[^A-Za-z0-9\-._~:/?#[\]@!$&'*+,;=%]/gu, (c) => encodeURIComponent(c)).replace(/[()'!*[\]]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}

export {
  safeText,
  safeMessage,
  inCell,
  safeCell,
  codeSpan,
  codeCell,
  urlPath,
  linkTarget
};
