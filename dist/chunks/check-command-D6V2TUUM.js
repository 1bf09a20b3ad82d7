#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  ExternalError,
  UsageError
} from "./chunk-TEADBEZM.js";
import "./chunk-FUJ7I5KY.js";

// src/cli/check-command.ts
import { readFile } from "node:fs/promises";
import { resolve } from "node:path";
async function pullRequestInfo(flags, cwd) {
  let fromFile = {};
  if (flags.prJson) {
    let parsed;
    try {
      parsed = JSON.parse(await readFile(resolve(cwd, flags.prJson), "utf8"));
    } catch (error) {
      throw new UsageError(`--pr-json ${flags.prJson} is not a readable JSON file (${error instanceof Error ? error.message : String(error)})`, 'give { "title": ..., "body": ..., "labels": [...], "branch": ... } or a pull-request object');
    }
    fromFile = fromJson(parsed, flags.prJson);
  }
  let body = flags.body ?? fromFile.body;
  if (flags.bodyFile) {
    try {
      body = await readFile(resolve(cwd, flags.bodyFile), "utf8");
    } catch (error) {
      throw new ExternalError(`cannot read --body-file ${flags.bodyFile}`, void 0, { cause: error });
    }
  }
  const labels = flags.label.length ? flags.label : fromFile.labels;
  return {
    ...(flags.title ?? fromFile.title) !== void 0 ? { title: flags.title ?? fromFile.title } : {},
    ...body !== void 0 ? { body } : {},
    ...labels ? { labels } : {},
    ...(flags.branch ?? fromFile.branch) !== void 0 ? { branch: flags.branch ?? fromFile.branch } : {}
  };
}
function fromJson(value, file) {
  if (value === null || typeof value !== "object" || Array.isArray(value)) throw new UsageError(`--pr-json ${file}: expected a JSON object`);
  const record = value;
  const pr = record.pull_request && typeof record.pull_request === "object" ? record.pull_request : record;
  const text = (v, field) => {
    if (v === void 0 || v === null) return void 0;
    if (typeof v !== "string") throw new UsageError(`--pr-json ${file}: ${field} must be text`);
    return v;
  };
  const labels = Array.isArray(pr.labels) ? pr.labels.map((l, i) => {
    const name = typeof l === "string" ? l : l && typeof l === "object" ? l.name : void 0;
    if (typeof name !== "string") throw new UsageError(`--pr-json ${file}: labels[${i}] must be a name or an object with a name`);
    return name;
  }) : void 0;
  const headRef = pr.head && typeof pr.head === "object" ? pr.head.ref : void 0;
  const title = text(pr.title, "title");
  const body = text(pr.body, "body");
  const branch = text(pr.branch ?? headRef, "branch");
  return { ...title !== void 0 ? { title } : {}, ...body !== void 0 ? { body } : {}, ...labels ? { labels } : {}, ...branch !== void 0 ? { branch } : {} };
}
export {
  pullRequestInfo
};
