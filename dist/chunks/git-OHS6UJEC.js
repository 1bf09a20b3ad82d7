#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  MAX_SCANNED_FILE_BYTES,
  openChange,
  parseNameStatus,
  parseTreeListing,
  planCommitAtLaunch,
  readFileAtCommit
} from "./chunk-VEJXRBWK.js";
import "./chunk-OICJSZPX.js";
import "./chunk-FUJ7I5KY.js";
export {
  MAX_SCANNED_FILE_BYTES,
  openChange,
  parseNameStatus,
  parseTreeListing,
  planCommitAtLaunch,
  readFileAtCommit
};
