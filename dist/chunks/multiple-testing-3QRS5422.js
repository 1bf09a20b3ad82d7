#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  adjustPValues,
  benjaminiHochberg,
  bonferroniAdjust,
  holmAdjust
} from "./chunk-PTQPFAEX.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-FUJ7I5KY.js";
export {
  adjustPValues,
  benjaminiHochberg,
  bonferroniAdjust,
  holmAdjust
};
