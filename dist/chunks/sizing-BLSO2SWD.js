#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  SIZING_JSON_FORMAT,
  describeChange,
  designSummary,
  multiplierNotes,
  renderSizingMarkdown,
  renderSizingText,
  sizingJson
} from "./chunk-FZSY7OIF.js";
import "./chunk-D7CL2H7J.js";
import "./chunk-AAUUFJV7.js";
import "./chunk-FUJ7I5KY.js";
export {
  SIZING_JSON_FORMAT,
  describeChange,
  designSummary,
  multiplierNotes,
  renderSizingMarkdown,
  renderSizingText,
  sizingJson
};
