// Every bad-input case of the corpus (bad-input-cases.ts) gives exactly its diagnostics: the
// message text, the field path and the line:column, all errors at once, sorted by position.
import { describe, expect, it } from 'vitest';
import { loadBasisText } from '../../lib/basis/load.ts';
import { formatDiagnostic } from '../../lib/basis/diagnostics.ts';
import { CASES } from './bad-input-cases.ts';

describe('bad inputs', () => {
  it('the corpus has at least 30 cases, each with at least one error', () => {
    expect(CASES.length).toBeGreaterThanOrEqual(30);
    for (const c of CASES) expect(c.errors.length, c.name).toBeGreaterThan(0);
  });

  it.each(CASES.map((c) => [c.name, c] as const))('%s', (_name, c) => {
    const result = loadBasisText(c.input, 'projects/t/basis.yaml', 't');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors.map(formatDiagnostic)).toEqual(c.errors);
    expect(result.warnings.map(formatDiagnostic)).toEqual(c.warnings ?? []);
  });
});
