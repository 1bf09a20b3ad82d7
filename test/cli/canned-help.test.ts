import { execFileSync } from 'node:child_process';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

/**
 * `--help` and `<command> --help` are printed from dist/help.json, written at build time, without loading the
 * parser. The parser itself answers whenever other words come first (`-C . --help`), so comparing the two holds
 * the canned text to what commander prints today for every command.
 */
const DIST = resolve(__dirname, '../../dist');
const run = (cli: string, ...words: string[]) => execFileSync(process.execPath, [cli, ...words], { encoding: 'utf8' });
const help = JSON.parse(readFileSync(join(DIST, 'help.json'), 'utf8')) as Record<string, string>;
const made: string[] = [];
afterAll(() => made.forEach((dir) => rmSync(dir, { recursive: true, force: true })));

describe('help printed before the parser loads', () => {
  it('covers the program and every command it lists', () => {
    const listed = [...run(join(DIST, 'cli.js'), '-C', '.', '--help').matchAll(/^ {2}([a-z]+) /gm)].map((m) => m[1]).filter((n) => n !== 'help');
    expect(listed.length).toBeGreaterThan(8);
    expect(Object.keys(help).sort()).toEqual(['', ...listed].sort());
  });

  it.each(Object.keys(help))('"%s --help" is what the parser prints', (command) => {
    const words = command ? [command, '--help'] : ['--help'];
    const fromParser = run(join(DIST, 'cli.js'), '-C', '.', ...words);
    expect(help[command]).toBe(fromParser);
    expect(run(join(DIST, 'cli.js'), ...words)).toBe(fromParser);
    expect(run(join(DIST, 'cli.js'), ...(command ? [command, '-h'] : ['-h']))).toBe(fromParser);
  });

  it.each(Object.keys(help))('"%s --help" fits in 80 columns, every line of it', (command) => {
    const long = help[command]!.split('\n').filter((line) => [...line].length > 80);
    expect(long).toEqual([]);
  });

  it('comes from help.json, and the parser answers what it does not hold', () => {
    const copy = mkdtempSync(join(tmpdir(), 'plumbline-dist-'));
    made.push(copy);
    cpSync(DIST, copy, { recursive: true });
    writeFileSync(join(copy, 'help.json'), JSON.stringify({ '': 'canned program help\n', validate: 'canned validate help\n' }));
    expect(run(join(copy, 'cli.js'), '--help')).toBe('canned program help\n');
    expect(run(join(copy, 'cli.js'), 'validate', '-h')).toBe('canned validate help\n');
    expect(run(join(copy, 'cli.js'), 'size', '--help')).toBe(help.size);
    rmSync(join(copy, 'help.json'));
    expect(run(join(copy, 'cli.js'), '--help')).toBe(help['']);
  });
});

describe('help for a command that does not exist', () => {
  // Without this, commander prints the program's help and exits 0 for `valdate --help`, and prints it to stderr
  // with exit 2 but no reason for `help valdate`: the user never learns the command is misspelt.
  const attempt = (...words: string[]) => {
    try {
      return { code: 0, stdout: run(join(DIST, 'cli.js'), ...words), stderr: '' };
    } catch (error) {
      const failed = error as { status: number; stdout: string; stderr: string };
      return { code: failed.status, stdout: failed.stdout, stderr: failed.stderr };
    }
  };
  it.each([['valdate', '--help'], ['valdate', '-h'], ['-C', '.', 'valdate', '--help'], ['help', 'valdate']])('%s %s names the unknown command and the closest one', (...words) => {
    const result = attempt(...words);
    expect(result.code).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toContain("unknown command 'valdate'");
    expect(result.stderr).toContain('Did you mean validate?');
  });
  it('still gives help for a command that exists, asked either way', () => {
    expect(attempt('help', 'size')).toEqual({ code: 0, stdout: help.size, stderr: '' });
    expect(attempt('-C', '.', 'size', '-h')).toEqual({ code: 0, stdout: help.size, stderr: '' });
  });
});
