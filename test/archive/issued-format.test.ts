// An issued revision is a frozen record: its results.json is read by the site and compare for
// the fields they need (lib/archive/issued-results.ts), never against today's results schema.
// A revision of the committed demo archive whose results.json lacks a field today's schema
// requires and carries one it does not know (as results of another version of cellbasis would)
// still has its register page built and is compared, the comparison naming what it could not
// compare; a needed field missing or mistyped is one message naming the file, the field and what
// was expected. The audit checks hashes and signatures whatever the results hold, and
// `audit --recalculate` reports such a file's fields as differences.
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { run } from '../helpers/run-cli.ts';
import { demoRoot, issueFixture } from '../helpers/site.ts';
import { sha256 } from '../helpers/tree-digest.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';
import { readIssuedResults } from '../../lib/archive/issued-results.ts';
import { manifestBytes, parseManifest } from '../../lib/archive/manifest.ts';
import { HEADLINE_QUANTITIES } from '../../lib/archive/headline-quantities.ts';
import { PDFDocument } from 'pdf-lib';
import { loadBasisText } from '../../lib/basis/load.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { documentPdfMeta } from '../../lib/report/pdf-meta.ts';
import type { RevisionContext } from '../../lib/report/revision.ts';
import { setPdfProperties } from '../../lib/core/pdf-properties.ts';

const MCFC = 'corrin-beck-mcfc-biogas';
const BACKUP = 'hob-tor-pem-backup';

/** Rewrites results.json of a revision in `root` with `change` applied to its parsed object. */
function alterResults(root: string, project: string, revision: string, change: (r: Record<string, unknown>) => void): string {
  const path = join(root, 'projects', project, 'issued', revision, 'results.json');
  const results = JSON.parse(readFileSync(path, 'utf8')) as Record<string, unknown>;
  change(results);
  const text = `${JSON.stringify(results, null, 2)}\n`;
  writeFileSync(path, text);
  return text;
}

/** Results as another version would write them: without headline.maxCarbonActivity (which today's schema requires), with a field this version does not know. */
function otherVersion(r: Record<string, unknown>): void {
  delete (r.headline as Record<string, unknown>).maxCarbonActivity;
  r.stackTemperatureProfile_K = [923.15, 938.15, 951.15];
}

describe('a revision of the demo archive whose results.json another version wrote', () => {
  let root: string;
  beforeAll(() => {
    root = mkdtempSync(join(tmpdir(), 'cellbasis-issued-format-'));
    cpSync(join(PACKAGE_ROOT, 'projects', MCFC), join(root, 'projects', MCFC), { recursive: true });
    alterResults(root, MCFC, 'A', otherVersion);
  });
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it('is compared with revision B on what both carry, naming what it could not compare', async () => {
    // The number left out is one both revisions carry: it would be compared otherwise.
    const b = JSON.parse(readFileSync(join(root, 'projects', MCFC, 'issued', 'B', 'results.json'), 'utf8'));
    expect(typeof b.headline.maxCarbonActivity).toBe('number');
    const r = await run(['compare', MCFC, 'A', 'B'], root);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    expect(r.out).toContain('inputs changed\n');
    expect(r.out).toContain('headline results changed\n');
    expect(r.out).toMatch(/\nnot compared \(one revision does not carry it, or this version does not read it\)\n {2}highest carbon activity: not in the results of revision A\n$/);
    const json = await run(['compare', MCFC, 'A', 'B', '--json'], root);
    const changes = JSON.parse(json.out);
    expect(changes.notCompared).toEqual(['highest carbon activity: not in the results of revision A']);
    expect(changes.results.map((c: { key: string }) => c.key)).not.toContain('maxCarbonActivity');
    expect(changes.results.length).toBeGreaterThan(0);
    expect(changes.summary).toContain('not compared: highest carbon activity: not in the results of revision A');
  });

  it('has its register page built, and B\'s page says what could not be compared', async () => {
    const r = await run(['build', '--html-only', '--quiet'], root);
    expect(r.err).toBe('no PDFs were printed: HTML only was asked for\n');
    expect(r.code).toBe(0);
    const site = join(root, 'site', 'projects', MCFC);
    expect(readFileSync(join(site, 'rev-A', 'index.html'), 'utf8')).toContain('superseded by revision B');
    // The issued document exactly as issued.
    expect(readFileSync(join(site, 'rev-A', 'document.html')).equals(readFileSync(join(root, 'projects', MCFC, 'issued', 'A', 'document.html')))).toBe(true);
    expect(readFileSync(join(site, 'rev-B', 'index.html'), 'utf8')).toContain('not compared: highest carbon activity: not in the results of revision A');
  }, 180_000);

  it('refuses, in one message naming the file and the field, a revision whose results lack a field the comparison needs or carry it mistyped', async () => {
    const broken = mkdtempSync(join(tmpdir(), 'cellbasis-issued-format-'));
    try {
      cpSync(join(root, 'projects'), join(broken, 'projects'), { recursive: true });
      alterResults(broken, MCFC, 'B', (res) => delete res.headline);
      const expected = `projects/${MCFC}/issued/B/results.json: field headline: missing; expected an object of the headline numbers; run cellbasis audit ${MCFC} for the full report`;
      const compared = await run(['compare', MCFC, 'A', 'B'], broken);
      expect(compared).toEqual({ code: 1, out: '', err: `cellbasis: ${expected}\n` });
      const built = await run(['build', '--html-only', '--quiet'], broken);
      expect(built.code).toBe(1);
      expect(built.err).toContain(expected);
      expect(built.err).not.toMatch(/internal error|\n\s+at /);

      alterResults(broken, MCFC, 'B', (res) => {
        res.headline = { cells: 'many' };
      });
      const mistyped = await run(['compare', MCFC, 'A', 'B'], broken);
      expect(mistyped).toEqual({
        code: 1,
        out: '',
        err: `cellbasis: projects/${MCFC}/issued/B/results.json: field headline.cells: expected a number or null, found the text "many"; run cellbasis audit ${MCFC} for the full report\n`,
      });
    } finally {
      rmSync(broken, { recursive: true, force: true });
    }
  }, 180_000);
});

describe("a revision of the demo archive whose basis.yaml today's loader does not read", () => {
  // As a revision issued by an earlier version reads after a basis key was renamed: here revision
  // A's "fuel-utilization" spelt as an older version might have ("utilisation"). The revision is
  // still shown as issued, compared on its YAML, and the site warns; nothing is refused.
  let root: string;
  beforeAll(() => {
    root = mkdtempSync(join(tmpdir(), 'cellbasis-issued-format-'));
    cpSync(join(PACKAGE_ROOT, 'projects', MCFC), join(root, 'projects', MCFC), { recursive: true });
    const path = join(root, 'projects', MCFC, 'issued', 'A', 'basis.yaml');
    const text = readFileSync(path, 'utf8');
    const older = text.replace('  fuel-utilization: { value: 0.75', '  utilisation: { value: 0.75');
    if (older === text) throw new Error('the demo archive changed: revision A no longer has its fuel utilization line');
    writeFileSync(path, older);
  });
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it('is compared with revision B field by field, the comparison saying why its inputs are not compared one by one', async () => {
    const r = await run(['compare', MCFC, 'A', 'B', '--json'], root);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const changes = JSON.parse(r.out);
    expect(changes.inputs).toEqual([]);
    expect(changes.notCompared).toHaveLength(1);
    expect(changes.notCompared[0]).toMatch(
      new RegExp(`^design inputs, assumptions and references one by one: the basis of revision A does not load with this version of cellbasis \\(projects/${MCFC}/issued/A/basis\\.yaml:\\d+:\\d+: .+\\); they are compared as fields of its YAML$`),
    );
    const fields = changes.fields.map((f: { text: string }) => f.text);
    expect(fields).toContain('operating-point.utilisation removed (was {"value":0.75,"source":"R3"})');
    expect(fields).toContain('operating-point.fuel-utilization added: {"value":0.72,"source":"R3"}');
    // The results as issued are compared as before.
    expect(changes.results.length).toBeGreaterThan(0);
  });

  it("has its register page built as issued, with a warning naming the file, and B's change summary says what it could not compare", async () => {
    const r = await run(['build', '--html-only', '--quiet'], root);
    expect(r.code).toBe(0);
    expect(r.err).toContain(`warning: projects/${MCFC}/issued/A/basis.yaml: does not load with this version of cellbasis (`);
    const site = join(root, 'site', 'projects', MCFC);
    expect(readFileSync(join(site, 'rev-A', 'document.html')).equals(readFileSync(join(root, 'projects', MCFC, 'issued', 'A', 'document.html')))).toBe(true);
    const register = readFileSync(join(site, 'rev-A', 'index.html'), 'utf8');
    expect(register).toContain('Wenlow Valley Water');
    expect(readFileSync(join(site, 'rev-B', 'index.html'), 'utf8')).toContain('not compared: design inputs, assumptions and references one by one: the basis of revision A does not load');
  }, 180_000);
});

describe('readIssuedResults', () => {
  it('takes the headline numbers, cases and envelope it knows, ignores the rest, and names a needed field that is missing or mistyped', () => {
    const read = readIssuedResults({ format: 'cellbasis-results/9', headline: { cells: 40, netPower_W: null, futureNumber_W: 'x' }, sweeps: 'not read' });
    expect(read).toEqual({ ok: true, results: { headline: { cells: 40, netPower_W: null } } });
    // Every headline number the comparison reports is read when present.
    const all = Object.fromEntries(HEADLINE_QUANTITIES.map((q, i) => [q.key, i]));
    expect(readIssuedResults({ headline: all })).toEqual({ ok: true, results: { headline: all } });
    expect(readIssuedResults([])).toEqual({ ok: false, field: '(the whole file)', problem: 'expected an object of cellbasis results, found a list' });
    expect(readIssuedResults({ headline: {}, cases: [{ id: 'rated' }] })).toEqual({ ok: false, field: 'cases[0].title', problem: 'missing; expected a text' });
    expect(readIssuedResults({ headline: {}, cases: [{ id: 'rated', title: 'Rated', ran: 'yes' }] })).toEqual({ ok: false, field: 'cases[0].ran', problem: 'expected true or false, found the text "yes"' });
    expect(readIssuedResults({ headline: {}, envelope: [{ id: 'x', quantity: 'q', unit: 'W', value: null, case: 'rated' }] })).toEqual({
      ok: false,
      field: 'envelope[0].value',
      problem: 'expected a number, found null',
    });
    expect(readIssuedResults({ headline: {}, cases: [{ id: 'rated', title: 'Rated', headline: null, load: 'new kind' }], envelope: [] })).toEqual({
      ok: true,
      results: { headline: {}, cases: [{ id: 'rated', title: 'Rated', headline: null }], envelope: [] },
    });
  });
});

describe('the audit of a revision whose results.json another version wrote', () => {
  let root: string;
  beforeAll(async () => {
    root = demoRoot([BACKUP]);
    await issueFixture(root, BACKUP, 'A', 'issued for review', '2026-06-02');
    // The file as another version wrote it, attached to the PDF and hashed into the manifest as issue would have.
    const resultsJson = Buffer.from(alterResults(root, BACKUP, 'A', otherVersion));
    const dir = join(root, 'projects', BACKUP, 'issued', 'A');
    const parsed = parseManifest(readFileSync(join(dir, 'manifest.json')));
    if (!parsed.ok) throw new Error(parsed.problems.join('\n'));
    const m = parsed.manifest;
    const basisYaml = readFileSync(join(dir, 'basis.yaml'));
    const loaded = loadBasisText(basisYaml, `${dir}/basis.yaml`, BACKUP);
    if (!loaded.ok) throw new Error(loaded.errors.map((e) => e.message).join('\n'));
    const revision: RevisionContext = { kind: 'issued', revision: m.revision, status: m.status, issuedOn: m.issuedOn, note: m.note, signatures: [], pdfHref: 'document.pdf' };
    const meta = documentPdfMeta({ basis: loaded.basis, results: calculate(loaded.basis), revision }, { date: new Date(m.issuedAt!), basisYaml, resultsJson });
    const pdf = await PDFDocument.load(readFileSync(join(dir, 'document.pdf')));
    await setPdfProperties(pdf, meta, 'none (a test fixture)');
    const pdfBytes = await pdf.save();
    writeFileSync(join(dir, 'document.pdf'), pdfBytes);
    m.files['results.json'] = sha256(resultsJson);
    m.files['document.pdf'] = sha256(pdfBytes);
    writeFileSync(join(dir, 'manifest.json'), manifestBytes(m));
  }, 120_000);
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it('passes on hashes and signatures, and with --recalculate reports the fields as differences', async () => {
    const audit = await run(['audit', BACKUP], root);
    expect(audit).toEqual({ code: 0, out: `PASS projects/${BACKUP} rev A, not signed\n`, err: 'audit: 1 revision checked, 0 failed\n' });
    const recalculated = await run(['audit', BACKUP, '--recalculate'], root);
    expect(recalculated.code).toBe(1);
    expect(recalculated.out).toContain('results.json differs from a recalculation of the issued basis in 2 fields');
    expect(recalculated.out).toMatch(/headline\.maxCarbonActivity: not in the issued results, recomputed /);
    expect(recalculated.out).toContain('stackTemperatureProfile_K: issued [923.15,938.15,951.15], not in the recomputed results');
    expect(recalculated.out).not.toMatch(/schema|internal error/);
  }, 120_000);
});
