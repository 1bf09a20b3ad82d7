import { commentsOfText, insideRanges } from './comments.js';

/**
 * The block structure of a source file, enough to ask "which function (or block) holds this line" and
 * "which branch is this line in": brace blocks for C-like languages, indentation for Python. A heuristic
 * over text, not a parser; findings built on it say so and quote the lines.
 */
export interface Block {
  /** Offsets of the opening and closing delimiter (for Python: the header line's end and the block's end). */
  open: number;
  close: number;
  /** The statement that opens the block, e.g. `if (flag)`, `else`, `export function cart(client)`, and where it starts. */
  header: string;
  headerStart: number;
}

const CONTROL = /^(?:else\b|if\b|for\b|while\b|switch\b|catch\b|try\b|do\b|finally\b|case\b|elif\b|except\b|with\b|match\b)/;
const FUNCTION_HEADER = /(?:\bfunction\b|=>\s*$|\bfunc\b|\bfn\b|\bdef\b|\)\s*(?::\s*[^=;{]+)?(?:\s*throws\s+[\w.,\s]+)?\s*$)/;

const isPython = (path: string) => /\.pyi?$/i.test(path);

/** Every block of the text, outermost first at each position. */
export function blocksOf(text: string, path: string): Block[] {
  return isPython(path) ? indentBlocks(text) : braceBlocks(text, path);
}

function braceBlocks(text: string, path: string): Block[] {
  const comments = commentsOfText(text, path);
  const blocks: Block[] = [];
  const stack: number[] = [];
  let quote: string | undefined;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quote) {
      if (c === '\\') i++;
      else if (c === quote || (c === '\n' && quote !== '`')) quote = undefined;
      continue;
    }
    if (insideRanges(comments, i)) continue;
    if (c === '"' || c === "'" || c === '`') quote = c;
    else if (c === '{') stack.push(i);
    else if (c === '}' && stack.length) {
      const open = stack.pop()!;
      blocks.push({ open, close: i, ...headerBefore(text, open) });
    }
  }
  return blocks.sort((a, b) => a.open - b.open);
}

/** The statement text before an opening brace: back to the previous `;`, `{` or `}` (so `} else {` gives `else`). */
function headerBefore(text: string, open: number): { header: string; headerStart: number } {
  let start = open - 1;
  while (start >= 0 && !';{}'.includes(text[start]!)) start--;
  const headerStart = controlLineStart(text, start + 1, open);
  return { header: text.slice(headerStart, open).replace(/\s+/g, ' ').trim(), headerStart };
}

/**
 * Languages without semicolons (Go, Kotlin, Swift) end a statement at a new line, so `on := read()` and the
 * `if on {` under it are two statements: a header starts at the last line that opens with a control keyword,
 * unless the line before runs on into it (`val x =` then `if (on) {`).
 */
function controlLineStart(text: string, from: number, open: number): number {
  for (let newline = text.lastIndexOf('\n', open - 1); newline >= from; newline = newline > 0 ? text.lastIndexOf('\n', newline - 1) : -1) {
    if (!CONTROL.test(text.slice(newline + 1, open).trimStart())) continue;
    const before = text.slice(from, newline).trimEnd();
    if (before === '') return from;
    if (!/[([,=&|+\-*/.?:!<>]$/.test(before)) return newline + 1;
  }
  return from;
}

function indentBlocks(text: string): Block[] {
  const lines = text.split('\n');
  const offsets: number[] = [];
  let at = 0;
  for (const line of lines) {
    offsets.push(at);
    at += line.length + 1;
  }
  const indent = (line: string) => line.length - line.trimStart().length;
  const blocks: Block[] = [];
  lines.forEach((line, n) => {
    const trimmed = line.trim();
    if (!trimmed.endsWith(':') || trimmed.startsWith('#')) return;
    const own = indent(line);
    let end = n + 1;
    for (let k = n + 1; k < lines.length; k++) {
      if (lines[k]!.trim() === '' || lines[k]!.trim().startsWith('#')) continue;
      if (indent(lines[k]!) <= own) break;
      end = k + 1;
    }
    blocks.push({ open: offsets[n]! + line.length, close: (offsets[end - 1] ?? 0) + (lines[end - 1]?.length ?? 0), header: trimmed.slice(0, -1), headerStart: offsets[n]! });
  });
  return blocks;
}

/** Blocks that hold an offset, outermost first. */
export function enclosing(blocks: readonly Block[], offset: number): Block[] {
  return blocks.filter((b) => b.open < offset && offset <= b.close);
}

export const isFunctionHeader = (header: string) => !CONTROL.test(header) && FUNCTION_HEADER.test(header);
export const isControlHeader = (header: string) => CONTROL.test(header);

/** The innermost function that holds the offset, else undefined (top-level code). */
export function enclosingFunction(blocks: readonly Block[], offset: number): Block | undefined {
  return enclosing(blocks, offset).filter((b) => isFunctionHeader(b.header)).at(-1);
}
