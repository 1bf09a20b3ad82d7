#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  REGISTRY_LIMITS,
  buildRegistry,
  loadRegistryFile,
  registryJsonSchema
} from "./chunk-J3CQQVSX.js";
import "./chunk-LSO7NHYS.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-KAGGRZCD.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";
export {
  REGISTRY_LIMITS,
  buildRegistry,
  loadRegistryFile,
  registryJsonSchema
};
