/**
 * The manifest of a sealed revision (SealManifest, layout.ts) as bytes and back: written as
 * JSON with a fixed key order, two-space indent and a trailing newline, so the same seal gives
 * the same bytes (the signature covers exactly these bytes); read back with every shape problem
 * named, so an audit can say what is wrong with a damaged manifest.
 */
import { z } from 'zod';
import { DOCUMENT_STATUSES, type DesignBasis } from '../basis/types.ts';
import { HASHED_FILES, type SealManifest } from './layout.ts';

const hex64 = z.string().regex(/^[0-9a-f]{64}$/, 'a SHA-256 in lower-case hex');

const manifestSchema = z.object({
  format: z.literal('cellbasis-seal/1'),
  project: z.string(),
  documentNumber: z.string(),
  title: z.string(),
  revision: z.string(),
  status: z.enum(DOCUMENT_STATUSES as [SealManifest['status'], ...SealManifest['status'][]]),
  note: z.string(),
  sealedOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'a date YYYY-MM-DD'),
  sealedAt: z.string().optional(),
  tool: z.object({ name: z.literal('cellbasis'), version: z.string() }),
  speciesData_sha256: hex64,
  files: z.record(z.string(), hex64),
  previous: z.object({ revision: z.string(), manifest_sha256: hex64 }).nullable(),
  signOff: z.array(z.object({ role: z.enum(['prepared', 'checked', 'approved']), name: z.string(), date: z.string().optional() })),
  publicKey: z.string().optional(),
  pdf: z.object({ chromium: z.string() }).optional(),
});

/** The manifest's bytes: keys in the order of SealManifest, files in the order of HASHED_FILES. */
export function manifestBytes(m: SealManifest): Buffer {
  const files: Record<string, string> = {};
  for (const name of [...HASHED_FILES, ...Object.keys(m.files).sort()]) if (m.files[name] !== undefined) files[name] = m.files[name]!;
  const ordered: SealManifest = {
    format: m.format,
    project: m.project,
    documentNumber: m.documentNumber,
    title: m.title,
    revision: m.revision,
    status: m.status,
    note: m.note,
    sealedOn: m.sealedOn,
    ...(m.sealedAt !== undefined ? { sealedAt: m.sealedAt } : {}),
    tool: { name: m.tool.name, version: m.tool.version },
    speciesData_sha256: m.speciesData_sha256,
    files,
    previous: m.previous ? { revision: m.previous.revision, manifest_sha256: m.previous.manifest_sha256 } : null,
    signOff: m.signOff.map((s) => ({ role: s.role, name: s.name, ...(s.date !== undefined ? { date: s.date } : {}) })),
    ...(m.publicKey !== undefined ? { publicKey: m.publicKey } : {}),
    ...(m.pdf !== undefined ? { pdf: { chromium: m.pdf.chromium } } : {}),
  };
  return Buffer.from(`${JSON.stringify(ordered, null, 2)}\n`, 'utf8');
}

export type ParsedManifest = { ok: true; manifest: SealManifest } | { ok: false; problems: string[] };

/** Reads manifest.json bytes; the problems name each field that is missing or malformed. */
export function parseManifest(bytes: Uint8Array): ParsedManifest {
  let data: unknown;
  try {
    data = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(bytes));
  } catch (error) {
    return { ok: false, problems: [`manifest.json is not JSON (${(error as Error).message})`] };
  }
  const parsed = manifestSchema.safeParse(data);
  if (!parsed.success) {
    return { ok: false, problems: parsed.error.issues.map((i) => `manifest.json: ${i.path.length ? i.path.join('.') : '(root)'}: ${i.message}`) };
  }
  return { ok: true, manifest: parsed.data as SealManifest };
}

/** The signatories of a basis as a manifest records them, in the order prepared, checked, approved. */
export function signOffOf(basis: DesignBasis): SealManifest['signOff'] {
  return (['prepared', 'checked', 'approved'] as const).flatMap((role) => {
    const person = basis.document.signOff[role];
    return person ? [{ role, name: person.name, ...(person.date ? { date: person.date } : {}) }] : [];
  });
}
