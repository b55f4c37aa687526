/**
 * The files of a sealed revision folder against its manifest: every sealed file present and
 * with the SHA-256 the manifest records, nothing else in the folder, nothing else listed.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { HASHED_FILES, SEALED_FILES, type SealManifest } from './layout.ts';
import { sha256Hex } from './hash.ts';
import { finding, type AuditFinding } from './audit-finding.ts';

const ALLOWED = new Set<string>([...HASHED_FILES, SEALED_FILES.manifest, SEALED_FILES.signature]);

export function fileProblems(dir: string, manifest: SealManifest | null): AuditFinding[] {
  const out: AuditFinding[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name))) {
    if (!ALLOWED.has(entry.name)) out.push(finding(`extra ${entry.isDirectory() ? 'folder' : 'file'} ${entry.name} (not part of a sealed revision)`));
    else if (!entry.isFile()) out.push(finding(`${entry.name} is not a regular file`));
  }
  if (!manifest) return out;
  for (const name of HASHED_FILES) {
    let bytes: Buffer;
    try {
      bytes = readFileSync(join(dir, name));
    } catch {
      out.push(finding(`${name} is missing`));
      continue;
    }
    const recorded = manifest.files[name];
    if (recorded === undefined) {
      out.push(finding(`${name} has no SHA-256 in manifest.json`));
      continue;
    }
    const actual = sha256Hex(bytes);
    if (actual !== recorded) out.push(finding(`${name} does not match the SHA-256 manifest.json records for it`, `${name}: SHA-256 ${actual}`, `manifest.json records ${recorded}`));
  }
  for (const name of Object.keys(manifest.files)) {
    if (!(HASHED_FILES as readonly string[]).includes(name)) out.push(finding(`manifest.json lists ${name}, which is not a sealed file`));
  }
  return out;
}
