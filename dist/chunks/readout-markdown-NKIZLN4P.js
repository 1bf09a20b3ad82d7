#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  metricTitle,
  renderReadoutMarkdown,
  table
} from "./chunk-BNTHVXFQ.js";
import "./chunk-7H6MHGDI.js";
import "./chunk-YHYDL5HF.js";
import "./chunk-ACAADDFF.js";
import "./chunk-FUJ7I5KY.js";
export {
  metricTitle,
  renderReadoutMarkdown,
  table
};
