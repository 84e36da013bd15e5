import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** True when the module at `metaUrl` is the script node was asked to run. */
export function isMain(metaUrl: string): boolean {
  const script = process.argv[1];
  if (!script) return false;
  try {
    return realpathSync(fileURLToPath(metaUrl)) === realpathSync(script);
  } catch {
    return false;
  }
}
