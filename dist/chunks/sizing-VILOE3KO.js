#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  SIZING_JSON_FORMAT,
  changeSize,
  describeChange,
  designSummary,
  lengthSetter,
  lengthSummary,
  multiplierNotes,
  renderSizingMarkdown,
  renderSizingText,
  sizingJson,
  withArticle
} from "./chunk-UDHHIPK7.js";
import "./chunk-7H6MHGDI.js";
import "./chunk-6TRXKJK6.js";
import "./chunk-D7CL2H7J.js";
import "./chunk-ACAADDFF.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-FUJ7I5KY.js";
export {
  SIZING_JSON_FORMAT,
  changeSize,
  describeChange,
  designSummary,
  lengthSetter,
  lengthSummary,
  multiplierNotes,
  renderSizingMarkdown,
  renderSizingText,
  sizingJson,
  withArticle
};
