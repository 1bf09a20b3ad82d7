#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/errors.ts
var UsageError = class extends Error {
  constructor(message, hint) {
    super(message);
    this.hint = hint;
  }
  hint;
  name = "UsageError";
};
var ExternalError = class extends Error {
  constructor(message, hint, options) {
    super(message, options);
    this.hint = hint;
  }
  hint;
  name = "ExternalError";
};
var DataFaultError = class extends ExternalError {
  constructor(message, hint, fault, options) {
    super(message, hint, options);
    this.fault = fault;
  }
  fault;
};
var BUG_REPORT_HINT = "This is a bug in Plumbline, not in your files. Please open an issue with the command you ran and the output above.";

export {
  UsageError,
  ExternalError,
  DataFaultError,
  BUG_REPORT_HINT
};
