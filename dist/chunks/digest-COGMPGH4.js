#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  digestRepository,
  flagsInCode,
  todayIn
} from "./chunk-43R4DCR4.js";
import "./chunk-XZ7PS274.js";
import "./chunk-G6K6KKMR.js";
import "./chunk-JS5YSD7N.js";
import "./chunk-V65C5FSR.js";
import "./chunk-MBUMMPQG.js";
import "./chunk-DZWOIIFA.js";
import "./chunk-B52SKDPA.js";
import "./chunk-DLUUJFVQ.js";
import "./chunk-SEUGDIED.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-PDUGBP5Q.js";
import "./chunk-TEADBEZM.js";
import "./chunk-ACAADDFF.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";
export {
  digestRepository,
  flagsInCode,
  todayIn
};
