// Manifest bytes, seal dates and Ed25519 signatures.
import { describe, expect, it } from 'vitest';
import { manifestBytes, parseManifest } from '../../lib/archive/manifest.ts';
import { resolveSealDate } from '../../lib/archive/seal-date.ts';
import { newKeyPair, sameKey, signBytes, verifyBytes } from '../../lib/archive/signature.ts';
import { createPrivateKey } from 'node:crypto';
import type { SealManifest } from '../../lib/archive/layout.ts';

const hash = (c: string) => c.repeat(64);

const manifest: SealManifest = {
  format: 'cellbasis-seal/1',
  project: 'demo',
  documentNumber: 'DB-demo-001',
  title: 'T',
  revision: 'A',
  status: 'issued for review',
  note: '',
  sealedOn: '2026-11-30',
  sealedAt: '2026-11-30T00:00:00.000Z',
  tool: { name: 'cellbasis', version: '0.1.0' },
  speciesData_sha256: hash('a'),
  files: { 'document.pdf': hash('d'), 'basis.yaml': hash('b'), 'results.json': hash('c'), 'document.html': hash('e') },
  previous: null,
  signOff: [{ role: 'prepared', name: 'A. Engineer', date: '2026-11-30' }],
};

describe('manifest', () => {
  it('writes a fixed key order, two-space JSON and a trailing newline, and reads it back', () => {
    const bytes = manifestBytes(manifest);
    const text = bytes.toString();
    expect(text.endsWith('}\n')).toBe(true);
    expect(Object.keys(JSON.parse(text).files)).toEqual(['basis.yaml', 'results.json', 'document.html', 'document.pdf']);
    expect(manifestBytes({ ...manifest, files: { ...manifest.files } }).equals(bytes)).toBe(true);
    const parsed = parseManifest(bytes);
    expect(parsed.ok && parsed.manifest).toEqual(manifest);
  });

  it('names what is wrong with a damaged manifest', () => {
    expect(parseManifest(Buffer.from('{'))).toMatchObject({ ok: false, problems: [expect.stringMatching(/not JSON/)] });
    const broken = { ...manifest, files: { 'basis.yaml': 'xyz' }, status: 'draftish' };
    const parsed = parseManifest(Buffer.from(JSON.stringify(broken)));
    expect(parsed.ok).toBe(false);
    expect(!parsed.ok && parsed.problems.join('\n')).toMatch(/status[\s\S]*files\.basis\.yaml/);
  });
});

describe('seal date', () => {
  const now = () => new Date('2026-12-02T15:47:11Z');
  it('takes --date, else SOURCE_DATE_EPOCH, else today at 00:00 UTC', () => {
    expect(resolveSealDate('2026-11-30', { SOURCE_DATE_EPOCH: '1' }, now)).toEqual({ day: '2026-11-30', at: new Date('2026-11-30T00:00:00Z'), from: '--date' });
    expect(resolveSealDate(undefined, { SOURCE_DATE_EPOCH: '1790000000' }, now)).toEqual({ day: '2026-09-21', at: new Date(1790000000 * 1000), from: 'SOURCE_DATE_EPOCH' });
    expect(resolveSealDate(undefined, {}, now)).toEqual({ day: '2026-12-02', at: new Date('2026-12-02T00:00:00Z'), from: 'today' });
  });
  it('refuses dates that are not calendar days', () => {
    for (const bad of ['2026-02-30', '2026-1-5', 'yesterday', '2026-13-01']) expect(() => resolveSealDate(bad, {}, now)).toThrow(/YYYY-MM-DD/);
    expect(() => resolveSealDate(undefined, { SOURCE_DATE_EPOCH: '-5' }, now)).toThrow(/SOURCE_DATE_EPOCH/);
  });
});

describe('signatures', () => {
  it('verifies a signature with the signing key only, and not after a byte changes', () => {
    const mine = newKeyPair();
    const other = newKeyPair();
    const bytes = manifestBytes(manifest);
    const signature = signBytes(bytes, createPrivateKey(mine.privatePem));
    expect(verifyBytes(bytes, signature, mine.publicPem)).toBe(true);
    expect(verifyBytes(bytes, signature, other.publicPem)).toBe(false);
    const changed = Buffer.from(bytes);
    changed[10] = changed[10]! ^ 1;
    expect(verifyBytes(changed, signature, mine.publicPem)).toBe(false);
    expect(verifyBytes(bytes, 'not base64!', mine.publicPem)).toBe(false);
    expect(sameKey(mine.publicPem, mine.publicPem.replace(/\n/g, '\r\n'))).toBe(true);
    expect(sameKey(mine.publicPem, other.publicPem)).toBe(false);
  });
});
