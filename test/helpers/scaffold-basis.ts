/** Design bases for the plant tests: a scaffold of a technology and mode with edits. */
import { parseDocument } from 'yaml';
import { renderScaffold } from '../../lib/basis/scaffolds.ts';
import { loadBasisText } from '../../lib/basis/load.ts';
import type { DesignBasis } from '../../lib/basis/types.ts';
import type { Mode, TechnologyId } from '../../lib/electrochem/technologies.ts';

/** The scaffold with `edits` applied: dotted path → value (undefined deletes the key). */
export function basisFrom(technology: TechnologyId, mode: Mode, edits: Record<string, unknown> = {}): DesignBasis {
  const doc = parseDocument(renderScaffold(technology, mode, 'test', '2026-11-30'));
  for (const [path, value] of Object.entries(edits)) {
    const keys = path.split('.');
    if (value === undefined) doc.deleteIn(keys);
    else doc.setIn(keys, value);
  }
  const result = loadBasisText(doc.toString(), 'projects/test/basis.yaml', 'test');
  if (!result.ok) throw new Error(result.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  return result.basis;
}
