/**
 * The manifest against itself and against the files it seals, so that no byte of it can change
 * unnoticed even without a signature: it must be byte for byte what cellbasis writes for its
 * content (manifest.ts), name this project and revision, and agree with the sealed basis
 * (number, title, revision, status, sign-off), the sealed results (tool version, species data),
 * the PDF (dates to the second, the Chromium named as producer, the attached basis and results
 * equal to the sealed files) and the HTML (the note appears in the document).
 */
import type { DesignBasis } from '../basis/types.ts';
import type { PdfProperties } from '../core/pdf-properties.ts';
import { escapeHtml } from '../report/trusted-html.ts';
import type { SealManifest } from './layout.ts';
import { SEALED_FILES } from './layout.ts';
import { manifestBytes, signOffOf } from './manifest.ts';
import { finding, type AuditFinding } from './audit-finding.ts';

export interface SealedContent {
  basis?: DesignBasis;
  basisBytes?: Buffer;
  /** results.json as parsed, unchecked. */
  results?: { tool?: { version?: unknown }; speciesData_sha256?: unknown };
  resultsBytes?: Buffer;
  pdf?: PdfProperties;
  html?: string;
}

function differs(field: string, recorded: unknown, where: string, actual: unknown): AuditFinding {
  return finding(`manifest.json: ${field} ${JSON.stringify(recorded)} differs from ${where} (${JSON.stringify(actual)})`);
}

function basisProblems(m: SealManifest, basis: DesignBasis): AuditFinding[] {
  const d = basis.document;
  const out: AuditFinding[] = [];
  const pairs: [string, unknown, unknown][] = [
    ['documentNumber', m.documentNumber, d.number],
    ['title', m.title, d.title],
    ['revision', m.revision, d.revision],
    ['status', m.status, d.status],
    ['signOff', m.signOff, signOffOf(basis)],
  ];
  for (const [field, recorded, actual] of pairs) if (JSON.stringify(recorded) !== JSON.stringify(actual)) out.push(differs(field, recorded, `the sealed ${SEALED_FILES.basis}`, actual));
  return out;
}

function pdfProblems(m: SealManifest, pdf: PdfProperties, content: SealedContent): AuditFinding[] {
  const out: AuditFinding[] = [];
  const at = Date.parse(m.sealedAt ?? `${m.sealedOn}T00:00:00Z`);
  if (Number.isNaN(at) || new Date(at).toISOString().slice(0, 10) !== m.sealedOn) out.push(finding(`manifest.json: sealedAt ${m.sealedAt} is not on sealedOn ${m.sealedOn}`));
  const second = Math.floor(at / 1000);
  for (const [name, date] of [
    ['CreationDate', pdf.creationDate],
    ['ModDate', pdf.modificationDate],
  ] as const) {
    if (!date || Math.floor(date.getTime() / 1000) !== second) out.push(finding(`${SEALED_FILES.pdf}: ${name} ${date?.toISOString() ?? 'missing'} is not the seal time of manifest.json (${new Date(at).toISOString()})`));
  }
  const chromium = /\(Chromium ([^)]+)\)$/.exec(pdf.producer ?? '')?.[1];
  if (m.pdf && chromium !== m.pdf.chromium) out.push(differs('pdf.chromium', m.pdf.chromium, `the producer of ${SEALED_FILES.pdf}`, pdf.producer ?? null));
  for (const [name, bytes] of [
    [SEALED_FILES.basis, content.basisBytes],
    [SEALED_FILES.results, content.resultsBytes],
  ] as const) {
    const attached = pdf.attachments.get(name);
    if (!attached) out.push(finding(`${SEALED_FILES.pdf} has no attached ${name}`));
    else if (bytes && !Buffer.from(attached).equals(bytes)) out.push(finding(`${SEALED_FILES.pdf}: its attached ${name} differs from the sealed ${name}`));
  }
  return out;
}

export function manifestProblems(m: SealManifest, bytes: Buffer, project: string, revision: string, content: SealedContent): AuditFinding[] {
  const out: AuditFinding[] = [];
  if (!manifestBytes(m).equals(bytes)) out.push(finding('manifest.json is not byte for byte as cellbasis writes its content (edited after sealing?)'));
  if (m.project !== project) out.push(finding(`manifest.json is of project ${m.project}, not ${project}`));
  if (m.revision !== revision) out.push(finding(`manifest.json is of revision ${m.revision}, not ${revision}`));
  if (content.basis) out.push(...basisProblems(m, content.basis));
  if (content.results) {
    const r = content.results;
    if (r.tool?.version !== m.tool.version) out.push(differs('tool.version', m.tool.version, `the sealed ${SEALED_FILES.results}`, r.tool?.version ?? null));
    if (r.speciesData_sha256 !== m.speciesData_sha256) out.push(differs('speciesData_sha256', m.speciesData_sha256, `the sealed ${SEALED_FILES.results}`, r.speciesData_sha256 ?? null));
  }
  if (content.pdf) out.push(...pdfProblems(m, content.pdf, content));
  if (content.html !== undefined && m.note !== '' && !content.html.includes(escapeHtml(m.note)) && !content.html.includes(m.note)) {
    out.push(finding(`manifest.json: the note ${JSON.stringify(m.note)} does not appear in ${SEALED_FILES.html}`));
  }
  return out;
}
