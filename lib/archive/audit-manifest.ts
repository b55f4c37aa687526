/**
 * The manifest against itself and against the files it lists, so that no byte of it can change
 * unnoticed even without a signature: it must be byte for byte what cellbasis writes for its
 * content (manifest.ts), name this project and revision, and agree with the issued basis
 * (number, title, sign-off, a signature only for a role of the sign-off; in format 1 also the
 * revision and status the basis and results then carried), the issued results (tool version,
 * species data), the PDF (dates to the second, the Chromium named as producer, the attached basis
 * and results equal to the issued files) and the HTML (the note appears in the document).
 */
import type { DesignBasis } from '../basis/types.ts';
import type { PdfProperties } from '../core/pdf-properties.ts';
import { escapeHtml } from '../report/trusted-html.ts';
import { parseDocument } from 'yaml';
import { FORMER_MANIFEST_FORMAT, ISSUED_FILES, type IssueManifest } from './layout.ts';
import { manifestBytes, signOffOf } from './manifest.ts';
import { finding, type AuditFinding } from './audit-finding.ts';

export interface IssuedContent {
  basis?: DesignBasis;
  basisBytes?: Buffer;
  /** results.json as parsed, unchecked. */
  results?: { tool?: { version?: unknown }; speciesData_sha256?: unknown; project?: { revision?: unknown; status?: unknown } };
  resultsBytes?: Buffer;
  pdf?: PdfProperties;
  html?: string;
}

function differs(field: string, recorded: unknown, where: string, actual: unknown): AuditFinding {
  return finding(`manifest.json: ${field} ${JSON.stringify(recorded)} differs from ${where} (${JSON.stringify(actual)})`);
}

/** document.revision and document.status as a basis of format 1 states them. */
function formerRevisionKeys(bytes: Buffer | undefined): { revision: unknown; status: unknown } {
  if (!bytes) return { revision: undefined, status: undefined };
  const doc = parseDocument(bytes.toString('utf8'));
  return { revision: doc.getIn(['document', 'revision']), status: doc.getIn(['document', 'status']) };
}

function basisProblems(m: IssueManifest, basis: DesignBasis, content: IssuedContent): AuditFinding[] {
  const d = basis.document;
  const out: AuditFinding[] = [];
  const pairs: [string, unknown, unknown][] = [
    ['documentNumber', m.documentNumber, d.number],
    ['title', m.title, d.title],
    ['signOff', m.signOff, signOffOf(basis)],
  ];
  if (m.format === FORMER_MANIFEST_FORMAT) {
    const stated = formerRevisionKeys(content.basisBytes);
    pairs.push(['revision', m.revision, stated.revision], ['status', m.status, stated.status]);
  }
  for (const [field, recorded, actual] of pairs) if (JSON.stringify(recorded) !== JSON.stringify(actual)) out.push(differs(field, recorded, `the issued ${ISSUED_FILES.basis}`, actual));
  for (const s of m.signatures) {
    if (!d.signOff[s.role]) out.push(finding(`manifest.json records a signature for ${s.role}, but the issued ${ISSUED_FILES.basis} names nobody who ${s.role} it`));
  }
  return out;
}

function pdfProblems(m: IssueManifest, pdf: PdfProperties, content: IssuedContent): AuditFinding[] {
  const out: AuditFinding[] = [];
  const at = Date.parse(m.issuedAt ?? `${m.issuedOn}T00:00:00Z`);
  if (Number.isNaN(at) || new Date(at).toISOString().slice(0, 10) !== m.issuedOn) out.push(finding(`manifest.json: issuedAt ${m.issuedAt} is not on issuedOn ${m.issuedOn}`));
  const second = Math.floor(at / 1000);
  for (const [name, date] of [
    ['CreationDate', pdf.creationDate],
    ['ModDate', pdf.modificationDate],
  ] as const) {
    if (!date || Math.floor(date.getTime() / 1000) !== second) out.push(finding(`${ISSUED_FILES.pdf}: ${name} ${date?.toISOString() ?? 'missing'} is not the issue time of manifest.json (${new Date(at).toISOString()})`));
  }
  const chromium = /\(Chromium ([^)]+)\)$/.exec(pdf.producer ?? '')?.[1];
  if (m.pdf && chromium !== m.pdf.chromium) out.push(differs('pdf.chromium', m.pdf.chromium, `the producer of ${ISSUED_FILES.pdf}`, pdf.producer ?? null));
  for (const [name, bytes] of [
    [ISSUED_FILES.basis, content.basisBytes],
    [ISSUED_FILES.results, content.resultsBytes],
  ] as const) {
    const attached = pdf.attachments.get(name);
    if (!attached) out.push(finding(`${ISSUED_FILES.pdf} has no attached ${name}`));
    else if (bytes && !Buffer.from(attached).equals(bytes)) out.push(finding(`${ISSUED_FILES.pdf}: its attached ${name} differs from the issued ${name}`));
  }
  return out;
}

export function manifestProblems(m: IssueManifest, bytes: Buffer, project: string, revision: string, content: IssuedContent): AuditFinding[] {
  const out: AuditFinding[] = [];
  if (!manifestBytes(m).equals(bytes)) out.push(finding('manifest.json is not byte for byte as cellbasis writes its content (edited after issuing?)'));
  if (m.project !== project) out.push(finding(`manifest.json is of project ${m.project}, not ${project}`));
  if (m.revision !== revision) out.push(finding(`manifest.json is of revision ${m.revision}, not ${revision}`));
  if (content.basis) out.push(...basisProblems(m, content.basis, content));
  if (content.results) {
    const r = content.results;
    if (r.tool?.version !== m.tool.version) out.push(differs('tool.version', m.tool.version, `the issued ${ISSUED_FILES.results}`, r.tool?.version ?? null));
    if (r.speciesData_sha256 !== m.speciesData_sha256) out.push(differs('speciesData_sha256', m.speciesData_sha256, `the issued ${ISSUED_FILES.results}`, r.speciesData_sha256 ?? null));
    if (m.format === FORMER_MANIFEST_FORMAT) {
      if (r.project?.revision !== m.revision) out.push(differs('revision', m.revision, `the issued ${ISSUED_FILES.results}`, r.project?.revision ?? null));
      if (r.project?.status !== m.status) out.push(differs('status', m.status, `the issued ${ISSUED_FILES.results}`, r.project?.status ?? null));
    }
  }
  if (content.pdf) out.push(...pdfProblems(m, content.pdf, content));
  if (content.html !== undefined && m.note !== '' && !content.html.includes(escapeHtml(m.note)) && !content.html.includes(m.note)) {
    out.push(finding(`manifest.json: the note ${JSON.stringify(m.note)} does not appear in ${ISSUED_FILES.html}`));
  }
  return out;
}
