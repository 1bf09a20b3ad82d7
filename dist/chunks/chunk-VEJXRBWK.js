#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  ExternalError
} from "./chunk-OICJSZPX.js";

// src/adapters/git.ts
import { spawn } from "node:child_process";
import { closeSync, constants, fstatSync, openSync, readSync } from "node:fs";
import { join } from "node:path";
function runGit(cwd, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn("git", ["-c", "core.quotePath=false", "-c", "diff.noprefix=false", "-c", "color.ui=false", ...args], {
      cwd,
      stdio: ["pipe", "pipe", "pipe"]
    });
    const out = [];
    const err = [];
    child.stdout.on("data", (chunk) => out.push(chunk));
    child.stderr.on("data", (chunk) => err.push(chunk));
    child.on(
      "error",
      (error) => reject(new ExternalError("cannot run git", "install git and make sure it is on the PATH", { cause: error }))
    );
    child.on("close", (code) => {
      if (code === 0 || options.allow?.includes(code ?? -1)) resolve(Buffer.concat(out));
      else {
        const stderr = Buffer.concat(err).toString("utf8").trim();
        reject(new ExternalError(`git ${args.join(" ")} failed: ${stderr || `exit code ${code}`}`, hintFor(stderr)));
      }
    });
    child.stdin.on("error", () => void 0);
    child.stdin.end(options.input ?? "");
  });
}
function hintFor(stderr) {
  if (/not a git repository/i.test(stderr)) return "run plumbline inside a git repository, or pass --cwd";
  if (/unknown revision|bad revision|Needed a single revision|invalid object name/i.test(stderr)) {
    return "check --base and --head; in a shallow clone (actions/checkout fetches one commit by default) fetch more history, e.g. fetch-depth: 0";
  }
  return void 0;
}
async function resolveCommit(cwd, ref, flag) {
  try {
    return (await runGit(cwd, ["rev-parse", "--verify", "--end-of-options", `${ref}^{commit}`])).toString("utf8").trim();
  } catch (error) {
    const hint = error instanceof ExternalError ? error.hint : void 0;
    throw new ExternalError(`${flag} ${ref} is not a commit in this repository`, hint ?? "check the ref name", { cause: error });
  }
}
async function resolveEnds(cwd, baseRef, headRef) {
  const together = await runGit(cwd, ["rev-parse", "--end-of-options", `${headRef}^{commit}`, `${baseRef}^{commit}`, "HEAD"]).then((out) => out.toString("utf8").trim().split("\n").filter((line) => line !== "--end-of-options")).catch(() => []);
  if (together.length === 3 && together.every((id) => /^[0-9a-f]{40,64}$/.test(id))) return { head: together[0], baseTip: together[1], checkedOut: together[2] };
  const [head, baseTip] = await Promise.all([resolveCommit(cwd, headRef, "--head"), resolveCommit(cwd, baseRef, "--base")]);
  const checkedOut = (await runGit(cwd, ["rev-parse", "--verify", "--quiet", "HEAD"], { allow: [1] })).toString("utf8").trim();
  return { head, baseTip, checkedOut };
}
var nulList = (out) => new Set(out.toString("utf8").split("\0").filter(Boolean));
async function openChange(repoDir, baseRef, headRef) {
  const speculative = !baseRef.startsWith("-") && !headRef.startsWith("-");
  const mergeBaseOfRefs = speculative ? runGit(repoDir, ["merge-base", baseRef, headRef], { allow: [1] }).catch(() => void 0) : Promise.resolve(void 0);
  const dirtyPaths = runGit(repoDir, ["diff", "--name-only", "-z", "--no-renames", "HEAD", "--"]).then(nulList, () => void 0);
  const { head, baseTip, checkedOut } = await resolveEnds(repoDir, baseRef, headRef);
  const mergeBase = (await mergeBaseOfRefs ?? await runGit(repoDir, ["merge-base", baseTip, head], { allow: [1] })).toString("utf8").trim();
  const base = mergeBase || baseTip;
  const commitOf = (side) => side === "base" ? base : head;
  const headView = dirtyPaths.then(async (dirty) => {
    if (!dirty || !checkedOut) return void 0;
    if (checkedOut === head) return { dirty, differs: /* @__PURE__ */ new Set() };
    const differs = await runGit(repoDir, ["diff-tree", "-r", "-z", "--no-renames", "--name-only", checkedOut, head]).then(nulList, () => void 0);
    return differs ? { dirty, differs } : void 0;
  });
  const checkedOutIsHead = headView.then((view) => view !== void 0 && view.differs.size === 0 && view.dirty.size === 0 && checkedOut === head);
  const onDisk = async (side) => {
    const view = side === "head" ? await headView : void 0;
    return view ? (path) => !view.dirty.has(path) && !view.differs.has(path) : void 0;
  };
  const listings = /* @__PURE__ */ new Map();
  const listingOf = (commit) => {
    let listing = listings.get(commit);
    if (!listing) {
      listing = runGit(repoDir, ["ls-tree", "-r", "-z", "--full-tree", commit]).then(parseTreeListing);
      listings.set(commit, listing);
    }
    return listing;
  };
  const trackedCache = /* @__PURE__ */ new Map();
  const trackedFiles = (side) => {
    const commit = commitOf(side);
    let cached = trackedCache.get(commit);
    if (!cached) {
      cached = (side === "head" ? checkedOutIsHead : Promise.resolve(false)).then(
        async (clean) => clean ? (await runGit(repoDir, ["ls-files", "-z"])).toString("utf8").split("\0").filter(Boolean).sort() : (await listingOf(commit)).paths
      );
      trackedCache.set(commit, cached);
    }
    return cached;
  };
  const folderListings = /* @__PURE__ */ new Map();
  const filesBelow = (side, prefix) => {
    const commit = commitOf(side);
    if (prefix === "" || side === "head" || listings.has(commit)) return trackedFiles(side).then((all) => all.filter((p) => p.startsWith(prefix)));
    const key = `${commit}\0${prefix}`;
    let cached = folderListings.get(key);
    if (!cached) {
      cached = runGit(repoDir, ["--literal-pathspecs", "ls-tree", "-r", "-z", "--full-tree", commit, "--", prefix]).then((out) => parseTreeListing(out).paths.filter((p) => p.startsWith(prefix)));
      folderListings.set(key, cached);
    }
    return cached;
  };
  const streamFiles = async (side, paths, onFile) => {
    if (side === "head" && await checkedOutIsHead) return readWorkingTreeSync(repoDir, paths, onFile, { codeOnly: true });
    const [listing, fromDisk] = await Promise.all([listingOf(commitOf(side)), onDisk(side)]);
    const requests = [];
    const wanted = [];
    for (const path of paths) {
      const blob = listing.blobs.get(path);
      if (!blob) continue;
      const disk = fromDisk?.(path) ?? false;
      wanted.push({ path, disk });
      if (!disk) requests.push({ path, spec: blob.oid, at: wanted.length - 1 });
    }
    let next = 0;
    const diskUpTo = (end) => {
      const run = [];
      for (; next < end; next++) if (wanted[next].disk) run.push(wanted[next].path);
      if (run.length) readWorkingTreeSync(repoDir, run, onFile, { codeOnly: true });
    };
    await catFiles(repoDir, requests, (path, bytes, request) => {
      diskUpTo(request.at);
      next = request.at + 1;
      onFile(path, bytes);
    }, { skipBinary: true, maxBytes: MAX_SCANNED_FILE_BYTES });
    diskUpTo(wanted.length);
  };
  const filesAt = (side) => {
    const readTexts = async (paths) => {
      const found = /* @__PURE__ */ new Map();
      const keep = (path, bytes) => found.set(path, bytes.toString("utf8"));
      const fromDisk = await onDisk(side);
      const tracked = fromDisk ? new Set(await trackedFiles(side)) : void 0;
      const disk = tracked ? paths.filter((p) => tracked.has(p) && fromDisk(p)) : [];
      const fromGit = tracked ? paths.filter((p) => tracked.has(p) && !fromDisk(p)) : paths;
      const requests = fromGit.map((path) => ({ path, spec: `${commitOf(side)}:${path}` }));
      readWorkingTreeSync(repoDir, disk, keep, { codeOnly: false });
      await catFiles(repoDir, requests, keep, { skipBinary: false });
      return paths.map((p) => found.get(p));
    };
    return {
      async listFiles(folder) {
        const prefix = folder === "" || folder === "." ? "" : `${folder.replace(/\/+$/, "")}/`;
        return filesBelow(side, prefix);
      },
      async readText(path) {
        return (await readTexts([path]))[0];
      },
      readTexts
    };
  };
  return {
    base,
    head,
    baseTip,
    async changedFiles() {
      const out = (await runGit(repoDir, ["diff", "--name-status", "-z", "-M", base, head])).toString("utf8");
      return parseNameStatus(out);
    },
    async diff() {
      return (await runGit(repoDir, ["diff", "--unified=0", "--no-ext-diff", "--no-textconv", "-M", "--src-prefix=a/", "--dst-prefix=b/", base, head])).toString("utf8");
    },
    filesAt,
    streamFiles,
    trackedFiles
  };
}
function parseNameStatus(out) {
  const parts = out.split("\0").filter((p) => p !== "");
  const files = [];
  for (let i = 0; i < parts.length; ) {
    const code = parts[i++];
    if (code.startsWith("R") || code.startsWith("C")) {
      const previousPath = parts[i++];
      const path = parts[i++];
      files.push({ path, status: "renamed", previousPath });
    } else {
      const path = parts[i++];
      files.push({ path, status: code === "A" ? "added" : code === "D" ? "deleted" : "modified" });
    }
  }
  return files;
}
var NO_FOLLOW_READ = constants.O_RDONLY | constants.O_NOFOLLOW;
var MAX_SCANNED_FILE_BYTES = 16 * 1024 * 1024;
var BINARY_PROBE_BYTES = 8e3;
function parseTreeListing(out) {
  const paths = [];
  const blobs = /* @__PURE__ */ new Map();
  for (const entry of out.toString("utf8").split("\0")) {
    const tab = entry.indexOf("	");
    if (tab < 0) continue;
    const [mode, type, oid] = entry.slice(0, tab).split(/ +/);
    const path = entry.slice(tab + 1);
    paths.push(path);
    if (type === "blob" && oid && (mode === "100644" || mode === "100755")) blobs.set(path, { oid });
  }
  return { paths: paths.sort(), blobs };
}
function catFiles(cwd, requests, onFile, options) {
  const asked = requests.filter((r) => !r.spec.includes("\n"));
  if (asked.length === 0) return Promise.resolve();
  return new Promise((resolve, reject) => {
    const child = spawn("git", ["cat-file", "--batch", "--buffer"], { cwd, stdio: ["pipe", "pipe", "pipe"] });
    let failed;
    let index = 0;
    let header = "";
    let remaining = -1;
    let size = 0;
    let deliver = false;
    let filled = 0;
    let probed = false;
    let spill = Buffer.allocUnsafe(1 << 20);
    const err = [];
    const consume = (chunk) => {
      let at = 0;
      while (at < chunk.length) {
        if (remaining === -1) {
          const newline = chunk.indexOf(10, at);
          if (newline < 0) {
            header += chunk.toString("latin1", at);
            return;
          }
          header += chunk.toString("latin1", at, newline);
          at = newline + 1;
          const fields = header.split(" ");
          const absent = header.endsWith(" missing") || header.endsWith(" ambiguous");
          header = "";
          if (absent || fields.length !== 3) {
            index++;
            continue;
          }
          size = Number(fields[2]);
          remaining = size;
          filled = 0;
          deliver = fields[1] === "blob" && size <= (options.maxBytes ?? Infinity);
          probed = !options.skipBinary;
          if (deliver && at + size < chunk.length && chunk[at + size] === 10) {
            const bytes = chunk.subarray(at, at + size);
            if (probed || !looksBinaryStart(bytes)) onFile(asked[index].path, bytes, asked[index]);
            at += size + 1;
            index++;
            remaining = -1;
            continue;
          }
          if (deliver && size > spill.length) spill = Buffer.allocUnsafe(Math.max(size, spill.length * 2));
          continue;
        }
        if (remaining > 0) {
          const n = Math.min(remaining, chunk.length - at);
          if (deliver) {
            chunk.copy(spill, filled, at, at + n);
            filled += n;
            if (!probed && filled >= Math.min(size, BINARY_PROBE_BYTES)) {
              probed = true;
              if (looksBinaryStart(spill.subarray(0, filled))) deliver = false;
            }
          }
          at += n;
          remaining -= n;
          continue;
        }
        at++;
        if (deliver) onFile(asked[index].path, spill.subarray(0, size), asked[index]);
        index++;
        remaining = -1;
      }
    };
    child.stdout.on("data", (chunk) => {
      if (failed !== void 0) return;
      try {
        consume(chunk);
      } catch (error) {
        failed = error;
        child.kill();
      }
    });
    child.stderr.on("data", (chunk) => err.push(chunk));
    child.on("error", (error) => reject(new ExternalError("cannot run git", "install git and make sure it is on the PATH", { cause: error })));
    child.on("close", (code) => {
      if (failed !== void 0) reject(failed);
      else if (code === 0) resolve();
      else reject(new ExternalError(`git cat-file failed: ${Buffer.concat(err).toString("utf8").trim() || `exit code ${code}`}`));
    });
    child.stdin.on("error", () => void 0);
    child.stdin.end(asked.map((r) => `${r.spec}
`).join(""));
  });
}
function looksBinaryStart(bytes) {
  return bytes.subarray(0, BINARY_PROBE_BYTES).indexOf(0) !== -1;
}
var readBuffer = Buffer.allocUnsafe(1 << 20);
function readWorkingTreeSync(root, paths, onFile, options) {
  for (const path of paths) {
    let fd;
    try {
      fd = openSync(join(root, path), options.codeOnly ? NO_FOLLOW_READ : "r");
      const size = fstatSync(fd).size;
      if (options.codeOnly && size > MAX_SCANNED_FILE_BYTES) continue;
      if (size > readBuffer.length) readBuffer = Buffer.allocUnsafe(Math.max(size, readBuffer.length * 2));
      let read = 0;
      while (read < size) {
        const n = readSync(fd, readBuffer, read, size - read, read);
        if (n === 0) break;
        read += n;
      }
      const bytes = readBuffer.subarray(0, read);
      if (!options.codeOnly || !looksBinaryStart(bytes)) onFile(path, bytes);
    } catch {
    } finally {
      if (fd !== void 0) closeSync(fd);
    }
  }
}
async function readFileAtCommit(dir, commit, path) {
  const inRepository = await runGit(dir, ["rev-parse", "--is-inside-work-tree"], { allow: [128] }).then(
    (out) => out.toString("utf8").trim() === "true",
    () => false
  );
  if (!inRepository) return { found: false, reason: "no-repository" };
  const full = (await runGit(dir, ["rev-parse", "--verify", "--quiet", "--end-of-options", `${commit}^{commit}`], { allow: [1, 128] })).toString("utf8").trim();
  if (!/^[0-9a-f]{40,64}$/.test(full)) return { found: false, reason: "no-commit" };
  const blob = (await runGit(dir, ["rev-parse", "--verify", "--quiet", "--end-of-options", `${full}:./${path}`], { allow: [1, 128] })).toString("utf8").trim();
  if (!/^[0-9a-f]{40,64}$/.test(blob)) return { found: false, reason: "no-file", commit: full };
  const text = (await runGit(dir, ["cat-file", "blob", blob])).toString("utf8");
  return { found: true, text, commit: full };
}
async function planCommitAtLaunch(repoDir, file) {
  const git = (args) => runGit(repoDir, args).then((out) => out.toString("utf8").trim(), () => "");
  const candidates = (await git(["log", "--format=%H", "--reverse", "-G", "^state:[[:space:]]*live", "--", file])).split("\n").filter(Boolean);
  for (const commit of candidates) {
    const text = await git(["show", `${commit}:./${file}`]);
    if (/^state:[ \t]*live\b/m.test(text)) return { commit, how: "went-live" };
  }
  const latest = await git(["log", "-1", "--format=%H", "--", file]);
  return latest ? { commit: latest, how: "latest" } : void 0;
}

export {
  openChange,
  parseNameStatus,
  MAX_SCANNED_FILE_BYTES,
  parseTreeListing,
  readFileAtCommit,
  planCommitAtLaunch
};
