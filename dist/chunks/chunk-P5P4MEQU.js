#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  ExternalError
} from "./chunk-TEADBEZM.js";

// src/adapters/sql/result.ts
var DataFaultError = class extends ExternalError {
  constructor(message, hint, fault, options) {
    super(message, hint, options);
    this.fault = fault;
  }
  fault;
};

export {
  DataFaultError
};
