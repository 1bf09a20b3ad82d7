#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  describeValue,
  formatProblem,
  sortProblems
} from "./chunk-PDUGBP5Q.js";
import "./chunk-FUJ7I5KY.js";
export {
  describeValue,
  formatProblem,
  sortProblems
};
