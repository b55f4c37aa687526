/**
 * Ed25519 signatures of manifests (RFC 8032, node:crypto): the signature covers the exact bytes
 * of manifest.json and is stored base64 in manifest.sig; the signer's public key (SPKI PEM) is
 * recorded in the manifest so an audit can verify without being handed a key, and can also be
 * told which key it must be. Key files: PKCS#8 PEM private keys, SPKI PEM public keys, as
 * `cellbasis keygen` writes them.
 */
import { createHash, createPrivateKey, createPublicKey, generateKeyPairSync, sign, verify, type KeyObject } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { UserError } from '../core/errors.ts';

function readKeyFile(path: string, display: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new UserError(`${display}: ${code === 'ENOENT' ? 'no such file' : `cannot read (${code ?? (error as Error).message})`}`);
  }
}

function requireEd25519(key: KeyObject, display: string, kind: string): KeyObject {
  if (key.asymmetricKeyType !== 'ed25519') {
    throw new UserError(`${display}: a ${key.asymmetricKeyType ?? 'non-asymmetric'} ${kind}; cellbasis signs with Ed25519 keys (make one with cellbasis keygen NAME)`);
  }
  return key;
}

const KEY_KINDS = {
  private: { create: createPrivateKey, header: 'PRIVATE KEY' },
  public: { create: createPublicKey, header: 'PUBLIC KEY' },
} as const;

/** The Ed25519 key of a PEM file; a private key file also serves as a public key (its public half). */
function readKey(path: string, display: string, kind: keyof typeof KEY_KINDS): KeyObject {
  const pem = readKeyFile(path, display);
  let key: KeyObject;
  try {
    key = KEY_KINDS[kind].create(pem);
  } catch {
    throw new UserError(`${display}: not a ${kind} key in PEM form (expected "-----BEGIN ${KEY_KINDS[kind].header}-----", as cellbasis keygen writes)`);
  }
  return requireEd25519(key, display, `${kind} key`);
}

export function readPrivateKey(path: string, display = path): KeyObject {
  return readKey(path, display, 'private');
}

export function readPublicKey(path: string, display = path): KeyObject {
  return readKey(path, display, 'public');
}

/** The public key of a PEM text or key object (the public half of a private key). */
function asPublic(key: string | KeyObject): KeyObject {
  return typeof key !== 'string' && key.type === 'public' ? key : createPublicKey(key);
}

/** SPKI PEM of the public half of a key. */
export function publicKeyPem(key: KeyObject): string {
  return asPublic(key).export({ type: 'spki', format: 'pem' }).toString();
}

/** The base64 signature of bytes, with a trailing newline, as manifest.sig holds it. */
export function signBytes(bytes: Uint8Array, privateKey: KeyObject): string {
  return `${sign(null, bytes, privateKey).toString('base64')}\n`;
}

/**
 * Whether the text of manifest.sig is a valid signature of bytes by the key of the PEM. The text
 * must be exactly what signBytes writes (canonical base64 and one newline), so no byte of the
 * file can change without the check failing.
 */
export function verifyBytes(bytes: Uint8Array, signatureText: string, publicPem: string): boolean {
  const text = signatureText.endsWith('\n') ? signatureText.slice(0, -1) : signatureText;
  if (!/^[A-Za-z0-9+/]+={0,2}$/.test(text)) return false;
  const signature = Buffer.from(text, 'base64');
  if (signature.toString('base64') !== text) return false;
  let key: KeyObject;
  try {
    key = createPublicKey(publicPem);
  } catch {
    return false;
  }
  if (key.asymmetricKeyType !== 'ed25519') return false;
  return verify(null, bytes, key, signature);
}

/** Whether two PEM public keys are the same key (compared as DER, so line breaks do not matter). */
export function sameKey(a: string | KeyObject, b: string | KeyObject): boolean {
  try {
    const der = (k: string | KeyObject) => asPublic(k).export({ type: 'spki', format: 'der' });
    return der(a).equals(der(b));
  } catch {
    return false;
  }
}

/** A new Ed25519 key pair as PEM texts: PKCS#8 private, SPKI public. */
export function newKeyPair(): { privatePem: string; publicPem: string } {
  const { privateKey, publicKey } = generateKeyPairSync('ed25519');
  return {
    privatePem: privateKey.export({ type: 'pkcs8', format: 'pem' }).toString(),
    publicPem: publicKey.export({ type: 'spki', format: 'pem' }).toString(),
  };
}

/** A short name of a public key: the first 16 hex digits of the SHA-256 of its SPKI DER. */
export function keyFingerprint(key: string | KeyObject): string {
  return createHash('sha256').update(asPublic(key).export({ type: 'spki', format: 'der' })).digest('hex').slice(0, 16);
}
