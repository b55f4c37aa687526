/** The tool version, read from package.json (recorded in results and the manifests of issued revisions). */
import { readFileSync } from 'node:fs';

let version: string | undefined;

export function toolVersion(): string {
  version ??= (JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string }).version;
  return version;
}
