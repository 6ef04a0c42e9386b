/** Where the bundled demo scenario lives, whether run from src/ or dist/. */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export function packageRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 6; i++) {
    if (existsSync(join(dir, 'package.json')) && existsSync(join(dir, 'ephemerides'))) return dir;
    dir = dirname(dir);
  }
  throw new Error('passbudget: cannot find the package root (ephemerides/ next to package.json)');
}

export function demoFiles(): { spacecraftFile: string; networkFile: string } {
  const root = packageRoot();
  return {
    spacecraftFile: join(root, 'ephemerides', 'demo-fleet.json'),
    networkFile: join(root, 'stations', 'demo-network.yaml'),
  };
}

/** The version in package.json (for --version). */
export function packageVersion(): string {
  const pkg = JSON.parse(readFileSync(join(packageRoot(), 'package.json'), 'utf8')) as { version?: unknown };
  return typeof pkg.version === 'string' ? pkg.version : 'unknown';
}
