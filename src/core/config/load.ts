import { z } from 'zod';
import { checkWritten, valueAt, type JsonSchemaNode } from '../source/check-written.js';
import type { Problem } from '../source/problem.js';
import { readYaml, type FieldPath, type SourceLocationFinder } from '../source/yaml-source.js';
import { settingsSchema, writtenSettingsSchema, type Settings } from './schema.js';

/** Where the settings file is looked for, in order, when none is named. */
export const SETTINGS_FILE_NAMES = ['.plumbline.yml', '.plumbline.yaml'];

let cachedJsonSchema: JsonSchemaNode | undefined;
export function settingsJsonSchema(): JsonSchemaNode {
  cachedJsonSchema ??= {
    $id: 'https://plumbline.dev/schema/settings.schema.json',
    title: 'Plumbline settings file',
    ...(z.toJSONSchema(writtenSettingsSchema, { io: 'input', target: 'draft-2020-12' }) as JsonSchemaNode),
  };
  return cachedJsonSchema;
}

export type SettingsLoadResult = { ok: true; settings: Settings; locate: SourceLocationFinder; isWritten: (path: FieldPath) => boolean } | { ok: false; errors: Problem[] };

/** The defaults, as if an empty settings file had been written. */
export function defaultSettings(): Settings {
  return settingsSchema.parse({});
}

/** Text of the settings file (or undefined when there is none) -> settings, or the problems in it. */
export function loadSettings(text: string | undefined, file: string): SettingsLoadResult {
  if (text === undefined) return { ok: true, settings: defaultSettings(), locate: () => ({ file, line: 1, column: 1 }), isWritten: () => false };
  const read = readYaml(text, file, { maxBytes: 256 * 1024, maxAliases: 100 }, 'settings');
  if (!read.ok) return { ok: false, errors: read.problems };
  // An empty file (or one holding only comments) means "all defaults".
  const source = read.source.value === null || read.source.value === undefined ? { ...read.source, value: {} } : read.source;
  const checked = checkWritten(source, settingsSchema, settingsJsonSchema, 'settings');
  return checked.ok
    ? { ok: true, settings: checked.value, locate: (path: FieldPath) => read.source.locate(path), isWritten: (path: FieldPath) => valueAt(source.value, path) !== undefined }
    : { ok: false, errors: checked.problems };
}
