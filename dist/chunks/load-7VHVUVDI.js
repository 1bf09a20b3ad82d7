#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  SETTINGS_FILE_NAMES,
  defaultSettings,
  loadSettings,
  settingsJsonSchema
} from "./chunk-TLWZYCJO.js";
import "./chunk-JLYO35IC.js";
import "./chunk-6TRXKJK6.js";
import "./chunk-B52SKDPA.js";
import "./chunk-LSO7NHYS.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-KAGGRZCD.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";
export {
  SETTINGS_FILE_NAMES,
  defaultSettings,
  loadSettings,
  settingsJsonSchema
};
