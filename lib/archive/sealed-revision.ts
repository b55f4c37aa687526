/**
 * Reading one sealed revision back as the documents and comparisons use it: its manifest, the
 * basis as sealed (text and validated basis) and the results as sealed (never recomputed here;
 * the audit recomputes). Problems become UserErrors naming the file and advising an audit.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { loadBasisText } from '../basis/load.ts';
import { formatDiagnostic } from '../basis/diagnostics.ts';
import type { DesignBasis } from '../basis/types.ts';
import { resultsSchema, type Results } from '../plant/results-schema.ts';
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { SEALED_FILES, sealedDir, type SealManifest } from './layout.ts';
import { parseManifest } from './manifest.ts';

export interface SealedRevision {
  revision: string;
  /** projects/<id>/sealed/<rev>, as messages show it. */
  display: string;
  manifest: SealManifest;
  manifestBytes: Buffer;
  basisText: string;
  basis: DesignBasis;
  results: Results;
}

function damaged(display: string, id: string, detail: string): UserError {
  return new UserError(`${display}: ${detail}; run cellbasis audit ${id} for the full report`, EXIT_VALIDATION);
}

function readBytes(dir: string, display: string, id: string, name: string): Buffer {
  try {
    return readFileSync(join(dir, name));
  } catch (error) {
    throw damaged(display, id, `cannot read ${name} (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})`);
  }
}

export function readSealedRevision(cwd: string, projectId: string, revision: string): SealedRevision {
  const dir = sealedDir(cwd, projectId, revision);
  const display = `projects/${projectId}/sealed/${revision}`;
  const manifestBytes = readBytes(dir, display, projectId, SEALED_FILES.manifest);
  const parsed = parseManifest(manifestBytes);
  if (!parsed.ok) throw damaged(display, projectId, parsed.problems[0]!);
  const basisText = readBytes(dir, display, projectId, SEALED_FILES.basis).toString('utf8');
  const loaded = loadBasisText(basisText, `${display}/${SEALED_FILES.basis}`, projectId);
  if (!loaded.ok) throw damaged(display, projectId, `the sealed basis has errors: ${formatDiagnostic(loaded.errors[0]!)}`);
  let results: Results;
  try {
    results = resultsSchema.parse(JSON.parse(readBytes(dir, display, projectId, SEALED_FILES.results).toString('utf8')));
  } catch (error) {
    throw damaged(display, projectId, `${SEALED_FILES.results} is not a results object (${(error as Error).message.split('\n')[0]})`);
  }
  return { revision, display, manifest: parsed.manifest, manifestBytes, basisText, basis: loaded.basis, results };
}
