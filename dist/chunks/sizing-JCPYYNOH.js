#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  SIZING_JSON_FORMAT,
  describeChange,
  designSummary,
  lengthSetter,
  lengthSummary,
  multiplierNotes,
  renderSizingMarkdown,
  renderSizingText,
  sizingJson
} from "./chunk-MYUGBT5N.js";
import "./chunk-7H6MHGDI.js";
import "./chunk-D7CL2H7J.js";
import "./chunk-ACAADDFF.js";
import "./chunk-FUJ7I5KY.js";
export {
  SIZING_JSON_FORMAT,
  describeChange,
  designSummary,
  lengthSetter,
  lengthSummary,
  multiplierNotes,
  renderSizingMarkdown,
  renderSizingText,
  sizingJson
};
