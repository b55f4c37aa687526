// Every test file makes its temporary folders inside one folder of its own, removed when the file
// has run: the tests make thousands (one for each basis a limit or corpus test checks) and most
// did not remove theirs, so each run of the suite left some ten thousand folders in the system's
// temporary folder. os.tmpdir() reads TMPDIR at every call, and the commands the tests start
// inherit it, so their folders go there too.
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll } from 'vitest';

// A worker runs several files one after the other: each file's folder is made in the system's one.
const system = process.env.CELLBASIS_SYSTEM_TMPDIR ?? tmpdir();
process.env.CELLBASIS_SYSTEM_TMPDIR = system;
const own = mkdtempSync(join(system, 'cellbasis-test-'));
// Open to everyone with the sticky bit, as the system's temporary folder is: the tests that run
// commands as another user (issued-untouched.test.ts, as nobody) must reach the folders they make
// in it, and those commands (tsx's cache among them) write temporary files of their own there.
chmodSync(own, 0o1777);
process.env.TMPDIR = own;

afterAll(() => {
  process.env.TMPDIR = system;
  rmSync(own, { recursive: true, force: true });
});
