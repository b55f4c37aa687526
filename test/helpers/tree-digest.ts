/** A record of a folder tree, to show that a command changed nothing in it: every file with its SHA-256, and every folder. */
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';

export function sha256(bytes: Uint8Array | string): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** Every file under `root` with its SHA-256, and every folder ("dir"); {} where `root` does not exist. */
export function treeDigest(root: string): Record<string, string> {
  const out: Record<string, string> = {};
  if (!existsSync(root)) return out;
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const path = join(dir, entry.name);
      if (entry.isDirectory()) {
        out[`${relative(root, path)}/`] = 'dir';
        walk(path);
      } else out[relative(root, path)] = sha256(readFileSync(path));
    }
  };
  walk(root);
  return out;
}
