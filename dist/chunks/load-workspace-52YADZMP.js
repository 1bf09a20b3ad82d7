#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  loadWorkspace,
  ownFilesOf,
  requireWorkspace
} from "./chunk-LNPMABAN.js";
import "./chunk-TEADBEZM.js";
import "./chunk-JUBH45I5.js";
import "./chunk-ZPCHB3P2.js";
import "./chunk-NUQJLPGC.js";
import "./chunk-7ABR6JAH.js";
import "./chunk-EIDPB5F5.js";
import "./chunk-6GTMEVTP.js";
import "./chunk-BXF2RWJM.js";
import "./chunk-WOJBVI3K.js";
import "./chunk-NZOXBD7U.js";
import "./chunk-FUJ7I5KY.js";
export {
  loadWorkspace,
  ownFilesOf,
  requireWorkspace
};
