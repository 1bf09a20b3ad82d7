import { CST, Composer, LineCounter, Parser, isMap, isPair, isScalar, isSeq, visit, type Document, type Node } from 'yaml';
import { explainYamlError } from './yaml-messages.js';
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
}

export type YamlReadResult = { ok: true; source: YamlSource } | { ok: false; problems: Problem[] };

/**
 * Parses one YAML document keeping source positions. Bad YAML, several documents in one file,
 * duplicate keys, oversized input and alias bombs all come back as problems, never as a throw.
 */
export function readYaml(text: string, file: string, limits: YamlLimits, codePrefix: string): YamlReadResult {
  const fail = (line: number, column: number, code: string, message: string, expected?: string): YamlReadResult => ({
    ok: false,
    problems: [{ severity: 'error', code: `${codePrefix}/${code}`, file, line, column, field: '', message, ...(expected ? { expected } : {}) }],
  });

  const bytes = Buffer.byteLength(text, 'utf8');
  if (bytes > limits.maxBytes) {
    return fail(1, 1, 'too-large', `the file is ${bytes} bytes, over the limit of ${limits.maxBytes} bytes`, 'a smaller file (split it, or remove pasted data)');
  }

  const lineCounter = new LineCounter();
  // Parsing to tokens is iterative; composing them into nodes recurses, so nesting is measured in between.
  const tokens = Array.from(new Parser(lineCounter.addNewLine).parse(text));
  const tooDeepAt = firstOffsetDeeperThan(tokens, MAX_NESTING_DEPTH);
  if (tooDeepAt !== undefined) {
    const pos = lineCounter.linePos(tooDeepAt);
    return fail(
      pos.line,
      pos.col,
      'too-deep',
      `lists and mappings here are nested more than ${MAX_NESTING_DEPTH} levels deep`,
      `at most ${MAX_NESTING_DEPTH} levels of nesting (a plan needs about six)`,
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
      return fail(pos.line, pos.col, 'duplicate-key', 'this key is written twice in the same mapping', 'each key once');
    }
    const explained = explainYamlError(firstError.code, plainYamlMessage(firstError.message));
    return fail(pos.line, pos.col, 'bad-yaml', `this is not valid YAML: ${explained.message}`, explained.expected);
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
    },
  };
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
 * The start of the first collection nested deeper than `limit`, walking the token tree with an explicit stack
 * (a recursive walk would hit the very limit this guards).
 */
function firstOffsetDeeperThan(tokens: readonly CST.Token[], limit: number): number | undefined {
  const stack: { token: CST.Token; depth: number }[] = tokens.map((token) => ({ token, depth: 0 }));
  let first: number | undefined;
  while (stack.length > 0) {
    const { token, depth } = stack.pop()!;
    const children: (CST.Token | null | undefined)[] = [];
    let childDepth = depth;
    switch (token.type) {
      case 'document':
        children.push(token.value);
        break;
      case 'block-map':
      case 'block-seq':
      case 'flow-collection':
        childDepth = depth + 1;
        if (childDepth > limit) {
          first = first === undefined ? token.offset : Math.min(first, token.offset);
          continue;
        }
        for (const item of token.items) children.push('key' in item ? item.key : undefined, item.value);
        break;
      default:
        break;
    }
    for (const child of children) if (child) stack.push({ token: child, depth: childDepth });
  }
  return first;
}

/** The yaml package's messages end with a source excerpt; we print our own location instead. */
function plainYamlMessage(message: string): string {
  return message.split('\n')[0]!.replace(/ at line \d+, column \d+:?$/, '').trim();
}
