/**
 * The `yaml` package's parse errors say what the parser saw ("Implicit keys need to be on a single line"); a
 * person editing a plan needs to hear what to write instead. Each entry matches one message (or a family of
 * them, by code) and gives our own wording; anything not listed keeps the package's first line.
 */
export interface YamlErrorExplanation {
  /** What is wrong, in the words of someone writing the file. */
  message: string;
  /** What to write instead. */
  expected?: string;
}

interface Translation {
  code: string;
  /** The start of the package's message; absent when every message of the code means the same thing. */
  startsWith?: string;
  explain(original: string): YamlErrorExplanation;
}

const fixed = (message: string, expected: string) => () => ({ message, expected });

const TRANSLATIONS: readonly Translation[] = [
  {
    code: 'BLOCK_AS_IMPLICIT_KEY',
    startsWith: 'Nested mappings',
    explain: fixed(
      'a second "key:" follows on the same line as a key (as in "a: b: c")',
      'one key per line: put the inner mapping on the lines below, indented, or quote a value that contains ": "',
    ),
  },
  {
    code: 'BLOCK_AS_IMPLICIT_KEY',
    explain: fixed('a list item stands where a key was expected', 'list items ("- ...") on their own lines, indented under the key they belong to'),
  },
  {
    code: 'MULTILINE_IMPLICIT_KEY',
    explain: fixed(
      'a key runs over more than one line (often a line above lacks its colon, or a value holding ": " is not quoted)',
      'each key and its colon on one line, as in "title: Wallet first"; quote a value that contains ": "',
    ),
  },
  {
    code: 'MISSING_CHAR',
    startsWith: 'Implicit map keys need to be followed by map values',
    explain: fixed('a line inside a mapping has no colon', '"key: value" on every line of a mapping'),
  },
  {
    code: 'MISSING_CHAR',
    startsWith: 'Sequence item without - indicator',
    explain: fixed('a line inside a list does not start with "-"', 'every item of a list on its own line starting with "- "'),
  },
  {
    code: 'MISSING_CHAR',
    startsWith: 'Missing closing',
    explain: fixed('a quoted value is never closed', 'the same quote mark (" or \') at the end of the value as at its start'),
  },
  {
    code: 'MISSING_CHAR',
    startsWith: 'Comments must be separated',
    explain: fixed('a "#" touches the text before it', 'a space before "#" to start a comment, or quotes around a value that contains "#"'),
  },
  {
    code: 'MISSING_CHAR',
    startsWith: 'Missing ,',
    explain: fixed('items inside [ ] or { } are not separated by commas', 'a comma between items, as in [web, ios] or {start: 2026-11-02, end: 2026-11-29}'),
  },
  {
    code: 'MISSING_CHAR',
    startsWith: 'Missing space after :',
    explain: fixed('a colon inside [ ] or { } has no space after it', 'a space after each colon, as in {relative: 0.05}'),
  },
  {
    code: 'TAB_AS_INDENT',
    explain: fixed('a tab is used for indentation', 'spaces for indentation (YAML does not allow tabs there)'),
  },
  {
    code: 'BAD_INDENT',
    startsWith: 'All sequence items',
    explain: fixed('the items of this list do not line up', 'every "-" of one list in the same column'),
  },
  {
    code: 'BAD_INDENT',
    explain: fixed(
      'the indentation here does not fit the lines around it',
      'the keys of one mapping in the same column, and what belongs under a key indented further with spaces',
    ),
  },
  {
    code: 'BAD_SCALAR_START',
    explain: (original) => {
      const mark = /start with (?:reserved character )?(\S+)/.exec(original)?.[1] ?? 'this character';
      return {
        message: `a value starts with ${mark}, which YAML reserves`,
        expected: `quotes around a value that starts with ${mark}, as in '${mark === '@' ? '@ana-lima' : `${mark}...`}'`,
      };
    },
  },
  {
    code: 'BAD_DQ_ESCAPE',
    explain: fixed(
      'a backslash in a double-quoted value starts an escape YAML does not know',
      'single quotes around a value with backslashes (\'a\\b\'), or \\\\ for each backslash inside double quotes',
    ),
  },
  {
    code: 'BLOCK_IN_FLOW',
    explain: fixed('a list or mapping written with "-" or indentation sits inside [ ] or { }', 'one style per value: either brackets and commas, or indented lines'),
  },
  {
    code: 'KEY_OVER_1024_CHARS',
    explain: fixed('a key is longer than 1024 characters (or a colon is missing far above)', 'short keys, each followed by ": " on the same line'),
  },
  {
    code: 'TAG_RESOLVE_FAILED',
    explain: fixed('a value carries a "!" tag this file format does not use', 'plain values without "!" tags; quote a value that starts with "!"'),
  },
  {
    code: 'UNEXPECTED_TOKEN',
    startsWith: 'Unexpected scalar at node end',
    explain: fixed('more text follows a complete value on this line', 'quotes around the whole value, or the rest on a line of its own'),
  },
  {
    code: 'UNEXPECTED_TOKEN',
    startsWith: 'Unexpected flow-',
    explain: fixed('a bracket here has no partner', 'each [ closed by ] and each { closed by }, or quotes around a value that starts with [ or {'),
  },
  {
    code: 'RESOURCE_EXHAUSTION',
    explain: fixed('the file nests lists and mappings too deeply to read', 'a plan nested a few levels deep, as in the examples'),
  },
];

/** A { or [ that no } or ] closes, pointed at where it was opened (found in yaml-source.ts). */
export function explainUnclosedBracket(open: '{' | '['): YamlErrorExplanation {
  return open === '{'
    ? { message: 'this { is never closed', expected: '} after the last item, as in { rate: 0.3 }' }
    : { message: 'this [ is never closed', expected: '] after the last item, as in [web, ios]' };
}

/** Our wording for one of the `yaml` package's errors, from its code and the first line of its message. */
export function explainYamlError(code: string, message: string): YamlErrorExplanation {
  const translation = TRANSLATIONS.find((t) => t.code === code && (t.startsWith === undefined || message.startsWith(t.startsWith)));
  return translation ? translation.explain(message) : { message };
}
