// Manifest bytes of both formats, issue dates and Ed25519 signatures, and the key files: a private
// key is refused where a public key is expected and the other way round, each read only when it
// is a regular file.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { execFileSync } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { manifestBytes, parseManifest } from '../../lib/archive/manifest.ts';
import { resolveIssueDate } from '../../lib/archive/issue-date.ts';
import { keyFingerprint, newKeyPair, readPrivateKey, readPublicKey, sameKey, signBytes, verifyBytes } from '../../lib/archive/signature.ts';
import { createHash, createPrivateKey, createPublicKey } from 'node:crypto';
import type { IssueManifest } from '../../lib/archive/layout.ts';

const hash = (c: string) => c.repeat(64);

const manifest: IssueManifest = {
  format: 'cellbasis-issue/2',
  project: 'demo',
  documentNumber: 'DB-demo-001',
  title: 'T',
  revision: 'A',
  status: 'issued for review',
  note: '',
  issuedOn: '2026-11-30',
  issuedAt: '2026-11-30T00:00:00.000Z',
  tool: { name: 'cellbasis', version: '0.1.0' },
  speciesData_sha256: hash('a'),
  files: { 'document.pdf': hash('d'), 'basis.yaml': hash('b'), 'results.json': hash('c'), 'document.html': hash('e') },
  previous: null,
  signOff: [{ role: 'prepared', name: 'A. Engineer', date: '2026-11-30' }],
  signatures: [{ role: 'prepared', key: 'a-engineer', fingerprint: hash('f'), publicKey: '-----BEGIN PUBLIC KEY-----\n' }],
};

/** A manifest exactly as cellbasis wrote it before revisions were issued into issued/ (format 1). */
const FORMER = `{
  "format": "cellbasis-seal/1",
  "project": "demo",
  "documentNumber": "DB-demo-001",
  "title": "T",
  "revision": "B",
  "status": "issued for approval",
  "note": "colder stack",
  "sealedOn": "2026-12-01",
  "sealedAt": "2026-12-01T00:00:00.000Z",
  "tool": {
    "name": "cellbasis",
    "version": "0.1.0"
  },
  "speciesData_sha256": "${hash('a')}",
  "files": {
    "basis.yaml": "${hash('b')}",
    "results.json": "${hash('c')}",
    "document.html": "${hash('e')}",
    "document.pdf": "${hash('d')}"
  },
  "previous": {
    "revision": "A",
    "manifest_sha256": "${hash('0')}"
  },
  "signOff": [
    {
      "role": "prepared",
      "name": "A. Engineer",
      "date": "2026-11-30"
    }
  ],
  "publicKey": "-----BEGIN PUBLIC KEY-----\\nMCowBQYDK2VwAyEA\\n-----END PUBLIC KEY-----\\n",
  "pdf": {
    "chromium": "156.0.8078.114"
  }
}
`;

describe('manifest', () => {
  it('writes a fixed key order, two-space JSON and a trailing newline, and reads it back', () => {
    const bytes = manifestBytes(manifest);
    const text = bytes.toString();
    expect(text.endsWith('}\n')).toBe(true);
    expect(Object.keys(JSON.parse(text))).toEqual(['format', 'project', 'documentNumber', 'title', 'revision', 'status', 'note', 'issuedOn', 'issuedAt', 'tool', 'speciesData_sha256', 'files', 'previous', 'signOff', 'signatures']);
    expect(Object.keys(JSON.parse(text).files)).toEqual(['basis.yaml', 'results.json', 'document.html', 'document.pdf']);
    expect(manifestBytes({ ...manifest, files: { ...manifest.files } }).equals(bytes)).toBe(true);
    const parsed = parseManifest(bytes);
    expect(parsed.ok && parsed.manifest).toEqual(manifest);
  });

  it('reads a manifest of format 1 and writes it back byte for byte, so that revisions issued before stay auditable', () => {
    const parsed = parseManifest(Buffer.from(FORMER));
    if (!parsed.ok) throw new Error(parsed.problems.join('\n'));
    expect(parsed.manifest).toMatchObject({ format: 'cellbasis-seal/1', revision: 'B', issuedOn: '2026-12-01', issuedAt: '2026-12-01T00:00:00.000Z', signatures: [], formerPublicKey: expect.stringMatching(/^-----BEGIN PUBLIC KEY-----/) });
    expect(manifestBytes(parsed.manifest).toString()).toBe(FORMER);
  });

  it('names what is wrong with a damaged manifest', () => {
    expect(parseManifest(Buffer.from('{'))).toMatchObject({ ok: false, problems: [expect.stringMatching(/not JSON/)] });
    const broken = { ...manifest, files: { 'basis.yaml': 'xyz' }, status: 'draftish' };
    const parsed = parseManifest(Buffer.from(JSON.stringify(broken)));
    expect(parsed.ok).toBe(false);
    expect(!parsed.ok && parsed.problems.join('\n')).toMatch(/status[\s\S]*files\.basis\.yaml/);
    const unsigned = parseManifest(Buffer.from(JSON.stringify({ ...manifest, signatures: [{ role: 'witness', key: 'k', fingerprint: 'x', publicKey: '' }] })));
    expect(!unsigned.ok && unsigned.problems.join('\n')).toMatch(/signatures\.0\.role[\s\S]*signatures\.0\.fingerprint/);
  });
});

describe('issue date', () => {
  const now = () => new Date('2026-12-02T15:47:11Z');
  it('takes --date, else SOURCE_DATE_EPOCH, else today at 00:00 UTC', () => {
    expect(resolveIssueDate('2026-11-30', { SOURCE_DATE_EPOCH: '1' }, now)).toEqual({ day: '2026-11-30', at: new Date('2026-11-30T00:00:00Z'), from: '--date' });
    expect(resolveIssueDate(undefined, { SOURCE_DATE_EPOCH: '1790000000' }, now)).toEqual({ day: '2026-09-21', at: new Date(1790000000 * 1000), from: 'SOURCE_DATE_EPOCH' });
    expect(resolveIssueDate(undefined, {}, now)).toEqual({ day: '2026-12-02', at: new Date('2026-12-02T00:00:00Z'), from: 'today' });
  });
  it('refuses dates that are not calendar days', () => {
    for (const bad of ['2026-02-30', '2026-1-5', 'yesterday', '2026-13-01']) expect(() => resolveIssueDate(bad, {}, now)).toThrow(/YYYY-MM-DD/);
    expect(() => resolveIssueDate(undefined, { SOURCE_DATE_EPOCH: '-5' }, now)).toThrow(/SOURCE_DATE_EPOCH/);
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

  it('fingerprints a key by the SHA-256 of its SPKI DER, as openssl pkey -pubout -outform DER | sha256sum gives it', () => {
    const { publicPem } = newKeyPair();
    // The DER of an Ed25519 SPKI is the 12-byte algorithm prefix (RFC 8410) and the 32-byte key.
    const der = createPublicKey(publicPem).export({ type: 'spki', format: 'der' });
    expect(der.length).toBe(44);
    expect(der.subarray(0, 12).toString('hex')).toBe('302a300506032b6570032100');
    expect(keyFingerprint(publicPem)).toBe(createHash('sha256').update(der).digest('hex'));
    let openssl: string | null = null;
    try {
      openssl = execFileSync('openssl', ['pkey', '-pubin', '-outform', 'DER'], { input: publicPem }).toString('hex');
    } catch {
      // No openssl on this machine: the RFC 8410 layout above stands.
    }
    if (openssl) expect(openssl).toBe(der.toString('hex'));
  });
});

describe('key files', () => {
  const dir = mkdtempSync(join(tmpdir(), 'cellbasis-keys-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const pair = newKeyPair();
  writeFileSync(join(dir, 'k.key'), pair.privatePem, { mode: 0o600 });
  writeFileSync(join(dir, 'k.pub'), pair.publicPem);

  it('refuses a private key where a public key is expected, and a public key where a private one is', () => {
    expect(() => readPublicKey(join(dir, 'k.key'), 'k.key')).toThrow(/^k\.key: this is a private key, where a public key is expected: give the public key \(NAME\.pub\)/);
    expect(() => readPrivateKey(join(dir, 'k.pub'), 'k.pub')).toThrow(/^k\.pub: this is a public key; signing needs the private key/);
    expect(sameKey(readPublicKey(join(dir, 'k.pub')), pair.publicPem)).toBe(true);
    expect(sameKey(readPrivateKey(join(dir, 'k.key')), pair.publicPem)).toBe(true);
  });

  it('reads a key only from a regular file of a key\'s size: a device or a folder is refused before it is read', () => {
    expect(() => readPublicKey('/dev/zero', '/dev/zero')).toThrow(/^\/dev\/zero: the public key must be a regular file; this is a character device/);
    expect(() => readPrivateKey(dir, 'keys')).toThrow(/^keys: cannot read the private key: it is a folder|^keys: the private key must be a regular file; this is a folder/);
    writeFileSync(join(dir, 'big.pub'), Buffer.alloc(20 * 1024, 65));
    expect(() => readPublicKey(join(dir, 'big.pub'), 'big.pub')).toThrow(/^big\.pub: the public key is 20 KiB, more than the 16 KiB accepted/);
  });
});
