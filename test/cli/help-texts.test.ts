// Every help text says what the command does (issue 21 item 3): `build --help` named
// projects/<id>/document.pdf for the drafts' PDFs, which go to site/projects/<id>/document.pdf.
// Each statement of a help text that a user acts on (a path, a default, an exit code, what is
// kept) is listed here with a run of the command that shows it true, and every path any help
// text names must be one of them: a new path in a help text fails here until a check says it is
// right. The archive commands (issue, audit, compare, keygen) are checked with the archive.
import { existsSync, lstatSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { COMMANDS } from '../../lib/cli/main.ts';
import { helpText } from '../../lib/cli/command.ts';
import { TECHNOLOGY_NAMES } from '../../lib/electrochem/technologies.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';
import { run } from '../helpers/run-cli.ts';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';
import { describeWithChromium } from '../helpers/chromium.ts';

const ARCHIVE = new Set(['issue', 'audit', 'compare', 'keygen']);
const help = (name: string) => helpText(COMMANDS.find((c) => c.name === name)!);

/** The paths each help text names, each checked below (a test per path, by its name). */
const PATHS: Record<string, string[]> = {
  new: ['projects/ID/basis.yaml'],
  check: ['projects/*/basis.yaml', 'projects/'],
  schema: ['schema/design-basis.schema.json', '../../schema/design-basis.schema.json'],
  calc: ['schema/results.schema.json'],
  build: ['projects/<id>/basis.yaml', 'site/', 'site/projects/<id>/document.pdf', 'DIR/projects/<id>/document.pdf', '.cellbasis-cache/'],
  serve: ['site/', 'projects/'],
};

/** Path-like words of a text: with a "/" inside, no spaces, not a fraction or a unit (1/2, J/mol). */
function pathsIn(text: string): string[] {
  // A full stop or comma after a path ends the sentence, not the path.
  const words = (text.match(/[\w.*<>-]*(?:\/[\w.*<>-]*)+/g) ?? []).map((w) => w.replace(/\.$/, ''));
  return [...new Set(words.filter((w) => /[a-z]{2,}.*\/|\/.*[a-z]{2,}/.test(w) && !/^\d|^[A-Za-z]+\/[A-Za-z]+$/.test(w) || /\/$/.test(w)))].sort();
}

describe('the paths of the help texts', () => {
  it.each(COMMANDS.filter((c) => !ARCHIVE.has(c.name)).map((c) => c.name))('%s names only paths checked here', (name) => {
    expect(pathsIn(help(name))).toEqual([...(PATHS[name] ?? [])].sort());
  });
});

describe('what the help texts say', () => {
  it('new: writes projects/ID/basis.yaml under the current folder, never over an existing file; power by default; the technologies listed are those accepted', async () => {
    const root = projectsRoot('help-texts', {});
    expect(help('new')).toMatch(/Writes projects\/ID\/basis\.yaml under the current folder; never overwrites an existing file\./);
    expect((await run(['new', 'plant-1', '--technology', 'pem'], root)).code).toBe(0);
    const file = join(root, 'projects', 'plant-1', 'basis.yaml');
    expect(readFileSync(file, 'utf8')).toMatch(/^ {2}mode: power\b/m);
    writeFileSync(file, 'mine\n');
    expect((await run(['new', 'plant-1', '--technology', 'pem'], root)).code).not.toBe(0);
    expect(readFileSync(file, 'utf8')).toBe('mine\n');
    expect(help('new')).toContain(`TECH: ${TECHNOLOGY_NAMES.join(', ')}.`);
    for (const tech of TECHNOLOGY_NAMES) expect((await run(['new', `t-${tech}`, '--technology', tech], root)).code, tech).toBe(0);
  }, 60_000);

  it('check: every projects/*/basis.yaml without arguments, what else is under projects/ named; exit 1 on errors, 2 when an argument names no basis', async () => {
    expect(help('check')).toMatch(/Exit code 1 when any basis has errors, 2 when an argument names no basis\./);
    const root = projectsRoot('help-texts', { a: scaffoldText('pem', 'power', 'a'), b: scaffoldText('pem', 'power', 'b').replace(/^ {2}title: .*$/m, '  title: [') });
    writeFileSync(join(root, 'projects', 'notes.txt'), 'x\n');
    const all = await run(['check'], root);
    expect(all.code).toBe(1);
    expect(all.out).toMatch(/^projects\/a\/basis\.yaml: valid/);
    expect(all.err).toMatch(/projects\/b\/basis\.yaml:\d+:\d+: /);
    expect(all.err).toMatch(/^warning: projects\/notes\.txt is not a folder/m);
    expect((await run(['check', 'nothing-here'], root)).code).toBe(2);
  });

  it('schema: prints schema/design-basis.schema.json, which a first line ../../schema/design-basis.schema.json reaches from projects/<id>/', async () => {
    const r = await run(['schema']);
    expect(r.out).toBe(readFileSync(join(PACKAGE_ROOT, 'schema', 'design-basis.schema.json'), 'utf8'));
    expect(existsSync(join(PACKAGE_ROOT, 'projects', 'x', '../../schema/design-basis.schema.json'))).toBe(true);
  });

  it('calc --json: one results object whose keys schema/results.schema.json documents', async () => {
    const root = projectsRoot('help-texts', { a: scaffoldText('pem', 'power', 'a') });
    const r = await run(['calc', 'a', '--json'], root);
    const schema = JSON.parse(readFileSync(join(PACKAGE_ROOT, 'schema', 'results.schema.json'), 'utf8')) as { properties: Record<string, unknown>; required?: string[] };
    const keys = Object.keys(JSON.parse(r.out) as object);
    expect(keys.length).toBeGreaterThan(3);
    for (const key of keys) expect(Object.keys(schema.properties), key).toContain(key);
  });

  it('reaction: 4 electrons per O2 by default (H2 + 1/2 O2 -> H2O gives 2), none without O2 (the shift)', async () => {
    const text = help('reaction').replace(/\s+/g, ' ');
    expect(text).toMatch(/Electrons default to 4 per O2 consumed or produced; a reaction without O2 \(reforming, shift\) passes none/);
    const r = JSON.parse((await run(['reaction', 'H2 + 1/2 O2 -> H2O', '--temperature', '298.15K', '--json'])).out) as { electrons: number };
    expect(r.electrons).toBe(2);
    const shift = JSON.parse((await run(['reaction', 'CO + H2O -> CO2 + H2', '--temperature', '1000K', '--json'])).out) as { electrons: number | null };
    expect(shift.electrons).toBeNull();
  });

  it('species: g = h − Ts', async () => {
    expect(help('species')).toContain('g = h − Ts');
    const r = JSON.parse((await run(['species', 'H2O', '--temperature', '1000K', '--json'])).out) as Record<string, number>;
    // Rounding of the double sums only: 1e-9 relative.
    expect(r.g_J_per_mol).toBeCloseTo(r.h_J_per_mol! - 1000 * r.s_J_per_mol_K!, 3);
  });

  it('build: into a fresh folder beside site/, site/ a link switched to it; results from .cellbasis-cache/; --out DIR', async () => {
    const root = projectsRoot('help-texts', { a: scaffoldText('pem', 'power', 'a') });
    expect((await run(['build', '--html-only', '--quiet'], root)).code).toBe(0);
    expect(lstatSync(join(root, 'site')).isSymbolicLink()).toBe(true);
    expect(existsSync(join(root, 'site', 'projects', 'a', 'index.html'))).toBe(true);
    expect(readdirSync(join(root, '.cellbasis-cache', 'results')).length).toBe(1);
    expect((await run(['build', '--html-only', '--quiet', '--out', 'elsewhere'], root)).code).toBe(0);
    expect(existsSync(join(root, 'elsewhere', 'projects', 'a', 'index.html'))).toBe(true);
  }, 120_000);

  it('serve: site/, watches projects/, 127.0.0.1 by default, port 8080 by default', () => {
    // What serve does is shown by test/publish/serve-hardening.test.ts; here, that the help says it.
    const text = help('serve');
    expect(text).toMatch(/Writes the site into site\/ and watches the folders of projects\//);
    expect(text).toMatch(/Listens on 127\.0\.0\.1, this machine only/);
    expect(text).toMatch(/--port N\s+port of the dev server \(default 8080;/);
  });
});

describeWithChromium('build --help on the PDFs', () => {
  it('each draft is printed to site/projects/<id>/document.pdf (DIR/projects/<id>/document.pdf with --out), not projects/<id>/', async () => {
    expect(help('build')).toMatch(/printed beside its page, to site\/projects\/<id>\/document\.pdf \(DIR\/projects\/<id>\/document\.pdf\s+with --out\)/);
    const root = projectsRoot('help-texts', { a: scaffoldText('pem', 'power', 'a') });
    expect((await run(['build', '--quiet', '--out', 'DIR'], root)).code).toBe(0);
    expect(readFileSync(join(root, 'DIR', 'projects', 'a', 'document.pdf')).subarray(0, 5).toString()).toBe('%PDF-');
    expect(existsSync(join(root, 'projects', 'a', 'document.pdf'))).toBe(false);
  }, 300_000);
});
