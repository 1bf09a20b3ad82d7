#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  SETTINGS_FILE_NAMES,
  defaultSettings,
  loadSettings,
  settingsJsonSchema
} from "./chunk-2Z5D5NAA.js";
import "./chunk-54OF2UQO.js";
import "./chunk-4F4MJKFM.js";
import "./chunk-J5RDXJJD.js";
import "./chunk-KSA5GFQK.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-PDUGBP5Q.js";
import "./chunk-X2H4NLT2.js";
import "./chunk-7GKTQ2BG.js";
import "./chunk-FUJ7I5KY.js";
export {
  SETTINGS_FILE_NAMES,
  defaultSettings,
  loadSettings,
  settingsJsonSchema
};
