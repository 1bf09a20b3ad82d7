import { mkdir, readdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { dirname, join, relative, sep } from 'node:path';
import { randomBytes } from 'node:crypto';
import { ExternalError } from '../errors.js';
import type { RepoFiles } from '../ports.js';

const SKIPPED_FOLDERS = new Set(['.git', 'node_modules']);

/** RepoFiles over a folder on disk. */
export function createRepoFiles(root: string): RepoFiles {
  const readText = async (path: string): Promise<string | undefined> => {
    try {
      return await readFile(join(root, path), 'utf8');
    } catch (error) {
      if (isCode(error, 'ENOENT')) return undefined;
      if (isCode(error, 'EISDIR')) throw new ExternalError(`${path} is a folder, not a file`);
      throw new ExternalError(`cannot read ${path}`, undefined, { cause: error });
    }
  };
  return {
    readText,
    async readTexts(paths) {
      // A batch at a time: concurrent enough to hide latency, well under the open-file limit.
      const texts: (string | undefined)[] = [];
      for (let start = 0; start < paths.length; start += 64) {
        texts.push(...(await Promise.all(paths.slice(start, start + 64).map(readText))));
      }
      return texts;
    },
    async listFiles(folder) {
      const start = join(root, folder);
      const found: string[] = [];
      const walk = async (dir: string): Promise<void> => {
        let entries;
        try {
          entries = await readdir(dir, { withFileTypes: true });
        } catch (error) {
          if (isCode(error, 'ENOENT') || isCode(error, 'ENOTDIR')) return;
          throw new ExternalError(`cannot read the folder ${relative(root, dir) || '.'}`, undefined, { cause: error });
        }
        for (const entry of entries) {
          if (entry.isDirectory()) {
            if (!SKIPPED_FOLDERS.has(entry.name)) await walk(join(dir, entry.name));
          } else if (entry.isFile()) {
            found.push(relative(root, join(dir, entry.name)).split(sep).join('/'));
          }
        }
      };
      await walk(start);
      return found.sort();
    },
  };
}

/**
 * Writes a file so that it is either complete or absent: text goes to a temporary file beside
 * the target, which is then renamed over it (rename is atomic within one file system).
 */
export async function writeFileAtomic(path: string, text: string, options: { overwrite: boolean }): Promise<void> {
  await mkdir(dirname(path), { recursive: true });
  const temporary = `${path}.${randomBytes(6).toString('hex')}.tmp`;
  try {
    await writeFile(temporary, text, { encoding: 'utf8', flag: 'wx' });
    if (!options.overwrite) {
      // Creating the target exclusively first makes "refuse to overwrite" race-free.
      await writeFile(path, '', { flag: 'wx' });
    }
    await rename(temporary, path);
  } catch (error) {
    await rm(temporary, { force: true });
    if (isCode(error, 'EEXIST')) throw new ExternalError(`${path} already exists`, 'pass --force to replace it, or choose another --id');
    throw new ExternalError(`cannot write ${path}`, undefined, { cause: error });
  }
}

function isCode(error: unknown, code: string): boolean {
  return typeof error === 'object' && error !== null && (error as { code?: unknown }).code === code;
}

