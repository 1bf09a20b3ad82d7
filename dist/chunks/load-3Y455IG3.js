#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  REGISTRY_LIMITS,
  buildRegistry,
  loadRegistryFile,
  registryJsonSchema
} from "./chunk-R5CLG4G4.js";
import "./chunk-4F4MJKFM.js";
import "./chunk-J5RDXJJD.js";
import "./chunk-KSA5GFQK.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-PDUGBP5Q.js";
import "./chunk-7GKTQ2BG.js";
import "./chunk-FUJ7I5KY.js";
export {
  REGISTRY_LIMITS,
  buildRegistry,
  loadRegistryFile,
  registryJsonSchema
};
