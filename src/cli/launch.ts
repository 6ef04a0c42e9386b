/**
 * Start-up of the built CLI: the build (scripts/bundle-cli.ts) bundles the program into one
 * CommonJS script (dist/src/cli/bundle/cli.js, and the plan worker's beside it) and, from a
 * run of the demo, V8's code cache of it (`<bundle>.v8cache`: the bytecode of every function
 * that run compiled). Loading one script instead of some 300 ES modules, and its bytecode
 * instead of compiling it, is most of a small run's start-up (Node 20 has no
 * module.enableCompileCache). A cache V8 rejects (another Node.js version, other V8 flags, a
 * bundle rebuilt without it) only costs the compile: the code is the same either way.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Script } from 'node:vm';

/** The code cache's file beside a bundle. */
export function codeCachePath(bundlePath: string): string {
  return `${bundlePath}.v8cache`;
}

/**
 * The bundle at bundlePath compiled as a CommonJS module body (Node's own wrapper), with its
 * code cache when there is one. The build makes the cache with the same function.
 */
export function compileBundle(bundlePath: string, cachedData?: Buffer): Script {
  const source = readFileSync(bundlePath, 'utf8').replace(/^#!.*/, '');
  return new Script(`(function (exports, require, module, __filename, __dirname) {${source}\n})`, {
    filename: bundlePath,
    ...(cachedData !== undefined ? { cachedData } : {}),
  });
}

/** Runs a compiled bundle as the CommonJS module at bundlePath. */
export function runBundle(script: Script, bundlePath: string): void {
  const body = script.runInThisContext() as (exports: object, require: NodeJS.Require, module: object, filename: string, dirname: string) => void;
  const mod = { exports: {} };
  body.call(mod.exports, mod.exports, createRequire(bundlePath), mod, bundlePath, dirname(bundlePath));
}

/** Loads and runs the bundle at bundleUrl, from its code cache when V8 takes it. */
export function launchBundle(bundleUrl: URL): void {
  const path = fileURLToPath(bundleUrl);
  let cache: Buffer | undefined;
  try {
    cache = readFileSync(codeCachePath(path));
  } catch {
    cache = undefined; // no cache: compiled as usual
  }
  runBundle(compileBundle(path, cache), path);
}
