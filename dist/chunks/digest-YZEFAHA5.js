#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  digestRepository,
  flagsInCode,
  todayIn
} from "./chunk-TARJNXNN.js";
import "./chunk-XZ7PS274.js";
import "./chunk-G6K6KKMR.js";
import "./chunk-B5FLNI6J.js";
import "./chunk-I3AB5CE6.js";
import "./chunk-26OHVEWY.js";
import "./chunk-2Z5D5NAA.js";
import "./chunk-54OF2UQO.js";
import "./chunk-R5CLG4G4.js";
import "./chunk-4F4MJKFM.js";
import "./chunk-J5RDXJJD.js";
import "./chunk-KSA5GFQK.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-PDUGBP5Q.js";
import "./chunk-TEADBEZM.js";
import "./chunk-ACAADDFF.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-7GKTQ2BG.js";
import "./chunk-FUJ7I5KY.js";
export {
  digestRepository,
  flagsInCode,
  todayIn
};
