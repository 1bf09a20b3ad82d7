/** ANSI styling for terminal output; every function is the identity when colour is off (NO_COLOR, not a TTY). */
export interface TerminalStyle {
  bold(text: string): string;
  dim(text: string): string;
  red(text: string): string;
  yellow(text: string): string;
  green(text: string): string;
}

export function terminalStyle(color: boolean): TerminalStyle {
  const wrap = (open: number, close: number) => (text: string) => (color ? `\u001b[${open}m${text}\u001b[${close}m` : text);
  return { bold: wrap(1, 22), dim: wrap(2, 22), red: wrap(31, 39), yellow: wrap(33, 39), green: wrap(32, 39) };
}

/**
 * Removes control characters (including ESC) from text that came from user files, so a plan
 * cannot move the cursor, recolour the terminal or fake a line of our output.
 */
export function terminalSafe(text: string): string {
  // eslint-disable-next-line no-control-regex
  return text.replace(/[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/g, '\uFFFD').replace(/\n/g, ' ');
}

/** Left-aligned columns with two spaces between them. */
export function formatTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: readonly string[]) =>
    cells
      .map((c, i) => (i === cells.length - 1 ? c : c.padEnd(widths[i]!)))
      .join('  ')
      .trimEnd();
  return [line(header), ...rows.map(line)].join('\n');
}
