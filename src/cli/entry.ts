/** Whether the module at `metaUrl` (its import.meta.url) is the program node was started with. */
import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export function isEntryModule(metaUrl: string): boolean {
  const entry = process.argv[1];
  if (entry === undefined) return false;
  try {
    return realpathSync(entry) === realpathSync(fileURLToPath(metaUrl));
  } catch {
    return false;
  }
}
