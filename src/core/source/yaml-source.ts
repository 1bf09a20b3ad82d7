import { CST, Composer, LineCounter, Parser, isMap, isPair, isScalar, isSeq, visit, type Document, type Node } from 'yaml';
import { formatFieldPath } from './check-written.js';
import { explainUnclosedBracket, explainYamlError } from './yaml-messages.js';
import type { Problem, SourceLocation } from './problem.js';

/** Limits that keep a hostile or accidental file from exhausting memory. */
export interface YamlLimits {
  /** Largest accepted file, in bytes of UTF-8 text. */
  maxBytes: number;
  /** Most alias expansions; the `yaml` package's own guard against "billion laughs" documents. */
  maxAliases: number;
}

/**
 * The deepest nesting of lists and mappings a file may have. Our formats nest at most six levels; 32 leaves room
 * for any hand-written file while keeping every recursive step after parsing (the yaml package's composer and
 * toJS, zod, our own walks) far from the engine's stack limit.
 */
export const MAX_NESTING_DEPTH = 32;

export type FieldPath = readonly (string | number)[];

export type SourceLocationFinder = (path: FieldPath) => SourceLocation;

/** A parsed YAML file that can say where any field of it was written. */
export interface YamlSource {
  file: string;
  value: unknown;
  /** Where the value at `path` starts; falls back to the deepest written ancestor when the field is absent. */
  locate(path: FieldPath): SourceLocation;
  /** Where the key `key` of the mapping at `path` is written (for unknown-key messages). */
  locateKey(path: FieldPath, key: string): SourceLocation;
  /**
   * The line of every key and list item under `root`, by field path relative to `root` (`window.end`,
   * `metrics.guardrails[0]`), from one walk of the parsed nodes. Keys under an alias are not listed:
   * a finding about one points at the alias, its nearest written parent.
   */
  keyLines(root?: FieldPath): Map<string, number>;
}

export type YamlReadResult = { ok: true; source: YamlSource } | { ok: false; problems: Problem[] };

/**
 * Parses one YAML document keeping source positions. Bad YAML, several documents in one file,
 * duplicate keys, oversized input and alias bombs all come back as problems, never as a throw.
 */
export function readYaml(text: string, file: string, limits: YamlLimits, codePrefix: string): YamlReadResult {
  const fail = (line: number, column: number, code: string, message: string, expected?: string, field = ''): YamlReadResult => ({
    ok: false,
    problems: [{ severity: 'error', code: `${codePrefix}/${code}`, file, line, column, field, message, ...(expected ? { expected } : {}) }],
  });

  const bytes = Buffer.byteLength(text, 'utf8');
  if (bytes > limits.maxBytes) {
    return fail(1, 1, 'too-large', `the file is ${bytes} bytes, over the limit of ${limits.maxBytes} bytes`, 'a smaller file (split it, or remove pasted data)');
  }

  const lineCounter = new LineCounter();
  // Parsing to tokens is iterative; composing them into nodes recurses, so nesting is measured in between.
  const tokens = Array.from(new Parser(lineCounter.addNewLine).parse(text));
  const tooDeep = firstDeeperThan(tokens, MAX_NESTING_DEPTH);
  if (tooDeep !== undefined) {
    const pos = lineCounter.linePos(tooDeep.offset);
    return fail(
      pos.line,
      pos.col,
      'too-deep',
      `lists and mappings here are nested more than ${MAX_NESTING_DEPTH} levels deep`,
      `at most ${MAX_NESTING_DEPTH} levels of nesting (a plan needs about six)`,
      formatFieldPath(tooDeep.path),
    );
  }
  const composer = new Composer({ prettyErrors: false, uniqueKeys: true, strict: true });
  let doc: Document.Parsed | undefined;
  let secondDocumentAt: number | undefined;
  for (const composed of composer.compose(tokens, true, text.length)) {
    if (!doc) doc = composed;
    else {
      secondDocumentAt = composed.range[0];
      break;
    }
  }
  if (!doc) return fail(1, 1, 'bad-yaml', 'this is not valid YAML');
  if (secondDocumentAt !== undefined && doc.errors.length === 0) {
    const pos = lineCounter.linePos(secondDocumentAt);
    return fail(pos.line, pos.col, 'several-documents', 'the file holds more than one YAML document (a second "---")', 'one document per file');
  }
  const firstError = doc.errors[0];
  if (firstError) {
    const pos = lineCounter.linePos(firstError.pos[0]);
    if (firstError.code === 'DUPLICATE_KEY') {
      const duplicate = duplicateKeyAt(doc, firstError.pos[0]);
      if (duplicate) {
        return fail(
          pos.line,
          pos.col,
          'duplicate-key',
          `\`${duplicate.key}\` is written twice in the same mapping (first on line ${lineCounter.linePos(duplicate.firstOffset).line})`,
          'each key once: keep one of the two, or merge what they hold',
          formatFieldPath(fieldPathAt(doc.contents as Node | null, firstError.pos[0])),
        );
      }
      return fail(pos.line, pos.col, 'duplicate-key', 'this key is written twice in the same mapping', 'each key once');
    }
    const plainMessage = plainYamlMessage(firstError.message);
    const unclosed = unclosedBracket(tokens, firstError.pos[0], plainMessage);
    if (unclosed) {
      const opened = lineCounter.linePos(unclosed.offset);
      const explained = explainUnclosedBracket(unclosed.open);
      return fail(opened.line, opened.col, 'bad-yaml', `this is not valid YAML: ${explained.message}`, explained.expected, formatFieldPath(fieldPathAt(doc.contents as Node | null, unclosed.offset, true)));
    }
    const explained = explainYamlError(firstError.code, plainMessage);
    return fail(pos.line, pos.col, 'bad-yaml', `this is not valid YAML: ${explained.message}`, explained.expected);
  }

  // A tag YAML does not know (`!custom`) would load as plain text; our formats use none, so it is a mistake.
  const unknownTag = doc.warnings.find((w) => w.code === 'TAG_RESOLVE_FAILED');
  if (unknownTag) {
    const pos = lineCounter.linePos(unknownTag.pos[0]);
    const explained = explainYamlError(unknownTag.code, plainYamlMessage(unknownTag.message));
    return fail(pos.line, pos.col, 'unknown-tag', explained.message, explained.expected, formatFieldPath(fieldPathAt(doc.contents as Node | null, unknownTag.pos[0])));
  }

  // A mapping or list used as a key has no meaning in our formats (and yaml would stringify it).
  let complexKeyAt: number | undefined;
  visit(doc, {
    Pair(_, pair) {
      if (pair.key !== null && !isScalar(pair.key)) {
        complexKeyAt = (pair.key as Node).range?.[0] ?? 0;
        return visit.BREAK;
      }
      return undefined;
    },
  });
  if (complexKeyAt !== undefined) {
    const pos = lineCounter.linePos(complexKeyAt);
    return fail(pos.line, pos.col, 'complex-key', 'a key here is a list or mapping', 'keys written as plain words, e.g. title');
  }

  let value: unknown;
  try {
    value = doc.toJS({ maxAliasCount: limits.maxAliases });
  } catch (error) {
    // The yaml package throws a ReferenceError when aliases expand past maxAliasCount.
    const message = error instanceof Error ? error.message : String(error);
    return fail(1, 1, 'too-many-aliases', `the file expands too many aliases (${message})`, `at most ${limits.maxAliases} alias expansions`);
  }

  const at = (offset: number): SourceLocation => {
    const pos = lineCounter.linePos(offset);
    return { file, line: pos.line, column: pos.col };
  };
  const rootOffset = doc.contents?.range[0] ?? 0;

  const lineOf = (offset: number) => lineCounter.linePos(offset).line;
  const walk = (path: FieldPath): { node: Node | null; depth: number } => {
    let node: Node | null = doc.contents as Node | null;
    let depth = 0;
    for (const segment of path) {
      const next = childOf(node, segment);
      if (!next) break;
      node = next;
      depth++;
    }
    return { node, depth };
  };

  return {
    ok: true,
    source: {
      file,
      value,
      locate(path) {
        const { node } = walk(path);
        return at(node?.range?.[0] ?? rootOffset);
      },
      locateKey(path, key) {
        const { node, depth } = walk(path);
        if (depth === path.length && isMap(node)) {
          const pair = node.items.find((item) => isScalar(item.key) && String(item.key.value) === key);
          const keyNode = pair && isScalar(pair.key) ? pair.key : undefined;
          if (keyNode?.range) return at(keyNode.range[0]);
        }
        return at(node?.range?.[0] ?? rootOffset);
      },
      keyLines(root = []) {
        const lines = new Map<string, number>();
        const start = walk(root);
        if (start.depth === root.length) collectKeyLines(start.node, '', lines, lineOf);
        return lines;
      },
    },
  };
}

/** Adds the line of every key and list item under `node` to `lines`, named as `formatFieldPath` names them. */
function collectKeyLines(node: Node | null, path: string, lines: Map<string, number>, lineOf: (offset: number) => number): void {
  if (isMap(node)) {
    for (const pair of node.items) {
      if (!isScalar(pair.key) || !pair.key.range) continue;
      const key = String(pair.key.value);
      const field = path ? `${path}.${key}` : key;
      lines.set(field, lineOf(pair.key.range[0]));
      collectKeyLines(pair.value as Node | null, field, lines, lineOf);
    }
  } else if (isSeq(node)) {
    node.items.forEach((item, index) => {
      const field = `${path}[${index}]`;
      const range = (item as Node | null)?.range;
      if (range) lines.set(field, lineOf(range[0]));
      collectKeyLines(item as Node | null, field, lines, lineOf);
    });
  }
}

function childOf(node: Node | null, segment: string | number): Node | null {
  if (isMap(node)) {
    const pair = node.items.find((item) => isPair(item) && isScalar(item.key) && String(item.key.value) === String(segment));
    return (pair?.value as Node | null | undefined) ?? (pair && isScalar(pair.key) ? pair.key : null);
  }
  if (isSeq(node) && typeof segment === 'number') {
    return (node.items[segment] as Node | undefined) ?? null;
  }
  return null;
}

/**
 * The start of the first collection nested deeper than `limit`, and the path of keys and list places that
 * leads to it (the deepest key reached), walking the token tree with an explicit stack (a recursive walk
 * would hit the very limit this guards). Keys are kept as tokens and read only for the path reported.
 */
function firstDeeperThan(tokens: readonly CST.Token[], limit: number): { offset: number; path: FieldPath } | undefined {
  type Step = CST.Token | number;
  const stack: { token: CST.Token; depth: number; path: readonly Step[] }[] = tokens.map((token) => ({ token, depth: 0, path: [] }));
  let first: { offset: number; path: readonly Step[] } | undefined;
  while (stack.length > 0) {
    const { token, depth, path } = stack.pop()!;
    const children: { token: CST.Token | null | undefined; path: readonly Step[] }[] = [];
    let childDepth = depth;
    switch (token.type) {
      case 'document':
        children.push({ token: token.value, path });
        break;
      case 'block-map':
      case 'block-seq':
      case 'flow-collection': {
        childDepth = depth + 1;
        if (childDepth > limit) {
          if (first === undefined || token.offset < first.offset) first = { offset: token.offset, path };
          continue;
        }
        const isMapping = token.type === 'block-map' || (token.type === 'flow-collection' && token.start.source === '{');
        token.items.forEach((item, index) => {
          const key = 'key' in item ? item.key : undefined;
          children.push({ token: key, path }, { token: item.value, path: [...path, isMapping && key ? key : index] });
        });
        break;
      }
      default:
        break;
    }
    for (const child of children) if (child.token) stack.push({ token: child.token, depth: childDepth, path: child.path });
  }
  if (!first) return undefined;
  // A key that is not a plain scalar (or is itself broken) is named by nothing better than "?".
  const keyName = (key: CST.Token) => CST.resolveAsScalar(key, false, () => undefined)?.value ?? '?';
  return { offset: first.offset, path: first.path.map((step) => (typeof step === 'number' ? step : keyName(step))) };
}

/** The key written twice that the yaml package reports at `offset`, and where the mapping first has it. */
function duplicateKeyAt(doc: Document.Parsed, offset: number): { key: string; firstOffset: number } | undefined {
  let found: { key: string; firstOffset: number } | undefined;
  visit(doc, {
    Map(_, map) {
      const keys = map.items.map((pair) => (isScalar(pair.key) ? pair.key : undefined));
      const index = keys.findIndex((key) => key?.range?.[0] === offset);
      if (index < 0) return undefined;
      const second = keys[index]!;
      const first = keys.find((key, i) => i < index && key !== undefined && key.value === second.value);
      if (first?.range) found = { key: String(second.value), firstOffset: first.range[0] };
      return visit.BREAK;
    },
  });
  return found;
}

/**
 * The bracket left open when the yaml package says a flow collection must "end with a }" (or "]"): the yaml package
 * reports where it gave up, often lines below (at the next key). The CST keeps each collection's opening
 * token and its closing ones; the one named is the latest collection of that kind opened before the error
 * whose closers lack its partner.
 */
function unclosedBracket(tokens: readonly CST.Token[], errorOffset: number, message: string): { open: '{' | '['; offset: number } | undefined {
  const kind = /^Flow (map|sequence)\b.* end with an? ([}\]])$/.exec(message);
  if (!kind) return undefined;
  const open = kind[1] === 'map' ? '{' : '[';
  const close = kind[2];
  let latest: number | undefined;
  for (const token of tokens) {
    if (token.type !== 'document') continue;
    CST.visit(token, (item) => {
      for (const part of [item.key, item.value]) {
        if (part?.type !== 'flow-collection' || part.start.source !== open || part.offset > errorOffset) continue;
        if (part.end.some((t) => t.source === close)) continue;
        if (latest === undefined || part.offset > latest) latest = part.offset;
      }
    });
  }
  return latest === undefined ? undefined : { open, offset: latest };
}

/**
 * The path of keys and list places to the node written at `offset` (a tag stands just before its node).
 * `collectionAt`: the offset is where a collection starts (its bracket), and the path ends at it, not inside.
 */
function fieldPathAt(root: Node | null, offset: number, collectionAt = false): FieldPath {
  const path: (string | number)[] = [];
  let node = root;
  while (node && (isMap(node) || isSeq(node))) {
    if (collectionAt && node.range?.[0] === offset) break;
    const items: unknown[] = node.items;
    const endOf = (item: unknown): number => {
      if (isPair(item)) return (item.value as Node | null)?.range?.[1] ?? (item.key as Node | null)?.range?.[1] ?? 0;
      return (item as Node | null)?.range?.[1] ?? 0;
    };
    const index = items.findIndex((item) => endOf(item) > offset);
    if (index < 0) break;
    const item = items[index];
    if (isPair(item)) {
      path.push(isScalar(item.key) ? String(item.key.value) : index);
      node = item.value as Node | null;
    } else {
      path.push(index);
      node = item as Node | null;
    }
    if (!node?.range || offset < node.range[0]) break;
  }
  return path;
}

/** The yaml package's messages end with a source excerpt; we print our own location instead. */
function plainYamlMessage(message: string): string {
  return message.split('\n')[0]!.replace(/ at line \d+, column \d+:?$/, '').trim();
}
