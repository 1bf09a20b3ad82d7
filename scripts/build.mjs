// Bundles the CLI and the Action into dist/ as ESM. With --check, builds into a temporary folder
// and fails when the committed dist/ differs, so a stale bundle cannot land.
import { build } from 'esbuild';
import { mkdtemp, readFile, readdir, rm, mkdir, cp } from 'node:fs/promises';
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

await build({
  entryPoints: { cli: 'src/cli/bin.ts', index: 'src/action/main.ts' },
  outdir,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  splitting: false,
  legalComments: 'none',
  sourcemap: false,
  logLevel: 'warning',
  // ESM bundles have no `require`; some dependencies still call it for Node built-ins.
  banner: {
    js: "#!/usr/bin/env node\nimport { createRequire as __plumblineCreateRequire } from 'node:module';\nconst require = __plumblineCreateRequire(import.meta.url);",
  },
});

if (check) {
  const names = (await readdir(outdir)).sort();
  const committed = (await readdir('dist').catch(() => [])).sort();
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
