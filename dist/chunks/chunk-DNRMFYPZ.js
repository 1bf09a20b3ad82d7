#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);

// src/adapters/sql/engine-faults.ts
function duckDbFault(message) {
  const missing = /Referenced column "((?:[^"]|"")+)" not found/.exec(message);
  if (missing) return { kind: "missing-column", column: missing[1].replace(/""/g, '"') };
  const csvLine = /CSV Error on Line: (\d+)/.exec(message);
  if (csvLine) {
    const converting = /Error when converting column "((?:[^"]|"")+)"\. Could not convert string "(.*?)" to '([^']+)'/.exec(message);
    const file = /^\s*file = (.+)$/m.exec(message)?.[1]?.trim();
    return {
      kind: "bad-value",
      line: Number(csvLine[1]),
      ...converting ? { column: converting[1].replace(/""/g, '"'), value: converting[2], type: converting[3] } : {},
      ...file ? { file } : {}
    };
  }
  if (/^Conversion Error:/.test(message)) {
    const value = /"((?:[^"\\]|\\.)*)"/.exec(message)?.[1];
    const column = /when casting from source column (\S+)/.exec(message)?.[1];
    return { kind: "bad-value", ...column ? { column } : {}, ...value !== void 0 ? { value } : {} };
  }
  return void 0;
}
function postgresFault(error) {
  if (error.code === "42703") {
    const named = /column "((?:[^"]|"")+)" does not exist/.exec(error.message)?.[1]?.replace(/""/g, '"') ?? /column (?:\S+\.)?(\S+) does not exist/.exec(error.message)?.[1];
    return named ? { kind: "missing-column", column: named } : void 0;
  }
  if (error.code === "22P02" || error.code === "22007" || error.code === "22008") {
    const value = /: "(.*)"$/.exec(error.message)?.[1];
    return { kind: "bad-value", ...value !== void 0 ? { value } : {} };
  }
  return void 0;
}

export {
  duckDbFault,
  postgresFault
};
