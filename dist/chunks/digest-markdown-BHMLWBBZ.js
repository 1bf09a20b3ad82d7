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
} from "./chunk-OQ5QBWU4.js";
import "./chunk-MEL5VBEP.js";
import "./chunk-FZSY7OIF.js";
import "./chunk-D7CL2H7J.js";
import "./chunk-AAUUFJV7.js";
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
