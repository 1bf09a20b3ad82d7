#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  metricTitle,
  renderReadoutMarkdown,
  table
} from "./chunk-HYEQ4ILC.js";
import "./chunk-35APDGCM.js";
import "./chunk-7H6MHGDI.js";
import "./chunk-5CFAFUOS.js";
import "./chunk-FUJ7I5KY.js";
export {
  metricTitle,
  renderReadoutMarkdown,
  table
};
