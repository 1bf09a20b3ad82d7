#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  describeValue,
  expectedText,
  formatProblem,
  sortProblems
} from "./chunk-KAGGRZCD.js";
import "./chunk-FUJ7I5KY.js";
export {
  describeValue,
  expectedText,
  formatProblem,
  sortProblems
};
