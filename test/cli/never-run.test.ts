// Nothing in a design basis is ever run: YAML tags that would construct a function or call the
// shell are refused before anything is built (and leave no trace), template and script syntax
// in the basis's text comes back as the same text, and `cellbasis new` refuses ids that are
// shell or path syntax, writing nothing.
import { existsSync, lstatSync, mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseDocument } from 'yaml';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';
import { run } from '../helpers/run-cli.ts';

function project(text: string): string {
  return projectsRoot('never-run', { p: text });
}

const SCAFFOLD = scaffoldText('solid-oxide', 'power', 'p');

describe('nothing in a basis runs', () => {
  it.each([
    ['!!js/function', (marker: string) => `!!js/function "function () { require('fs').writeFileSync('${marker}', 'x') }"`],
    ['!!js/eval', (marker: string) => `!!js/eval "require('fs').writeFileSync('${marker}', 'x')"`],
    ['!!python/object/apply:os.system', (marker: string) => `!!python/object/apply:os.system ["touch ${marker}"]`],
    ['!<tag:yaml.org,2002:js/function>', (marker: string) => `!<tag:yaml.org,2002:js/function> "function () { require('fs').writeFileSync('${marker}', 'x') }"`],
  ])('a %s tag is refused at its place and nothing it names happens (check, calc, hazards)', async (tag, value) => {
    const marker = join(mkdtempSync(join(tmpdir(), 'cellbasis-marker-')), 'ran');
    const text = SCAFFOLD.replace(/^  title: .*$/m, `  title: ${value(marker)}`);
    const line = text.split('\n').findIndex((l) => l.startsWith('  title: !')) + 1;
    const root = project(text);
    for (const command of ['check', 'calc', 'hazards']) {
      const r = await run([command, 'p'], root);
      expect(r.err, command).toContain(`projects/p/basis.yaml:${line}:10: the YAML tag ${tag} is not allowed`);
      expect(r.code, command).toBe(1);
    }
    expect(existsSync(marker), 'the payload never ran').toBe(false);
  });

  it('template and script syntax in the text of a basis comes back as the same text from check and calc --json', async () => {
    const hostile = "{{ 7 * 7 }} {% include '/etc/passwd' %} ${process.exit(9)} <script>alert(1)</script> `touch pwned` $(touch pwned)";
    const doc = parseDocument(SCAFFOLD);
    doc.setIn(['document', 'title'], hostile);
    doc.setIn(['document', 'client'], '{{ constructor.constructor("return process")().exit() }}');
    const root = project(doc.toString());
    const check = await run(['check', 'p'], root);
    expect(check.code).toBe(0);
    expect(check.out).toContain(`p: ${hostile}\n`);
    // {{ 7 * 7 }} not rendered: the title line does not begin with 49 (the headline table has numbers of its own, so 49 may appear elsewhere).
    expect(check.out).not.toMatch(/: 49\b/);
    const calc = await run(['calc', 'p', '--json'], root);
    expect(calc.code).toBe(0);
    expect(JSON.parse(calc.out).project.title).toBe(hostile);
    expect(readdirSync(root).sort(), 'no file made by the text').toEqual(['projects']);
  });

  it('a message that repeats a hostile value repeats it as quoted text', async () => {
    const doc = parseDocument(SCAFFOLD);
    doc.setIn(['streams', 'fuel-electrode', 'composition'], '{{ 7 * 7 }}$(touch pwned)');
    const root = project(doc.toString());
    const r = await run(['check', 'p'], root);
    expect(r.err).toMatch(/streams\.fuel-electrode\.composition: unknown mixture or preset "\{\{ 7 \* 7 \}\}\$\(touch pwned\)"/);
    expect(r.code).toBe(1);
    expect(readdirSync(root)).toEqual(['projects']);
  });

  it.each(['$(touch pwned)', '`touch pwned`', 'a;touch pwned', 'a|touch pwned', 'a&&b', '{{7*7}}', '../pwned', '/tmp/pwned', '~root', 'a b', '-rf'])(
    'cellbasis new refuses the id %j and writes nothing',
    async (id) => {
      const root = mkdtempSync(join(tmpdir(), 'cellbasis-new-hostile-'));
      // /tmp/pwned and pwned in the temporary folder as they were (whatever else on the machine may
      // have put there): no command may make or touch either.
      const pwned = () => ['/tmp/pwned', join(tmpdir(), 'pwned')].map((path) => lstatSync(path, { bigint: true, throwIfNoEntry: false })?.ctimeNs ?? null).join(' ');
      const before = pwned();
      const r = await run(['new', id, '--technology', 'pem'], root);
      expect(r.code).toBe(2);
      expect(r.err).toMatch(/^cellbasis: (new: )?(project id .* (may not contain|must be 1 to 64 characters)|new: unknown option)/);
      expect(r.err).not.toMatch(/\n\s+at /);
      expect(readdirSync(root), 'nothing written').toEqual([]);
      expect(pwned()).toBe(before);
    },
  );
});
