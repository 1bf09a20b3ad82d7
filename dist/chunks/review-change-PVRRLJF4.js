#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  reviewChange
} from "./chunk-W4AFTGPJ.js";
import "./chunk-KWOWGGXK.js";
import "./chunk-I35W5DNY.js";
import "./chunk-YAC4MOH6.js";
import "./chunk-JYU2RKGU.js";
import "./chunk-XZ7PS274.js";
import "./chunk-G6K6KKMR.js";
import "./chunk-KAGJO626.js";
import "./chunk-PEYXXXNZ.js";
import "./chunk-YCVBVJ6H.js";
import "./chunk-ZTY24AJV.js";
import "./chunk-B52SKDPA.js";
import "./chunk-E7EWUPQ7.js";
import "./chunk-5A7OB2Z6.js";
import "./chunk-ECKP7NMA.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-PDUGBP5Q.js";
import "./chunk-TEADBEZM.js";
import "./chunk-ACAADDFF.js";
import "./chunk-PTQPFAEX.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-FUJ7I5KY.js";
export {
  reviewChange
};
