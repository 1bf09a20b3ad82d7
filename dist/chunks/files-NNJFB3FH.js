#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  createRepoFiles,
  writeFileAtomic
} from "./chunk-5WPKM5EJ.js";
import "./chunk-TEADBEZM.js";
import "./chunk-FUJ7I5KY.js";
export {
  createRepoFiles,
  writeFileAtomic
};
