/**
 * The manifest of an issued revision (IssueManifest, layout.ts) as bytes and back: written as
 * JSON with a fixed key order, two-space indent and a trailing newline, so the same issue gives
 * the same bytes (the signatures cover exactly these bytes); read back with every shape problem
 * named, so an audit can say what is wrong with a damaged manifest.
 *
 * Two formats are read: `cellbasis-issue/2`, which this version writes, and `cellbasis-seal/1`,
 * of revisions issued by earlier versions (its dates named sealedOn and sealedAt, one optional
 * publicKey). Each is written back in its own layout, so that the audit can check a manifest of
 * either format byte for byte.
 */
import { z } from 'zod';
import type { DesignBasis } from '../basis/types.ts';
import { ISSUE_STATUSES } from '../basis/revisions.ts';
import { FORMER_MANIFEST_FORMAT, HASHED_FILES, MANIFEST_FORMAT, SIGN_OFF_ROLES, type IssueManifest } from './layout.ts';

const hex64 = z.string().regex(/^[0-9a-f]{64}$/, 'a SHA-256 in lower-case hex');
const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'a date YYYY-MM-DD');
const role = z.enum(SIGN_OFF_ROLES as ['prepared', 'checked', 'approved']);

/** What both formats share. */
const common = {
  project: z.string(),
  documentNumber: z.string(),
  title: z.string(),
  revision: z.string(),
  status: z.enum(ISSUE_STATUSES as [IssueManifest['status'], ...IssueManifest['status'][]]),
  note: z.string(),
  tool: z.object({ name: z.literal('cellbasis'), version: z.string() }),
  speciesData_sha256: hex64,
  files: z.record(z.string(), hex64),
  previous: z.object({ revision: z.string(), manifest_sha256: hex64 }).nullable(),
  signOff: z.array(z.object({ role, name: z.string(), date: z.string().optional() })),
  pdf: z.object({ chromium: z.string() }).optional(),
};

const currentSchema = z.object({
  format: z.literal(MANIFEST_FORMAT),
  ...common,
  issuedOn: day,
  issuedAt: z.string(),
  signatures: z.array(z.object({ role, key: z.string(), fingerprint: hex64, publicKey: z.string() })),
});

const formerSchema = z.object({
  format: z.literal(FORMER_MANIFEST_FORMAT),
  ...common,
  sealedOn: day,
  sealedAt: z.string().optional(),
  publicKey: z.string().optional(),
});

/** The files in HASHED_FILES order, then any others by name. */
function orderedFiles(files: Record<string, string>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const name of [...HASHED_FILES, ...Object.keys(files).sort()]) if (files[name] !== undefined) out[name] = files[name]!;
  return out;
}

/** The manifest's bytes in the layout of its format. */
export function manifestBytes(m: IssueManifest): Buffer {
  const head = { project: m.project, documentNumber: m.documentNumber, title: m.title, revision: m.revision, status: m.status, note: m.note };
  const context = {
    tool: { name: m.tool.name, version: m.tool.version },
    speciesData_sha256: m.speciesData_sha256,
    files: orderedFiles(m.files),
    previous: m.previous ? { revision: m.previous.revision, manifest_sha256: m.previous.manifest_sha256 } : null,
    signOff: m.signOff.map((s) => ({ role: s.role, name: s.name, ...(s.date !== undefined ? { date: s.date } : {}) })),
  };
  const pdf = m.pdf !== undefined ? { pdf: { chromium: m.pdf.chromium } } : {};
  const ordered =
    m.format === FORMER_MANIFEST_FORMAT
      ? {
          format: m.format,
          ...head,
          sealedOn: m.issuedOn,
          ...(m.issuedAt !== undefined ? { sealedAt: m.issuedAt } : {}),
          ...context,
          ...(m.formerPublicKey !== undefined ? { publicKey: m.formerPublicKey } : {}),
          ...pdf,
        }
      : {
          format: m.format,
          ...head,
          issuedOn: m.issuedOn,
          issuedAt: m.issuedAt,
          ...context,
          signatures: m.signatures.map((s) => ({ role: s.role, key: s.key, fingerprint: s.fingerprint, publicKey: s.publicKey })),
          ...pdf,
        };
  return Buffer.from(`${JSON.stringify(ordered, null, 2)}\n`, 'utf8');
}

export type ParsedManifest = { ok: true; manifest: IssueManifest } | { ok: false; problems: string[] };

function problemsOf(error: z.ZodError): string[] {
  return error.issues.map((i) => `manifest.json: ${i.path.length ? i.path.join('.') : '(root)'}: ${i.message}`);
}

/** Reads manifest.json bytes of either format; the problems name each field that is missing or malformed. */
export function parseManifest(bytes: Uint8Array): ParsedManifest {
  let data: unknown;
  try {
    data = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(bytes));
  } catch (error) {
    return { ok: false, problems: [`manifest.json is not JSON (${(error as Error).message})`] };
  }
  const format = (data as { format?: unknown } | null)?.format;
  if (format === FORMER_MANIFEST_FORMAT) {
    const parsed = formerSchema.safeParse(data);
    if (!parsed.success) return { ok: false, problems: problemsOf(parsed.error) };
    const { sealedOn, sealedAt, publicKey, ...rest } = parsed.data;
    return {
      ok: true,
      manifest: { ...rest, issuedOn: sealedOn, ...(sealedAt !== undefined ? { issuedAt: sealedAt } : {}), signatures: [], ...(publicKey !== undefined ? { formerPublicKey: publicKey } : {}) },
    };
  }
  const parsed = currentSchema.safeParse(data);
  if (!parsed.success) return { ok: false, problems: problemsOf(parsed.error) };
  return { ok: true, manifest: parsed.data };
}

/** The signatories of a basis as a manifest records them, in the order prepared, checked, approved. */
export function signOffOf(basis: DesignBasis): IssueManifest['signOff'] {
  return SIGN_OFF_ROLES.flatMap((r) => {
    const person = basis.document.signOff[r];
    return person ? [{ role: r, name: person.name, ...(person.date ? { date: person.date } : {}) }] : [];
  });
}
