#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  SETTINGS_FILE_NAMES,
  defaultSettings,
  loadSettings,
  settingsJsonSchema
} from "./chunk-DZWOIIFA.js";
import "./chunk-B52SKDPA.js";
import "./chunk-SEUGDIED.js";
import "./chunk-XJ3K7LET.js";
import "./chunk-MGCIOLH6.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-PDUGBP5Q.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-5GP5B2QS.js";
import "./chunk-FUJ7I5KY.js";
export {
  SETTINGS_FILE_NAMES,
  defaultSettings,
  loadSettings,
  settingsJsonSchema
};
