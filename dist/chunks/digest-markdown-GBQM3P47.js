#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  DIGEST_END,
  DIGEST_JSON_FORMAT,
  DIGEST_MARKER,
  DIGEST_START,
  TIMELINE_LIMIT,
  countLine,
  mergeDigestBody,
  renderDigestMarkdown,
  renderDigestText
} from "./chunk-V3RVVQ3X.js";
import "./chunk-FVU4FYHL.js";
import "./chunk-XUFFUC7R.js";
import "./chunk-3QIBMH36.js";
import "./chunk-HYEQ4ILC.js";
import "./chunk-35APDGCM.js";
import "./chunk-7H6MHGDI.js";
import "./chunk-D7CL2H7J.js";
import "./chunk-5CFAFUOS.js";
import "./chunk-FUJ7I5KY.js";
export {
  DIGEST_END,
  DIGEST_JSON_FORMAT,
  DIGEST_MARKER,
  DIGEST_START,
  TIMELINE_LIMIT,
  countLine,
  mergeDigestBody,
  renderDigestMarkdown,
  renderDigestText
};
