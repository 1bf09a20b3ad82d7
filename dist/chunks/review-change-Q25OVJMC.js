#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  reviewChange
} from "./chunk-QPV2XDIR.js";
import "./chunk-HGOBTQHY.js";
import "./chunk-GIF3ITND.js";
import "./chunk-TH3NNBTK.js";
import "./chunk-KWOGD6NP.js";
import "./chunk-XZ7PS274.js";
import "./chunk-G6K6KKMR.js";
import "./chunk-ZWIGW2MY.js";
import "./chunk-V65C5FSR.js";
import "./chunk-NZ6ZJYU3.js";
import "./chunk-TLWZYCJO.js";
import "./chunk-JLYO35IC.js";
import "./chunk-6TRXKJK6.js";
import "./chunk-B52SKDPA.js";
import "./chunk-J3CQQVSX.js";
import "./chunk-LSO7NHYS.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-KAGGRZCD.js";
import "./chunk-OICJSZPX.js";
import "./chunk-ACAADDFF.js";
import "./chunk-PTQPFAEX.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";
export {
  reviewChange
};
