/**
 * Reading one issued revision back as the documents and comparisons use it: its manifest, the
 * basis as issued (text, and the basis validated by today's loader where it still reads it) and the results as issued (never recomputed here;
 * the audit recomputes), of which only what comparisons need is read, tolerant of the results
 * format of the version that issued it (issued-results.ts). Problems become UserErrors naming the file and advising an audit. A
 * revision of manifest format 1 carries the revision and status in its basis; they are read past
 * (the audit checks them against the manifest).
 */
import { loadBasisText } from '../basis/load.ts';
import { formatDiagnostic } from '../basis/diagnostics.ts';
import type { DesignBasis } from '../basis/types.ts';
import type { ComparableResults } from '../plant/comparable-results.ts';
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { FORMER_MANIFEST_FORMAT, ISSUED_FILES, issuedDir, type IssueManifest } from './layout.ts';
import { parseManifest } from './manifest.ts';
import { readIssuedFile } from './issued-files.ts';
import { readIssuedResults } from './issued-results.ts';

export interface IssuedRevision {
  revision: string;
  /** projects/<id>/issued/<rev>, as messages show it. */
  display: string;
  manifest: IssueManifest;
  manifestBytes: Buffer;
  basisText: string;
  /**
   * The basis as issued, validated by today's loader; null when today's loader does not read it
   * (a revision issued by an earlier version whose basis format has changed since): the revision
   * stays readable, its pages are the issued files and comparisons work on `basisText`.
   */
  basis: DesignBasis | null;
  /** Today's loader's first objection to the issued basis (with basis null), else null. */
  basisProblem: string | null;
  /** The results as issued, as far as comparisons read them (issued-results.ts): never checked against today's results schema. */
  results: ComparableResults;
}

function damaged(display: string, id: string, detail: string): UserError {
  return new UserError(`${display}: ${detail}; run cellbasis audit ${id} for the full report`, EXIT_VALIDATION);
}

/** Loads an issued basis; bases of format 1 carry document.revision and document.status, read past. */
export function loadIssuedBasis(text: string | Uint8Array, file: string, projectId: string, manifest: IssueManifest | null) {
  return loadBasisText(text, file, projectId, { formerRevisionKeys: manifest?.format === FORMER_MANIFEST_FORMAT });
}

export function readIssuedRevision(cwd: string, projectId: string, revision: string): IssuedRevision {
  const dir = issuedDir(cwd, projectId, revision);
  const display = `projects/${projectId}/issued/${revision}`;
  const read = (name: string) => {
    try {
      return readIssuedFile(dir, display, name);
    } catch (error) {
      throw damaged(display, projectId, `cannot read ${name}: ${(error as Error).message.replace(`${display}/${name}: `, '')}`);
    }
  };
  const manifestBytes = read(ISSUED_FILES.manifest);
  const parsed = parseManifest(manifestBytes);
  if (!parsed.ok) throw damaged(display, projectId, parsed.problems[0]!);
  const basisText = read(ISSUED_FILES.basis).toString('utf8');
  const loaded = loadIssuedBasis(basisText, `${display}/${ISSUED_FILES.basis}`, projectId, parsed.manifest);
  // Not damage: its bytes are the audit's to check (hash and signature); an issued basis that
  // today's format rejects is read as text only.
  const basisProblem = loaded.ok ? null : formatDiagnostic(loaded.errors[0]!);
  let raw: unknown;
  try {
    raw = JSON.parse(read(ISSUED_FILES.results).toString('utf8'));
  } catch (error) {
    if (error instanceof UserError) throw error;
    throw damaged(`${display}/${ISSUED_FILES.results}`, projectId, `is not JSON (${(error as Error).message.split('\n')[0]})`);
  }
  const results = readIssuedResults(raw);
  if (!results.ok) throw damaged(`${display}/${ISSUED_FILES.results}`, projectId, `field ${results.field}: ${results.problem}`);
  return { revision, display, manifest: parsed.manifest, manifestBytes, basisText, basis: loaded.ok ? loaded.basis : null, basisProblem, results: results.results };
}
