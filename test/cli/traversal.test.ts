// Project ids and revision names that try to leave projects/ are refused (exit 2, one line, no
// stack trace, nothing read or written outside) by every command that takes them. Adding a
// command that takes an id or a revision is one line in ID_COMMANDS or REVISION_COMMANDS; a
// test below fails while a registered command taking an ID is missing from the table.
import { existsSync, mkdirSync, mkdtempSync, readdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { COMMANDS } from '../../lib/cli/main.ts';
import { scaffoldText } from '../helpers/scaffold-basis.ts';
import { run } from '../helpers/run-cli.ts';

/** How each command is given a project id. */
const ID_COMMANDS: Record<string, (id: string) => string[]> = {
  check: (id) => ['check', id],
  calc: (id) => ['calc', id],
  hazards: (id) => ['hazards', id],
  new: (id) => ['new', id, '--technology', 'pem'],
  issue: (id) => ['issue', id, '--rev', 'A', '--status', 'issued for review'],
  audit: (id) => ['audit', id],
  compare: (id) => ['compare', id, 'A', 'draft'],
};

/** How each command is given a revision name (of the valid project "good"). */
const REVISION_COMMANDS: Record<string, (revision: string) => string[]> = {
  issue: (revision) => ['issue', 'good', '--rev', revision, '--status', 'issued for review'],
  compare: (revision) => ['compare', 'good', revision, 'draft'],
};

const registered = (name: string) => COMMANDS.some((c) => c.name === name);

/** A working folder with one valid project, a folder outside projects/ and links out of projects/. */
function workspace(): { root: string; outside: string } {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-traversal-'));
  const outside = mkdtempSync(join(tmpdir(), 'cellbasis-outside-'));
  writeFileSync(join(outside, 'basis.yaml'), scaffoldText('pem', 'power', 'outside'));
  mkdirSync(join(root, 'projects', 'good'), { recursive: true });
  writeFileSync(join(root, 'projects', 'good', 'basis.yaml'), scaffoldText('pem', 'power', 'good'));
  symlinkSync(outside, join(root, 'projects', 'link-out'));
  symlinkSync('/etc', join(root, 'projects', 'etc-link'));
  mkdirSync(join(root, 'projects', 'passwd-link'));
  symlinkSync('/etc/passwd', join(root, 'projects', 'passwd-link', 'basis.yaml'));
  symlinkSync(join(outside, 'not-yet'), join(root, 'projects', 'dangling'));
  return { root, outside };
}

/** Ids that name something outside projects/ or are no plain name, with the refusal each gets. */
const HOSTILE_IDS: [id: string, refusal: RegExp][] = [
  ['..', /project id "\.\." may not contain "\.\."/],
  ['../good', /names neither a project|project id "\.\.\/good" may not contain "\.\."/],
  ['../../../../etc/passwd', /names neither a project|may not contain "\.\."/],
  ['/etc/passwd', /names neither a project|must be 1 to 64 characters/],
  ['/etc', /names neither a project|must be 1 to 64 characters/],
  ['a/../../b', /names neither a project|may not contain "\.\."/],
  ['..%2F..%2Fetc%2Fpasswd', /may not contain "\.\."/],
  ['%2e%2e%2fetc', /must be 1 to 64 characters/],
  ['..\\..\\etc', /may not contain "\.\."/],
  ['.', /must be 1 to 64 characters/],
  ['', /an argument is empty/],
  ['good\u0000', /must be 1 to 64 characters/],
  ['Good', /must be 1 to 64 characters/],
  ['x'.repeat(65), /must be 1 to 64 characters/],
  ['link-out', /^cellbasis: (check: )?projects\/link-out leads outside projects\/ \(to .*\); a project must lie inside projects\/$/],
  ['etc-link', /^cellbasis: (check: )?projects\/etc-link leads outside projects\/ \(to \/etc\); a project must lie inside projects\/$/],
  ['passwd-link', /^cellbasis: (check: )?projects\/passwd-link leads outside projects\/ \(to \/etc\/passwd\); a project must lie inside projects\/$/],
  ['dangling', /^cellbasis: (check: )?projects\/dangling is a symbolic link to .*not-yet, which does not exist; a project must lie inside projects\/$/],
];

/** Revision names that are paths, with the refusal of a revision name. */
const HOSTILE_REVISIONS = ['../../../etc', '/etc/passwd', '..', 'A/../../x', '..%2F..%2Fx', 'A\u0000'];

describe('path traversal', () => {
  it('every registered command that takes a project id is in the table (adding one is one line there)', () => {
    const taking = COMMANDS.filter((c) => /\bID\b/.test(c.usage)).map((c) => c.name);
    expect(taking.length).toBeGreaterThanOrEqual(4);
    for (const name of taking) expect(Object.keys(ID_COMMANDS), name).toContain(name);
  });

  describe.each(Object.keys(ID_COMMANDS).filter(registered).map((c) => [c]))('%s', (command) => {
    it.each(HOSTILE_IDS.map(([id, refusal]) => [JSON.stringify(id), id, refusal] as const))('refuses the id %s with exit 2 and touches nothing outside', async (_shown, id, refusal) => {
      const { root, outside } = workspace();
      const before = readdirSync(outside);
      const r = await run(ID_COMMANDS[command]!(id), root);
      expect(r.err.trimEnd()).toMatch(refusal);
      expect(r.err.split('\n').filter(Boolean), 'one line').toHaveLength(1);
      expect(r.err).not.toMatch(/\n\s+at |internal error/);
      expect(r.out + r.err, 'nothing of /etc/passwd').not.toMatch(/root:x?:0:/);
      expect(r.code).toBe(2);
      expect(readdirSync(outside), 'the folder outside projects/ unchanged').toEqual(before);
      expect(existsSync(join(outside, 'not-yet')), 'nothing created through the dangling link').toBe(false);
      expect(readdirSync(join(root, 'projects')).sort(), 'no project folder created').toEqual(['dangling', 'etc-link', 'good', 'link-out', 'passwd-link']);
    });
  });

  describe.each(Object.keys(REVISION_COMMANDS).filter(registered).map((c) => [c]))('%s', (command) => {
    it.each(HOSTILE_REVISIONS.map((rev) => [JSON.stringify(rev), rev] as const))('refuses the revision %s with exit 2', async (_shown, revision) => {
      const { root } = workspace();
      const r = await run(REVISION_COMMANDS[command]!(revision), root);
      expect(r.err).toMatch(/^cellbasis: .*revision/);
      expect(r.err).not.toMatch(/\n\s+at |internal error/);
      expect(r.code).toBe(2);
      expect(existsSync(join(root, 'projects', 'good', 'issued')), 'nothing issued').toBe(false);
    });
  });

  it('check without arguments names every link of projects/ as no project (exit 1) and still checks the good one', async () => {
    const { root } = workspace();
    const r = await run(['check'], root);
    // Each link is named, also those leading to a folder without basis.yaml (/etc) or to nothing (test/cli/bad-projects.test.ts, class projects).
    expect(r.err.split('\n').filter(Boolean).sort()).toEqual([
      expect.stringMatching(/^projects\/dangling is a symbolic link to .*cellbasis-outside-.*\/not-yet, which does not exist; a project must lie inside projects\/$/),
      'projects/etc-link leads outside projects/ (to /etc); a project must lie inside projects/',
      expect.stringMatching(/^projects\/link-out leads outside projects\/ \(to .*cellbasis-outside-.*\); a project must lie inside projects\/$/),
      'projects/passwd-link leads outside projects/ (to /etc/passwd); a project must lie inside projects/',
    ]);
    expect(r.out).toMatch(/^projects\/good\/basis\.yaml: valid/);
    expect(r.out + r.err).not.toMatch(/root:x?:0:/);
    expect(r.code).toBe(1);
  });

  it('a basis named by its path inside projects/ is held to projects/ too; one named elsewhere is read as given', async () => {
    const { root, outside } = workspace();
    const inside = await run(['check', 'projects/passwd-link/basis.yaml'], root);
    expect(inside).toMatchObject({ code: 2, out: '', err: 'cellbasis: check: projects/passwd-link leads outside projects/ (to /etc/passwd); a project must lie inside projects/\n' });
    const named = await run(['check', join(outside, 'basis.yaml')], root);
    expect(named.code).toBe(0);
    expect(named.out).toMatch(/basis\.yaml: valid/);
  });
});
