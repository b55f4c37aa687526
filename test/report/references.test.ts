// The references list says which inputs and assumptions cite each of the project's references
// (section 10): a reviewer checks a reference is used for what it is listed for. A source may
// name its reference alone ("R3") or in a sentence ("R3, reciprocating compressor"); both cite
// it. Found wanting in the Kestrelford demo, where API 618 (R5), cited by the maximum discharge
// temperature as "R5, hydrogen-rich service …", read "listed in the basis".
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadBasisText } from '../../lib/basis/load.ts';
import type { DesignBasis } from '../../lib/basis/types.ts';
import { referencesSection } from '../../lib/report/sections/references.ts';

function demoBasis(id: string): DesignBasis {
  const loaded = loadBasisText(readFileSync(new URL(`../../projects/${id}/basis.yaml`, import.meta.url), 'utf8'), `projects/${id}/basis.yaml`, id);
  if (!loaded.ok) throw new Error(`${id} does not load`);
  return loaded.basis;
}

const noHazards = { cautions: [] } as unknown as Parameters<typeof referencesSection>[1];

function citedBy(basis: DesignBasis, id: string): string {
  const item = referencesSection(basis, noHazards).project.find((r) => r.id === id);
  if (!item) throw new Error(`no reference ${id}`);
  return item.citedBy;
}

describe('references: what in the basis cites each', () => {
  const kestrelford = demoBasis('kestrelford-pem-electrolyser');

  it('a source that names its reference inside a sentence cites it (Kestrelford R5, R4)', () => {
    const r5 = citedBy(kestrelford, 'R5');
    expect(r5).not.toBe('listed in the basis');
    expect(r5).toMatch(/discharge temperature/);
    // "R4, deionised water from the depot's treatment unit, winter" (the feed-water temperature).
    expect(citedBy(kestrelford, 'R4')).toMatch(/water/);
  });

  it('every input whose source names R3, alone or in a sentence, is listed under R3, and no other', () => {
    const r3 = citedBy(kestrelford, 'R3');
    const expected = kestrelford.inputs.filter((i) => i.source !== undefined && /(^|[^\w.-])R3(?![\w])/.test(i.source)).map((i) => i.label);
    // Kestrelford's basis cites R3 alone (air inlet temperature …) and in sentences (ambient, stage ratio, discharge temperature, steam conversion).
    expect(expected.length).toBeGreaterThanOrEqual(8);
    for (const label of expected) expect(r3).toContain(label);
    const cites = kestrelford.inputs.filter((i) => r3.split('; ').includes(i.label));
    for (const input of cites) expect(input.source).toMatch(/R3/);
  });

  it('an id does not cite inside a longer id or word (R1 is not cited by "R10" or "R1.2" or "XR1")', () => {
    const basis = structuredClone(kestrelford);
    basis.inputs = basis.inputs.map((i, k) => (k === 0 ? { ...i, source: 'see R10 and R1.2 and XR1' } : { ...i, source: 'R2' }));
    basis.assumptions = [];
    expect(citedBy(basis, 'R1')).toBe('listed in the basis');
    basis.inputs[0] = { ...basis.inputs[0]!, source: 'daily demand of R1.' };
    expect(citedBy(basis, 'R1')).toBe(basis.inputs[0]!.label);
  });

  it('an assumption whose reference names the id in a sentence cites it', () => {
    const basis = structuredClone(kestrelford);
    basis.assumptions = basis.assumptions.map((a) => ({ ...a, reference: a.id === 'A2' ? 'R4, clause 3' : undefined }));
    expect(citedBy(basis, 'R4')).toMatch(/^assumption A2/);
  });
});
