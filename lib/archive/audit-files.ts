/**
 * The files of an issued revision folder against its manifest: every issued file present and
 * with the SHA-256 the manifest records, a signature file for each signature it records and for
 * nothing else, nothing else in the folder, nothing else listed. Files are read only when they
 * are regular files, with the size limits of layout.ts (issued-files.ts).
 */
import { readdirSync } from 'node:fs';
import { HASHED_FILES, ISSUED_FILES, signatureFiles, type IssueManifest } from './layout.ts';
import { readIssuedFile } from './issued-files.ts';
import { sha256Hex } from './hash.ts';
import { finding, type AuditFinding } from './audit-finding.ts';

export function fileProblems(dir: string, display: string, manifest: IssueManifest | null): AuditFinding[] {
  const out: AuditFinding[] = [];
  const signatures = manifest ? signatureFiles(manifest).map((s) => s.file) : [];
  const allowed = new Set<string>([...HASHED_FILES, ISSUED_FILES.manifest, ...signatures]);
  for (const entry of readdirSync(dir, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name))) {
    if (!allowed.has(entry.name)) {
      const why = /\.sig$/.test(entry.name) && manifest ? `a signature manifest.json does not record` : 'not part of an issued revision';
      out.push(finding(`extra ${entry.isDirectory() ? 'folder' : 'file'} ${entry.name} (${why})`));
    } else if (!entry.isFile()) out.push(finding(`${entry.name} is not a regular file`));
  }
  if (!manifest) return out;
  for (const name of HASHED_FILES) {
    let bytes: Buffer;
    try {
      bytes = readIssuedFile(dir, display, name);
    } catch (error) {
      out.push(finding(/does not exist/.test((error as Error).message) ? `${name} is missing` : (error as Error).message.replace(`${display}/`, '')));
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
    if (!(HASHED_FILES as readonly string[]).includes(name)) out.push(finding(`manifest.json lists ${name}, which is not an issued file`));
  }
  return out;
}
