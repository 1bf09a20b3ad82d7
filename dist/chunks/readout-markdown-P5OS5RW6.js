#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  metricTitle,
  renderReadoutMarkdown,
  table
} from "./chunk-WEHQQR5J.js";
import "./chunk-OLV4RVGO.js";
import "./chunk-7H6MHGDI.js";
import "./chunk-ACAADDFF.js";
import "./chunk-FUJ7I5KY.js";
export {
  metricTitle,
  renderReadoutMarkdown,
  table
};
