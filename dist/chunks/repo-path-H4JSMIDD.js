#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  pathInRepository
} from "./chunk-4JE24R3H.js";
import "./chunk-FUJ7I5KY.js";
export {
  pathInRepository
};
