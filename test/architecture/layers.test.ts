// The layers of lib/ hold: every module imports only from its own folder and the folders below it,
// in the order the contributor guide states (DEVELOPERS.md, "Layer order"); every folder of lib/
// has its place in that order; and side effects (writing files, processes, threads, browsers,
// servers) are imported only where the guide says they live. No exception is listed here: an
// import that goes up fails, whatever it is.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { moduleReferences, tokenize } from './imports.ts';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const LIB = join(ROOT, 'lib');

/** The order of DEVELOPERS.md: "Layer order (bottom to top): `core` → `thermo` → ...". */
function layerOrder(): string[] {
  const guide = readFileSync(join(ROOT, 'DEVELOPERS.md'), 'utf8');
  const line = /^Layer order \(bottom to top\): (.+)$/m.exec(guide);
  if (!line) throw new Error('DEVELOPERS.md has no line "Layer order (bottom to top): ..."');
  return line[1]!.split('→').map((name) => name.trim().replace(/^`lib\/|^`|`$/g, '')).filter((name) => name !== '');
}

/** The folders whose modules may have side effects, from the same guide: "Side effects live in: `lib/batch`, ...". */
function sideEffectLayers(): string[] {
  const guide = readFileSync(join(ROOT, 'DEVELOPERS.md'), 'utf8');
  const line = /^Side effects live in: (.+)$/m.exec(guide);
  if (!line) throw new Error('DEVELOPERS.md has no line "Side effects live in: ..."');
  return [...line[1]!.matchAll(/`lib\/([a-z-]+)`/g)].map((m) => m[1]!);
}

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return /\.(ts|mts|js|mjs)$/.test(name) ? [path] : [];
  });
}

/** The layer folder a path under lib/ belongs to, or null for lib/ itself and anything outside it. */
function layerOf(path: string): string | null {
  const rel = relative(LIB, path);
  if (rel.startsWith('..') || !rel.includes(sep)) return null;
  return rel.split(sep)[0]!;
}

const ORDER = layerOrder();
const FILES = sourceFiles(LIB);

/** Imports that act on the world: processes, threads, browsers, servers, the network. */
const SIDE_EFFECT_MODULES = /^(node:)?(child_process|worker_threads|cluster|http|https|http2|net|dgram)$|^playwright-core$|^@11ty\//;
/** Functions of node:fs that write, move or remove. */
const FS_WRITES = /^(write|writeFile|appendFile|mkdir|mkdtemp|rename|rm|rmdir|unlink|copyFile|cp|symlink|link|truncate|ftruncate|chmod|chown|utimes|futimes|fsync|createWriteStream)(Sync)?$/;

describe('layers of lib/', () => {
  it('reads an order from DEVELOPERS.md that places every folder of lib/ once, and no module directly in lib/', () => {
    expect(ORDER.length).toBeGreaterThan(5);
    expect(new Set(ORDER).size).toBe(ORDER.length);
    const folders = readdirSync(LIB).filter((name) => statSync(join(LIB, name)).isDirectory());
    for (const folder of folders) expect(ORDER, `lib/${folder} has no place in the layer order of DEVELOPERS.md`).toContain(folder);
    expect(readdirSync(LIB).filter((name) => statSync(join(LIB, name)).isFile())).toEqual([]);
  });

  it('finds every import statement written at the start of a line (the lexer misses none)', () => {
    for (const file of FILES) {
      const source = readFileSync(file, 'utf8');
      const written = source.split('\n').filter((l) => /^(import|export)\b.*\bfrom\s*['"]|^import\s*['"]/.test(l) || /^} from ['"]/.test(l)).length;
      const read = moduleReferences(source).filter((r) => r.kind === 'import' || r.kind === 'export-from').length;
      expect(read, relative(ROOT, file)).toBe(written);
    }
  });

  it('has no import that goes up the order', () => {
    const upward: string[] = [];
    for (const file of FILES) {
      const from = layerOf(file)!;
      for (const ref of moduleReferences(readFileSync(file, 'utf8'))) {
        if (!ref.specifier.startsWith('.')) continue;
        const to = layerOf(resolve(dirname(file), ref.specifier));
        if (to === null) continue;
        if (!ORDER.includes(to) || ORDER.indexOf(to) > ORDER.indexOf(from)) {
          upward.push(`${relative(ROOT, file)}:${ref.line}: ${from} imports ${ref.specifier} (${to})`);
        }
      }
    }
    expect(upward).toEqual([]);
  });

  it('imports processes, threads, browsers, servers and file writes only in the layers the guide names', () => {
    const allowed = sideEffectLayers();
    expect(allowed.length).toBeGreaterThan(0);
    for (const layer of allowed) expect(ORDER).toContain(layer);
    const misplaced: string[] = [];
    for (const file of FILES) {
      const layer = layerOf(file)!;
      if (allowed.includes(layer)) continue;
      for (const ref of moduleReferences(readFileSync(file, 'utf8'))) {
        const writes = /^(node:)?fs(\/promises)?$/.test(ref.specifier) ? ref.names.filter((n) => FS_WRITES.test(n)) : [];
        if (SIDE_EFFECT_MODULES.test(ref.specifier) || writes.length > 0) {
          misplaced.push(`${relative(ROOT, file)}:${ref.line}: ${ref.specifier}${writes.length ? ` (${writes.join(', ')})` : ''}`);
        }
      }
    }
    expect(misplaced).toEqual([]);
  });
});

describe('the import lexer', () => {
  it('reads imports of every form and skips those in comments, strings, templates and after regular expressions', () => {
    const source = [
      "import a, { b, type C as D } from './one.ts';",
      "import type { E } from '../two.ts';",
      "import './three.ts';",
      "export { f } from './four.ts';",
      "export * from './five.ts';",
      "// import { no } from './comment.ts';",
      "/* import { no } from './block.ts'; */",
      "const s = \"import { no } from './string.ts'\";",
      "const t = `import { no } from './template.ts' ${await import('./six.ts')}`;",
      "const r = /['\"`]/.test(s) ? 1 : 2;",
      "const u = new URL('./seven.mjs', import.meta.url);",
      "const m = import.meta.url;",
      "import { g } from './eight.ts';",
    ].join('\n');
    expect(moduleReferences(source).map((r) => [r.kind, r.specifier, r.names.join(' '), r.line])).toEqual([
      ['import', './one.ts', 'a b C', 1],
      ['import', '../two.ts', 'E', 2],
      ['import', './three.ts', '', 3],
      ['export-from', './four.ts', '', 4],
      ['export-from', './five.ts', '', 5],
      ['dynamic-import', './six.ts', '', 9],
      ['url', './seven.mjs', '', 11],
      ['import', './eight.ts', 'g', 13],
    ]);
  });

  it('refuses a source it cannot read to the end', () => {
    expect(() => tokenize("const s = 'open")).toThrow(/unterminated string/);
    expect(() => tokenize('const t = `open ${x}')).toThrow(/unterminated template/);
    expect(() => tokenize('/* open')).toThrow(/unterminated comment/);
  });
});
