#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  reviewChange
} from "./chunk-IFEEPVPQ.js";
import "./chunk-ZPIGQDD3.js";
import "./chunk-CGU3DASN.js";
import "./chunk-I36QVQA3.js";
import "./chunk-CJSWRN65.js";
import "./chunk-XZ7PS274.js";
import "./chunk-G6K6KKMR.js";
import "./chunk-GP32HYB2.js";
import "./chunk-I3AB5CE6.js";
import "./chunk-JBVNQSW6.js";
import "./chunk-CD6WOGVM.js";
import "./chunk-54OF2UQO.js";
import "./chunk-WFNG3OL5.js";
import "./chunk-ACARCTR5.js";
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
