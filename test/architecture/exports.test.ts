// Every function, class and constant a module of lib/ exports is used by another module: lib/,
// test/, bench/, scripts/, the site's script (templates/assets) or the Eleventy entry point
// (DEVELOPERS.md, "Exports"). An export nothing imports hides a module's
// interface among its helpers, and one that nothing uses is dead code. Types and interfaces are
// not checked: they stay exported with the functions whose parameters and results they name.
// "Used" is read with a real parser (sources.ts) as the name appearing as an identifier in another
// module, so a name in a comment or a string does not count; a name another module happens to use
// for something else does (the test errs towards passing, never towards a false alarm).
import { describe, expect, it } from 'vitest';
import { parseFile, parseSource, sourceFiles, walk, type Node } from './sources.ts';

/** The names of the values (functions, classes, constants, enums) a module exports under their own names. */
function exportedValues(program: Node): { name: string; line: number }[] {
  const found: { name: string; line: number }[] = [];
  for (const statement of program.body as Node[]) {
    if (statement.type !== 'ExportNamedDeclaration' || statement.exportKind === 'type' || statement.source) continue;
    const line = statement.loc!.start.line;
    const declaration = statement.declaration as Node | null;
    if (declaration?.type === 'VariableDeclaration') {
      for (const d of declaration.declarations as Node[]) if ((d.id as Node).type === 'Identifier') found.push({ name: (d.id as Node).name as string, line });
    } else if (declaration && ['FunctionDeclaration', 'ClassDeclaration', 'TSEnumDeclaration'].includes(declaration.type) && !declaration.declare) {
      found.push({ name: (declaration.id as Node).name as string, line });
    }
    for (const s of (statement.specifiers as Node[] | undefined) ?? []) if (s.exportKind !== 'type') found.push({ name: (s.exported as Node).name as string, line });
  }
  return found;
}

/** Every identifier a module's code names (declarations, references, properties, import specifiers). */
function identifiers(program: Node): Set<string> {
  const names = new Set<string>();
  walk(program, (node) => {
    if (node.type === 'Identifier') names.add(node.name as string);
  });
  return names;
}

describe('exports of lib/', () => {
  it('exports no function, class or constant that no other module uses', () => {
    const users = ['lib', 'test', 'bench', 'scripts', 'templates'].flatMap((dir) => sourceFiles(dir)).concat(['.eleventy.js', 'bin/cellbasis.js']);
    const named = new Map(users.map((file) => [file, identifiers(parseFile(file))]));
    const unused: string[] = [];
    for (const file of sourceFiles('lib')) {
      for (const { name, line } of exportedValues(parseFile(file))) {
        if (![...named].some(([other, names]) => other !== file && names.has(name))) unused.push(`${file}:${line} ${name}`);
      }
    }
    if (unused.length > 0) console.log(`exported values no other module uses:\n${unused.join('\n')}`);
    expect(unused).toEqual([]);
  });

  it('reads exported values and identifiers from the syntax, not from comments or strings', () => {
    const module = parseSource("export const a = 1;\nexport function b() {}\nexport type C = number;\nconst d = 2;\nexport { d };\nexport { e } from './e.ts';", 'x.ts');
    expect(exportedValues(module).map((v) => v.name)).toEqual(['a', 'b', 'd']);
    const user = parseSource("// a\nconst s = 'b';\nconst { d: local } = await import('./x.ts');", 'y.ts');
    expect([...identifiers(user)].sort()).toEqual(['d', 'local', 's']);
  });
});
