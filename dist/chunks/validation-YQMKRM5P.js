#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  VALIDATION_JSON_FORMAT,
  count,
  noPlanFilesHint,
  renderValidationText,
  validationJson
} from "./chunk-SGDUUXBQ.js";
import "./chunk-KAGGRZCD.js";
import "./chunk-D7CL2H7J.js";
import "./chunk-FUJ7I5KY.js";
export {
  VALIDATION_JSON_FORMAT,
  count,
  noPlanFilesHint,
  renderValidationText,
  validationJson
};
