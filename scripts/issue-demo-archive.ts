// Issues the demo archive committed under projects/: revisions a newcomer sees at once in the
// site (history, changes between revisions, the sign-off and signatures) and that CI audits
// (test/archive/demo-archive.test.ts):
//
//   corrin-beck-mcfc-biogas   A issued for review (an earlier basis: fuel utilization 0.75, the
//                             cathode-gas recycle assumption still open, no operating cases
//                             yet), then B issued for
//                             approval (the working basis as committed), signed for the preparer
//                             and, on B, the checker
//   hob-tor-pem-backup        0 approved, with the full sign-off and its open assumptions
//                             accepted with their reasons, signed for the checker and approver
//
// Every revision is issued by `cellbasis issue` itself, in a temporary working folder, from the
// committed basis (revision A from the edits below of it), on fixed dates, and signed with the
// demo key; the issued folders are then put in place of the projects' issued/ folders and
// audited with the demo public key, keys/cellbasis-demo.pub. The private key is never in the
// repository: give its path.
//
//   npx tsx scripts/issue-demo-archive.ts --key ~/.config/cellbasis/keys/cellbasis-demo.key [--replace]
//
// --replace replaces issued revisions that are there already (the archive is otherwise never
// rewritten). Needs Chromium, as every issue does. The first run with a new key writes
// keys/cellbasis-demo.pub; later runs refuse a key whose public half differs from it.
import { spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, renameSync, rmSync, statSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { publicKeyPem, readPrivateKey } from '../lib/archive/signature.ts';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const BIN = join(root, 'bin', 'cellbasis.js');
const DEMO_PUBLIC_KEY = join('keys', 'cellbasis-demo.pub');

/** The issued archive must stay small enough to commit (issue 20: under 10 MB). */
const MAX_ARCHIVE_BYTES = 10 * 1024 * 1024;

interface Step {
  /** The basis issued, from the committed one. */
  basis: (committed: string) => string;
  args: string[];
}

/** `text` with each [from, to] replaced once; throws when one does not apply (the committed basis changed). */
function edited(text: string, project: string, edits: [string, string][]): string {
  let out = text;
  for (const [from, to] of edits) {
    if (!out.includes(from)) throw new Error(`projects/${project}/basis.yaml no longer holds ${JSON.stringify(from)}: update scripts/issue-demo-archive.ts`);
    out = out.replace(from, to);
  }
  return out;
}

/** `text` without its top-level cases: section. */
function withoutCases(text: string, project: string): string {
  const start = text.indexOf('\ncases:\n');
  const end = text.indexOf('\nassumptions:\n');
  if (start < 0 || end < start) throw new Error(`projects/${project}/basis.yaml no longer has cases: before assumptions: update scripts/issue-demo-archive.ts`);
  return text.slice(0, start + 1) + text.slice(end + 1);
}

function plan(key: string): Record<string, Step[]> {
  const cb = 'corrin-beck-mcfc-biogas';
  return {
    [cb]: [
      {
        // Revision A predates the operating cases (B adds them), which also keeps the archive small.
        basis: (text) =>
          edited(withoutCases(text, cb), cb, [
            ['    prepared: { name: T. Abernethy-Cole, date: 2026-07-30 }\n', '    prepared: { name: T. Abernethy-Cole, date: 2026-07-08 }\n'],
            ['    checked: { name: P. Nakamura, date: 2026-08-06 }\n', ''],
            ['fuel-utilization: { value: 0.72, source: R3 }', 'fuel-utilization: { value: 0.75, source: R3 }'],
            ['the CO2 of the anode off-gas is returned in full.", open: false, reference: R2 }', 'the CO2 of the anode off-gas is returned in full.", open: true, reference: R2 }'],
          ]),
        args: ['--rev', 'A', '--status', 'issued for review', '--date', '2026-07-10', '--note', 'for the process design review', '--key', `prepared=${key}`],
      },
      {
        basis: (text) => text,
        args: ['--rev', 'B', '--status', 'issued for approval', '--date', '2026-08-07', '--note', 'fuel utilization to the stack maker\'s 0.72; cathode-gas recycle confirmed', '--key', `prepared=${key}`, '--key', `checked=${key}`],
      },
    ],
    'hob-tor-pem-backup': [
      {
        basis: (text) => text,
        args: ['--rev', '0', '--status', 'approved', '--date', '2026-05-27', '--note', 'approved for purchase of the stack', '--key', `checked=${key}`, '--key', `approved=${key}`],
      },
    ],
  };
}

function folderBytes(dir: string): number {
  let total = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true, recursive: true })) {
    if (entry.isFile()) total += statSync(join(entry.parentPath, entry.name)).size;
  }
  return total;
}

function cellbasis(args: string[], cwd: string): void {
  const result = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: 'utf8', env: { ...process.env, SOURCE_DATE_EPOCH: '' } });
  process.stderr.write(result.stderr);
  process.stdout.write(result.stdout);
  if (result.status !== 0) throw new Error(`cellbasis ${args.join(' ')} exited ${result.status}`);
}

function main(): void {
  const { values } = parseArgs({ options: { key: { type: 'string' }, replace: { type: 'boolean' } } });
  if (!values.key) throw new Error('give the demo private key: --key PATH (cellbasis keygen cellbasis-demo writes one in your key folder)');
  const keyPath = resolve(values.key);
  const publicPem = publicKeyPem(readPrivateKey(keyPath));
  const committedPublic = join(root, DEMO_PUBLIC_KEY);
  if (!existsSync(committedPublic)) {
    mkdirSync(dirname(committedPublic), { recursive: true });
    writeFileSync(committedPublic, publicPem);
    console.log(`wrote ${DEMO_PUBLIC_KEY}, the public half of ${values.key}`);
  } else if (readFileSync(committedPublic, 'latin1') !== publicPem) {
    throw new Error(`${values.key} is not the demo key: its public key differs from ${DEMO_PUBLIC_KEY}`);
  }
  const steps = plan(keyPath);
  for (const project of Object.keys(steps)) {
    if (existsSync(join(root, 'projects', project, 'issued')) && !values.replace) throw new Error(`projects/${project}/issued exists; give --replace to issue the demo archive again`);
  }
  let total = 0;
  for (const [project, projectSteps] of Object.entries(steps)) {
    const committed = readFileSync(join(root, 'projects', project, 'basis.yaml'), 'utf8');
    const work = mkdtempSync(join(tmpdir(), 'cellbasis-demo-archive-'));
    try {
      mkdirSync(join(work, 'projects', project), { recursive: true });
      for (const step of projectSteps) {
        writeFileSync(join(work, 'projects', project, 'basis.yaml'), step.basis(committed));
        cellbasis(['issue', project, ...step.args], work);
      }
      const issued = join(root, 'projects', project, 'issued');
      const incoming = join(root, 'projects', project, '.issued-demo-incoming');
      rmSync(incoming, { recursive: true, force: true });
      cpSync(join(work, 'projects', project, 'issued'), incoming, { recursive: true });
      rmSync(issued, { recursive: true, force: true });
      renameSync(incoming, issued);
      total += folderBytes(issued);
    } finally {
      rmSync(work, { recursive: true, force: true });
    }
  }
  cellbasis(['audit', '--key', DEMO_PUBLIC_KEY], root);
  console.log(`demo archive: ${(total / 1024 / 1024).toFixed(2)} MB`);
  if (total > MAX_ARCHIVE_BYTES) throw new Error(`the demo archive is ${total} bytes, over the ${MAX_ARCHIVE_BYTES} allowed`);
}

try {
  main();
} catch (error) {
  console.error(`issue-demo-archive: ${(error as Error).message}`);
  process.exitCode = 1;
}
