/**
 * The build's second step (after tsc): the CLI as one script with V8's code cache, so a small
 * run does not spend a third of its time loading and compiling some 300 ES modules.
 *
 * - esbuild (pinned in package.json) bundles tsc's output, dist/src/cli/cli-bundle-entry.js,
 *   into dist/src/cli/bundle/cli.js, and the plan worker (dist/src/plan/plan-worker.js) into
 *   dist/src/cli/bundle/plan-worker.bundle.cjs: CommonJS, so that src/cli/launch.ts can
 *   compile them with a code cache (node:vm), import.meta.url replaced by the bundle's own
 *   file URL. The code is tsc's output, joined: no minifying, no other transform.
 *   satellite.js's WebAssembly half (its `./wasm/index.js`, which the program never calls) is
 *   left out. Packages loaded on first use (src/lazy.ts) and HiGHS stay in node_modules.
 * - dist/src/cli/main.js (the package's bin; tsc's own main.js is the bundle's input) becomes
 *   the launcher of the CLI bundle, dist/src/cli/bundle/plan-worker.js that of the worker's
 *   (parallel.ts finds it beside the bundle: ./plan-worker.js of its import.meta.url).
 * - The code cache is made by a run of the demo plan (every output written to a temp
 *   folder, then removed) in a child process with Node's default flags: V8 keeps the
 *   bytecode of each function that run compiled. The worker is bundled without a cache.
 *
 * Run: node dist/scripts/bundle-cli.js (npm run build does).
 */
import { chmodSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { build, type Plugin } from 'esbuild';
import { codeCachePath, compileBundle, runBundle } from '../src/cli/launch.js';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const cliDir = join(root, 'dist', 'src', 'cli');
const bundleDir = join(cliDir, 'bundle');
const cliBundle = join(bundleDir, 'cli.js');
const workerBundle = join(bundleDir, 'plan-worker.bundle.cjs');

/** satellite.js's `export * from './wasm/index.js'` resolved to an empty module. */
const withoutSatelliteWasm: Plugin = {
  name: 'without-satellite-wasm',
  setup(b) {
    b.onResolve({ filter: /^\.\/wasm\/index\.js$/ }, (args) =>
      /[\\/]satellite\.js[\\/]/.test(args.importer) ? { path: 'satellite.js-wasm', namespace: 'passbudget-empty' } : undefined,
    );
    b.onLoad({ filter: /.*/, namespace: 'passbudget-empty' }, () => ({ contents: '', loader: 'js' }));
  },
};

async function bundle(entry: string, outfile: string): Promise<void> {
  await build({
    entryPoints: [entry],
    outfile,
    bundle: true,
    platform: 'node',
    format: 'cjs',
    target: 'node20',
    external: ['highs'],
    plugins: [withoutSatelliteWasm],
    banner: { js: "const __passbudgetImportMetaUrl = require('node:url').pathToFileURL(__filename).href;" },
    define: { 'import.meta.url': '__passbudgetImportMetaUrl' },
    logLevel: 'warning',
  });
}

const LAUNCHER_HEAD = '#!/usr/bin/env node\n// Made by scripts/bundle-cli.ts: starts the bundle (src/cli/launch.ts).\n';

async function main(): Promise<void> {
  rmSync(bundleDir, { recursive: true, force: true });
  mkdirSync(bundleDir, { recursive: true });
  await bundle(join(cliDir, 'cli-bundle-entry.js'), cliBundle);
  await bundle(join(root, 'dist', 'src', 'plan', 'plan-worker.js'), workerBundle);
  writeFileSync(join(cliDir, 'main.js'), `${LAUNCHER_HEAD}import { launchBundle } from './launch.js';\nlaunchBundle(new URL('./bundle/cli.js', import.meta.url));\n`);
  chmodSync(join(cliDir, 'main.js'), 0o755);
  writeFileSync(join(bundleDir, 'plan-worker.js'), `${LAUNCHER_HEAD}import { launchBundle } from '../launch.js';\nlaunchBundle(new URL('./plan-worker.bundle.cjs', import.meta.url));\n`);
  const out = mkdtempSync(join(tmpdir(), 'passbudget-code-cache-'));
  try {
    const warm = spawnSync(process.execPath, [fileURLToPath(import.meta.url), '--warm-run', out], { encoding: 'utf8', stdio: ['ignore', 'ignore', 'pipe'] });
    if (warm.status !== 0) throw new Error(`bundle-cli: the demo run for the code cache failed (exit ${warm.status}):\n${warm.stderr}`);
  } finally {
    rmSync(out, { recursive: true, force: true });
  }
}

/** In the child: the demo plan from the bundle, then the bundle's code cache written. */
function warmRun(outDir: string): void {
  const script = compileBundle(cliBundle);
  process.argv = [process.argv[0]!, join(cliDir, 'main.js'), 'plan', '--out', outDir, '--format', 'csv'];
  process.once('beforeExit', () => {
    if (process.exitCode !== undefined && process.exitCode !== 0) return;
    writeFileSync(codeCachePath(cliBundle), script.createCachedData());
  });
  runBundle(script, cliBundle);
}

if (process.argv[2] === '--warm-run') warmRun(process.argv[3]!);
else await main();
