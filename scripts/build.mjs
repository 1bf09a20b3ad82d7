// Bundles the CLI and the Action into dist/ as ESM. With --check, builds into a temporary folder
// and fails when the committed dist/ differs, so a stale bundle cannot land.
//
// The bundle is split: dist/cli.js and dist/index.js hold only what starts them, and every command
// loads its own code from dist/chunks/ through dynamic import() when it runs, so `--version`,
// `--help` and `validate` never parse the review, git, the statistics or the GitHub client.
import { build } from 'esbuild';
import { execFileSync } from 'node:child_process';
import { mkdtemp, readFile, readdir, rm, mkdir, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const check = process.argv.includes('--check');
const outdir = check ? await mkdtemp(join(tmpdir(), 'plumbline-dist-')) : 'dist';

const pkg = JSON.parse(await readFile('package.json', 'utf8'));
const versionSource = await readFile('src/version.ts', 'utf8');
if (!versionSource.includes(`'${pkg.version}'`)) {
  console.error(`src/version.ts does not say ${pkg.version} (package.json); update it.`);
  process.exit(1);
}

if (!check) {
  await rm(outdir, { recursive: true, force: true });
  await mkdir(outdir, { recursive: true });
}

/**
 * zod's namespace re-exports every message locale (about 330 KB), which a bundler cannot drop because
 * `z` is imported whole. Plumbline writes its own messages and never switches locale, so the bundle
 * gets English only; zod registers English itself when the first schema is built.
 */
const englishOnlyZod = {
  name: 'english-only-zod',
  setup(b) {
    b.onResolve({ filter: /^\.\.\/locales\/index\.js$/ }, (args) =>
      /[\\/]zod[\\/]v4[\\/](classic|core)[\\/]/.test(args.importer) ? { path: 'zod-locales-en', namespace: 'plumbline' } : undefined,
    );
    b.onLoad({ filter: /^zod-locales-en$/, namespace: 'plumbline' }, () => ({
      contents: "export { default as en } from 'zod/v4/locales/en.js';",
      resolveDir: process.cwd(),
      loader: 'js',
    }));
  },
};

await build({
  plugins: [englishOnlyZod],
  entryPoints: { cli: 'src/cli/bin.ts', index: 'src/action/main.ts' },
  outdir,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  splitting: true,
  chunkNames: 'chunks/[name]-[hash]',
  legalComments: 'none',
  // @duckdb/node-api is an optional dependency with a native binary, loaded by import() only by `plumbline totals`;
  // pg-native is pg's optional native driver, which Plumbline never uses.
  external: ['@duckdb/node-api', 'pg-native'],
  sourcemap: false,
  logLevel: 'warning',
  // ESM bundles have no `require`; some dependencies still call it for Node built-ins.
  banner: {
    js: "#!/usr/bin/env node\nimport { createRequire as __plumblineCreateRequire } from 'node:module';\nconst require = __plumblineCreateRequire(import.meta.url);",
  },
});

// `--help` and `<command> --help` are answered from this file without loading the parser (see src/cli/bin.ts): the
// text is what the freshly built CLI prints for the same words, asked before help.json exists.
const helpOf = (...words) => execFileSync(process.execPath, [join(outdir, 'cli.js'), ...words], { encoding: 'utf8', env: { ...process.env, NO_COLOR: '1', FORCE_COLOR: '0' } });
const help = { '': helpOf('--help') };
const commandList = help[''].slice(help[''].indexOf('\nCommands:\n'));
for (const [, name] of commandList.matchAll(/^ {2}([a-z]+)\b/gm)) if (name !== 'help') help[name] = helpOf(name, '--help');
if (Object.keys(help).length < 2) throw new Error('no commands found in the built CLI\'s --help');
await writeFile(join(outdir, 'help.json'), `${JSON.stringify(help, null, 1)}\n`);

if (check) {
  const filesIn = async (dir) => (await readdir(dir, { recursive: true, withFileTypes: true }).catch(() => [])).filter((e) => e.isFile()).map((e) => join(e.parentPath ?? e.path, e.name).slice(dir.length + 1)).sort();
  const names = await filesIn(outdir);
  const committed = await filesIn('dist');
  let stale = names.join() !== committed.join();
  for (const name of names) {
    if (stale) break;
    const [fresh, old] = await Promise.all([readFile(join(outdir, name)), readFile(join('dist', name)).catch(() => Buffer.alloc(0))]);
    if (!fresh.equals(old)) stale = true;
  }
  await rm(outdir, { recursive: true, force: true });
  if (stale) {
    console.error('dist/ is stale: run `npm run build` and commit dist/.');
    process.exit(1);
  }
  console.log('dist/ matches the sources.');
}
