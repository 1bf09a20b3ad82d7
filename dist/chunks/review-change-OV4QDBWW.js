#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  reviewChange
} from "./chunk-NRLXQ5EA.js";
import "./chunk-4S7E2DX7.js";
import "./chunk-CGU3DASN.js";
import "./chunk-SOGAVRB3.js";
import "./chunk-AEFGSGCU.js";
import "./chunk-XZ7PS274.js";
import "./chunk-G6K6KKMR.js";
import "./chunk-JLFYGTLW.js";
import "./chunk-I3AB5CE6.js";
import "./chunk-GSB2BMT7.js";
import "./chunk-TORA5I44.js";
import "./chunk-54OF2UQO.js";
import "./chunk-3KFMUS7P.js";
import "./chunk-TSPSTEZJ.js";
import "./chunk-J5RDXJJD.js";
import "./chunk-KSA5GFQK.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-KAGGRZCD.js";
import "./chunk-TEADBEZM.js";
import "./chunk-ACAADDFF.js";
import "./chunk-PTQPFAEX.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-7GKTQ2BG.js";
import "./chunk-FUJ7I5KY.js";
export {
  reviewChange
};
