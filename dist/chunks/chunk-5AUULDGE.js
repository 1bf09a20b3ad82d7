#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  ExternalError
} from "./chunk-OICJSZPX.js";

// src/adapters/files.ts
import { mkdir, readdir, readFile, rename, rm, writeFile } from "node:fs/promises";
import { dirname, join, relative, sep } from "node:path";
import { randomBytes } from "node:crypto";
var SKIPPED_FOLDERS = /* @__PURE__ */ new Set([".git", "node_modules"]);
function createRepoFiles(root) {
  const readText = async (path) => {
    try {
      return await readFile(join(root, path), "utf8");
    } catch (error) {
      if (isCode(error, "ENOENT")) return void 0;
      if (isCode(error, "EISDIR")) throw new ExternalError(`${path} is a folder, not a file`);
      throw new ExternalError(`cannot read ${path}`, void 0, { cause: error });
    }
  };
  return {
    readText,
    async readTexts(paths) {
      const texts = [];
      for (let start = 0; start < paths.length; start += 64) {
        texts.push(...await Promise.all(paths.slice(start, start + 64).map(readText)));
      }
      return texts;
    },
    async listFiles(folder) {
      const start = join(root, folder);
      const found = [];
      const walk = async (dir) => {
        let entries;
        try {
          entries = await readdir(dir, { withFileTypes: true });
        } catch (error) {
          if (isCode(error, "ENOENT") || isCode(error, "ENOTDIR")) return;
          throw new ExternalError(`cannot read the folder ${relative(root, dir) || "."}`, void 0, { cause: error });
        }
        for (const entry of entries) {
          if (entry.isDirectory()) {
            if (!SKIPPED_FOLDERS.has(entry.name)) await walk(join(dir, entry.name));
          } else if (entry.isFile()) {
            found.push(relative(root, join(dir, entry.name)).split(sep).join("/"));
          }
        }
      };
      await walk(start);
      return found.sort();
    }
  };
}
async function writeFileAtomic(path, text, options) {
  await mkdir(dirname(path), { recursive: true });
  const temporary = `${path}.${randomBytes(6).toString("hex")}.tmp`;
  try {
    await writeFile(temporary, text, { encoding: "utf8", flag: "wx" });
    if (!options.overwrite) {
      await writeFile(path, "", { flag: "wx" });
    }
    await rename(temporary, path);
  } catch (error) {
    await rm(temporary, { force: true });
    if (isCode(error, "EEXIST")) throw new ExternalError(`${path} already exists`, "pass --force to replace it, or choose another --id");
    throw new ExternalError(`cannot write ${path}`, void 0, { cause: error });
  }
}
function isCode(error, code) {
  return typeof error === "object" && error !== null && error.code === code;
}

export {
  createRepoFiles,
  writeFileAtomic
};
