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
} from "./chunk-N3YY4SXJ.js";
import "./chunk-J4PRLTV7.js";
import "./chunk-4JVBEDJS.js";
import "./chunk-UDHHIPK7.js";
import "./chunk-BNTHVXFQ.js";
import "./chunk-7H6MHGDI.js";
import "./chunk-6TRXKJK6.js";
import "./chunk-YHYDL5HF.js";
import "./chunk-D7CL2H7J.js";
import "./chunk-ACAADDFF.js";
import "./chunk-X2H4NLT2.js";
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
