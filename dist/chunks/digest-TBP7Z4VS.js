#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  digestRepository,
  flagsInCode,
  todayIn
} from "./chunk-ZBIQMFDX.js";
import "./chunk-XZ7PS274.js";
import "./chunk-G6K6KKMR.js";
import "./chunk-A2NAIY4K.js";
import "./chunk-5JKBGEUQ.js";
import "./chunk-5N6F6GKY.js";
import "./chunk-WMETXK3J.js";
import "./chunk-B52SKDPA.js";
import "./chunk-NQBZBG6H.js";
import "./chunk-YAMIXLAQ.js";
import "./chunk-EIDPB5F5.js";
import "./chunk-5CGVWF3A.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-TEADBEZM.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-5CFAFUOS.js";
import "./chunk-FUJ7I5KY.js";
export {
  digestRepository,
  flagsInCode,
  todayIn
};
