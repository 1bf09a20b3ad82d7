/**
 * Built-in patterns for code that evaluates a feature flag or logs an event. Each is a regular
 * expression (JavaScript syntax) with a named group `key` (a flag key written as a string
 * literal), `ident` (a constant holding the key) or `event`. Settings add patterns and may turn
 * these off (`builtin-patterns: false`).
 *
 * The flag patterns cover the OpenFeature evaluation API (an open standard) as its SDKs spell it in
 * each language, plus common helper names.
 */

const Q = `(?<q>["'\`])`;
const KEY = `(?<key>[^"'\`\\s]+)\\k<q>`;
const IDENT = `(?<ident>[A-Za-z_$][\\w$]*(?:\\.[A-Za-z_$][\\w$]*)*)\\s*[,)]`;
const TYPES = '(?:Boolean|String|Number|Integer|Int|Double|Float|Object)';
const TYPES_SNAKE = '(?:boolean|string|number|integer|float|object)';

/** The first argument of an evaluation call: a literal key, or a constant that holds it. */
const either = (prefix: string) => [`${prefix}${Q}${KEY}`, `${prefix}${IDENT}`];

export const BUILTIN_FLAG_PATTERNS: readonly string[] = [
  // TypeScript/JavaScript, Java/Kotlin, PHP: client.getBooleanValue('key', false); C#: GetBooleanValueAsync("key", false);
  // Swift: client.getBooleanValue(key: "key", defaultValue: false)
  ...either(`\\b[Gg]et${TYPES}(?:Value|Details)(?:Async)?\\s*\\(\\s*(?:key\\s*:\\s*)?`),
  // Python: client.get_boolean_value("key", False)
  ...either(`\\bget_${TYPES_SNAKE}_(?:value|details)\\s*\\(\\s*(?:flag_key\\s*=\\s*)?`),
  // Ruby: client.fetch_boolean_value(flag_key: "key", default_value: false)
  ...either(`\\bfetch_${TYPES_SNAKE}_(?:value|details)\\s*\\(?\\s*(?:flag_key\\s*:\\s*)?`),
  // Go: client.BooleanValue(ctx, "key", false, evalCtx).
  // The first argument is the context: a name or a call without arguments (context.Background()).
  ...either(`\\b(?:Boolean|String|Int|Float|Object)Value(?:Details)?\\s*\\(\\s*[A-Za-z_][\\w.]*(?:\\(\\))?\\s*,\\s*`),
  // React: useBooleanFlagValue('key', false), useFlag('key', default)
  ...either(`\\buse(?:${TYPES})?Flag(?:Value|Details)?\\s*\\(\\s*`),
  // Helpers many codebases write around their flag client.
  ...either(`\\b(?:isEnabled|isFeatureEnabled|featureEnabled|is_enabled|is_feature_enabled|feature_enabled|isOn|getFlag|get_flag|flagValue|flag_value)\\s*\\(\\s*`),
];

// Method names as each language writes them: camelCase (JavaScript, Java, Swift), snake_case (Python, Ruby),
// PascalCase for exported methods in Go and for methods in C# (Track, TrackEvent, LogEvent, Capture).
// Go calls may take a context first: client.Track(ctx, "event").
export const BUILTIN_LOG_PATTERNS: readonly string[] = [
  `(?:\\b|\\.)(?:[Tt]rack|[Tt]rackEvent|track_event|[Ll]ogEvent|log_event|[Ee]vent|[Cc]apture|[Ee]mit|[Rr]ecord|[Rr]ecordEvent|record_event)(?:Async)?\\s*\\(\\s*(?:(?:ctx|context|context\\.\\w+\\(\\))\\s*,\\s*)?(?:(?:name|event)\\s*[:=]\\s*)?${Q}(?<event>[^"'\`\\n]+)\\k<q>`,
];

/** What follows a constant's name where its value is written: an optional type, `=` or `:`, then the quoted key. */
const CONSTANT_VALUE = new RegExp(`\\s*(?::\\s*[\\w<>\\[\\]]+\\s*)?(?:=|:)\\s*${Q}${KEY}`, 'uy');
const IDENT_CHAR = /[\w$.]/u;

/**
 * The key a constant holds where it is defined in `text`: `const X = 'k'`, `X = "k"`,
 * `static final String X = "k";`, `X: "k"`. The name comes from the change's code, so it is found by plain
 * string search and only the fixed tail is a pattern.
 */
export function constantValue(text: string, name: string): string | undefined {
  if (name === '') return undefined;
  for (let at = text.indexOf(name); at >= 0; at = text.indexOf(name, at + 1)) {
    if (at > 0 && IDENT_CHAR.test(text.charAt(at - 1))) continue;
    CONSTANT_VALUE.lastIndex = at + name.length;
    const key = CONSTANT_VALUE.exec(text)?.groups?.key;
    if (key !== undefined) return key;
  }
  return undefined;
}

/** A string literal on one line, quoted with ", ' or `; group 2 is its text. */
export const QUOTED_STRING = /(["'`])([^"'`\n]{1,200})\1/g;

/** Compiles patterns once; the `g` flag lets one line hold several calls. */
export function compilePatterns(patterns: readonly string[]): RegExp[] {
  return patterns.map((p) => new RegExp(p, 'gu'));
}

/** The flag-call patterns a repository uses: the built-in ones (unless turned off) and its own. */
export function flagPatternsOf(settings: { builtinPatterns: boolean; flagCalls: readonly string[] }): RegExp[] {
  return compilePatterns([...(settings.builtinPatterns ? BUILTIN_FLAG_PATTERNS : []), ...settings.flagCalls]);
}

/** The logging-call patterns a repository uses: the built-in ones (unless turned off) and its own. */
export function logPatternsOf(settings: { builtinPatterns: boolean; logCalls: readonly string[] }): RegExp[] {
  return compilePatterns([...(settings.builtinPatterns ? BUILTIN_LOG_PATTERNS : []), ...settings.logCalls]);
}
