/**
 * Design bases for the tests, made from the scaffolds of lib/basis/scaffolds (dated
 * SCAFFOLD_DATE, so that no test depends on today's date): the text with edits, the loaded
 * basis, and a temporary working folder holding projects/<id>/basis.yaml for each of some texts.
 */
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseDocument } from 'yaml';
import { renderScaffold } from '../../lib/basis/scaffolds.ts';
import { loadBasisText } from '../../lib/basis/load.ts';
import type { DesignBasis } from '../../lib/basis/types.ts';
import type { Mode, TechnologyId } from '../../lib/electrochem/technologies.ts';

/** The date the test scaffolds carry. */
export const SCAFFOLD_DATE = '2026-11-30';

/** The scaffold's text for project `id`, with `edits` applied through the YAML document: dotted path → value (undefined deletes the key). */
export function scaffoldText(technology: TechnologyId, mode: Mode, id: string, edits: Record<string, unknown> = {}): string {
  const text = renderScaffold(technology, mode, id, SCAFFOLD_DATE);
  if (Object.keys(edits).length === 0) return text;
  const doc = parseDocument(text);
  for (const [path, value] of Object.entries(edits)) {
    const keys = path.split('.');
    if (value === undefined) doc.deleteIn(keys);
    else doc.setIn(keys, value);
  }
  return doc.toString();
}

/** The scaffold with `edits` applied, loaded (it must be valid). */
export function basisFrom(technology: TechnologyId, mode: Mode, edits: Record<string, unknown> = {}): DesignBasis {
  const result = loadBasisText(scaffoldText(technology, mode, 'test', edits), 'projects/test/basis.yaml', 'test');
  if (!result.ok) throw new Error(result.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  return result.basis;
}

/** A temporary working folder (its name starting `cellbasis-<prefix>-`) with projects/<id>/basis.yaml for each id and text. */
export function projectsRoot(prefix: string, projects: Readonly<Record<string, string>>): string {
  const root = mkdtempSync(join(tmpdir(), `cellbasis-${prefix}-`));
  for (const [id, text] of Object.entries(projects)) {
    mkdirSync(join(root, 'projects', id), { recursive: true });
    writeFileSync(join(root, 'projects', id, 'basis.yaml'), text);
  }
  return root;
}
