/**
 * Shared by the publishing tests: a working folder holding copies of the demo projects (without
 * their committed archives), issued revisions written into it in the layout of
 * lib/archive/layout.ts without Chromium (the basis as issued, its results, the document rendered
 * as issue renders it, a one-page PDF and the manifest with the SHA-256 of each, linked to the
 * revision before), a digest of a folder tree (to show a failed build changed nothing) and
 * captured runs of the command line.
 */
import { createHash } from 'node:crypto';
import { cpSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { createServer, type AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';
import { PDFDocument, StandardFonts } from 'pdf-lib';
import { loadBasisText } from '../../lib/basis/load.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { manifestBytes, signOffOf } from '../../lib/archive/manifest.ts';
import type { IssueManifest } from '../../lib/archive/layout.ts';
import { ISSUED_FILES, MANIFEST_FORMAT, issuedDir } from '../../lib/archive/layout.ts';
import { readIssuedFolder } from '../../lib/archive/issued-folder.ts';
import { readIssuedRevision } from '../../lib/archive/issued-revision.ts';
import { issuedDocumentInput } from '../../lib/archive/issued-document.ts';
import { sha256Hex } from '../../lib/archive/hash.ts';
import type { IssueStatus } from '../../lib/basis/revisions.ts';
import { renderStandaloneHtml } from '../../lib/publish/render.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';
import { sha256, treeDigest } from './tree-digest.ts';

export const DEMO_PROJECTS = ['corrin-beck-mcfc-biogas', 'hob-tor-pem-backup', 'kestrelford-pem-electrolyser', 'thistlemere-sofc-chp'];

/** A temporary folder with projects/ holding copies of the demo projects (their working drafts). */
export function demoRoot(projects: readonly string[] = DEMO_PROJECTS): string {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-site-'));
  for (const id of projects) cpSync(join(PACKAGE_ROOT, 'projects', id, 'basis.yaml'), join(root, 'projects', id, 'basis.yaml'));
  return root;
}

/**
 * A port no process on this machine listens on now, as the system hands out for port 0: for a
 * test server (a fixed port, or one derived from the process id, is taken now and then by
 * another run or by an outgoing connection in the ephemeral range).
 */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer().listen(0, '127.0.0.1', () => {
      const { port } = server.address() as AddressInfo;
      server.close(() => resolve(port));
    });
    server.on('error', reject);
  });
}

export function basisFile(root: string, id: string): string {
  return join(root, 'projects', id, 'basis.yaml');
}

async function onePagePdf(title: string): Promise<Uint8Array> {
  const pdf = await PDFDocument.create();
  const page = pdf.addPage([595, 842]);
  page.drawText(title, { x: 60, y: 780, size: 12, font: await pdf.embedFont(StandardFonts.Helvetica) });
  pdf.setCreationDate(new Date('2026-01-01T00:00:00Z'));
  pdf.setModificationDate(new Date('2026-01-01T00:00:00Z'));
  return pdf.save();
}

/** Writes projects/<id>/issued/<rev>/ from the project's basis text as edited, following the revisions issued there. */
export async function issueFixture(root: string, id: string, revision: string, status: IssueStatus, issuedOn: string, edit: (t: string) => string = (t) => t): Promise<void> {
  const text = edit(readFileSync(basisFile(root, id), 'utf8'));
  const loaded = loadBasisText(text, `projects/${id}/issued/${revision}/basis.yaml`, id);
  if (!loaded.ok) throw new Error(loaded.errors.map((e) => e.message).join('\n'));
  const results = calculate(loaded.basis);
  const previous = readIssuedFolder(root, id).revisions.map((r) => readIssuedRevision(root, id, r));
  const last = previous[previous.length - 1];
  const manifest: IssueManifest = {
    format: MANIFEST_FORMAT,
    project: id,
    documentNumber: loaded.basis.document.number,
    title: loaded.basis.document.title,
    revision,
    status,
    note: `revision ${revision} for the test`,
    issuedOn,
    issuedAt: `${issuedOn}T00:00:00.000Z`,
    tool: { name: 'cellbasis', version: results.tool.version },
    speciesData_sha256: results.speciesData_sha256,
    files: {},
    previous: last ? { revision: last.revision, manifest_sha256: sha256Hex(last.manifestBytes) } : null,
    signOff: signOffOf(loaded.basis),
    signatures: [],
  };
  const html = renderStandaloneHtml(issuedDocumentInput({ basis: loaded.basis, results, manifest, previous, basisText: text }));
  const dir = issuedDir(root, id, revision);
  mkdirSync(dir, { recursive: true });
  const files: Record<string, Uint8Array | string> = {
    [ISSUED_FILES.basis]: text,
    [ISSUED_FILES.results]: `${JSON.stringify(results, null, 2)}\n`,
    [ISSUED_FILES.html]: html,
    [ISSUED_FILES.pdf]: await onePagePdf(`${loaded.basis.document.number} revision ${revision}`),
  };
  for (const [name, bytes] of Object.entries(files)) writeFileSync(join(dir, name), bytes);
  manifest.files = Object.fromEntries(Object.entries(files).map(([name, bytes]) => [name, sha256(bytes)]));
  writeFileSync(join(dir, ISSUED_FILES.manifest), manifestBytes(manifest));
}

export const SOFC = 'thistlemere-sofc-chp';

/** SOURCE_DATE_EPOCH of the test builds: 2026-01-01. */
export const EPOCH = { SOURCE_DATE_EPOCH: '1767225600' };

/**
 * The demo projects with two issued revisions of the solid oxide project (A at 760 °C, then B as
 * the project stands), so that its working draft is the draft of revision C.
 */
export async function issuedDemoRoot(): Promise<string> {
  const root = demoRoot();
  await issueFixture(root, SOFC, 'A', 'issued for review', '2026-06-02', (t) => t.replace('value: "750 C", source: R3', 'value: "760 C", source: R3'));
  await issueFixture(root, SOFC, 'B', 'issued for review', '2026-09-22');
  return root;
}

/**
 * A PDF as the layout comparisons read it: the text outside its streams and each stream's body
 * (inflated when it is Flate-compressed), /Length values and the cross-reference offsets (table
 * or stream) left out, since a stream one byte longer shifts them.
 */
function layoutParts(bytes: Buffer): { text: string; stream: boolean }[] {
  const parts: { text: string; stream: boolean }[] = [];
  const text = bytes.toString('latin1');
  const streamStart = /\/Length (\d+)([^]*?)>>\s*stream\r?\n/g;
  let from = 0;
  for (let m = streamStart.exec(text); m; m = streamStart.exec(text)) {
    const length = Number(m[1]);
    const start = m.index + m[0].length;
    parts.push({ text: text.slice(from, m.index) + m[2], stream: false });
    from = start + length;
    streamStart.lastIndex = from;
    // A cross-reference stream (§7.5.8) holds byte offsets: its body is left out.
    if (/\/Type\s*\/XRef\b/.test(text.slice(text.lastIndexOf('<<', m.index), start))) continue;
    let body = bytes.subarray(start, start + length);
    if (/\/FlateDecode/.test(text.slice(Math.max(0, m.index - 200), start))) {
      try {
        body = inflateSync(body);
      } catch {
        // not a whole deflate stream: counted as it is
      }
    }
    parts.push({ text: body.toString('latin1'), stream: true });
  }
  // The cross-reference table and startxref give byte offsets.
  parts.push({ text: text.slice(from).replace(/\bxref\r?\n[^]*?trailer/, 'xref trailer').replace(/startxref\s+\d+/, 'startxref'), stream: false });
  return parts;
}

/** Hex and literal strings (the glyphs shown), numbers, and what lies between them. */
const LAYOUT_TOKEN = /<[0-9A-Fa-f\s]*>|\((?:\\.|[^\\)])*\)|-?\d*\.\d+|-?\d+/g;

/**
 * A digest of a PDF that ignores where Chromium puts each glyph to a fraction of a unit: every
 * number in a stream of layoutParts rounded to a whole unit; everything else counts byte for byte. Under
 * heavy load one print in about a hundred in a stress run of our own placed one glyph 1/8 unit
 * lower (a text matrix of 6541.125 against 6541); a torn or other document still differs. A
 * number that lies near a half unit can still round both ways: to compare two prints, use
 * pdfLayoutMismatch.
 */
export function pdfLayoutDigest(bytes: Buffer): string {
  const hash = createHash('sha256');
  for (const { text, stream } of layoutParts(bytes)) hash.update(stream ? text.replace(LAYOUT_TOKEN, (t) => (/^[<(]/.test(t) ? t : String(Math.round(Number(t))))) : text);
  return hash.digest('hex');
}

/**
 * Where two PDFs differ in more than where a glyph or line stands to within `toleranceUnits`
 * (every number in a stream of layoutParts compared with that tolerance, everything else byte
 * for byte), or
 * null when they do not. Two prints of the same page have differed by one layout unit (1/64 CSS
 * px, 0.0156 in Chromium's content streams: a text matrix of 11478 against 11478.0156); a
 * whole-unit digest (pdfLayoutDigest) tells those apart when the value lies at a half unit, which
 * failed a CI run. The default tolerance, 1/8 unit, is eight layout units and far below anything
 * a reader could see; a moved line or another glyph still differs.
 */
export function pdfLayoutMismatch(a: Buffer, b: Buffer, toleranceUnits = 0.125): string | null {
  const [pa, pb] = [layoutParts(a), layoutParts(b)];
  if (pa.length !== pb.length) return `${pa.length} against ${pb.length} parts`;
  for (let i = 0; i < pa.length; i++) {
    const [a, b] = [pa[i]!, pb[i]!];
    if (!a.stream || !b.stream) {
      if (a.text !== b.text) return `part ${i}: ${a.text.slice(0, 80)} against ${b.text.slice(0, 80)}`;
      continue;
    }
    const [ta, tb] = [a.text.match(LAYOUT_TOKEN) ?? [], b.text.match(LAYOUT_TOKEN) ?? []];
    const [ra, rb] = [a.text.replace(LAYOUT_TOKEN, '#'), b.text.replace(LAYOUT_TOKEN, '#')];
    if (ra !== rb || ta.length !== tb.length) return `part ${i}: ${ra.slice(0, 80)} against ${rb.slice(0, 80)}`;
    for (let k = 0; k < ta.length; k++) {
      const [x, y] = [ta[k]!, tb[k]!];
      const isString = /^[<(]/.test(x) || /^[<(]/.test(y);
      if (isString ? x !== y : Math.abs(Number(x) - Number(y)) > toleranceUnits) return `part ${i}, token ${k}: ${x} against ${y}`;
    }
  }
  return null;
}

/** treeDigest, with each PDF digested by pdfLayoutDigest: for sites whose drafts are printed anew. */
export function treeLayoutDigest(root: string): Record<string, string> {
  const out = treeDigest(root);
  for (const path of Object.keys(out)) if (path.endsWith('.pdf')) out[path] = `layout:${pdfLayoutDigest(readFileSync(join(root, path)))}`;
  return out;
}

/** Every HTML page under a built site, as site paths. */
export function htmlPages(site: string): string[] {
  return Object.keys(treeDigest(site)).filter((p) => p.endsWith('.html')).sort();
}
