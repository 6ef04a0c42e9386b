/**
 * Libraries loaded on first use, not at start-up (a plan of JSON files never needs the
 * YAML parser, the XML parser or the Moon's theory). Each is a CommonJS package, so
 * `require` loads it synchronously where it is first called; the types are the packages'
 * own.
 */
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

function lazy<T>(name: string): () => T {
  let mod: T | undefined;
  return () => (mod ??= require(name) as T);
}

export const yamlLib = lazy<typeof import('yaml')>('yaml');
export const xmlLib = lazy<typeof import('fast-xml-parser')>('fast-xml-parser');
export const astronomyLib = lazy<typeof import('astronomy-engine')>('astronomy-engine');
