#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  digestRepository,
  flagsInCode,
  todayIn
} from "./chunk-FT3KTCWV.js";
import "./chunk-XZ7PS274.js";
import "./chunk-G6K6KKMR.js";
import "./chunk-LMYLO64G.js";
import "./chunk-EWPHPA3J.js";
import "./chunk-3F7Z4EK6.js";
import "./chunk-V65C5FSR.js";
import "./chunk-B52SKDPA.js";
import "./chunk-QSHJDALO.js";
import "./chunk-5EY27FK2.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-PDUGBP5Q.js";
import "./chunk-TEADBEZM.js";
import "./chunk-5CFAFUOS.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";
export {
  digestRepository,
  flagsInCode,
  todayIn
};
