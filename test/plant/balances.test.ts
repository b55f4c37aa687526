// Energy and mass closure of every technology and mode, recomputed here from the published
// streams with the species data: electric power + heat = enthalpy change of the streams to 1e-9
// relative (first law, steady flow), and every element in = out (the electrolyte only moves atoms
// between the stack's own streams).
import { describe, expect, it } from 'vitest';
import { calculate } from '../../lib/plant/calculate.ts';
import { scaffoldKinds } from '../../lib/basis/scaffolds.ts';
import { enthalpy } from '../../lib/thermo/properties.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';

function enthalpyOf(flows: Record<string, number>, t: number): number {
  return Object.entries(flows).reduce((s, [k, v]) => s + v * enthalpy(getSpecies(k), t), 0);
}
function elements(flows: Record<string, number>): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [k, v] of Object.entries(flows)) for (const [e, n] of Object.entries(getSpecies(k).formula)) out[e] = (out[e] ?? 0) + n * v;
  return out;
}

describe.each(scaffoldKinds())('balances of the $technology $mode scaffold', ({ technology, mode }) => {
  const r = calculate(basisFrom(technology, mode));
  const inlets = r.streams.filter((s) => s.id === 'fuel-inlet' || s.id === 'air-inlet');
  const outlets = r.streams.filter((s) => s.id === 'fuel-outlet' || s.id === 'air-outlet');

  it('energy closes: H_in(T_stack) − H_out + W_in = Q to 1e-9 relative, and with inlets as fed', () => {
    const t = r.conditions.temperature_K;
    const hIn = inlets.reduce((s, st) => s + enthalpyOf(st.speciesFlows_mol_per_s, t), 0);
    const hInFed = inlets.reduce((s, st) => s + enthalpyOf(st.speciesFlows_mol_per_s, st.temperature_K), 0);
    const hOut = outlets.reduce((s, st) => s + enthalpyOf(st.speciesFlows_mol_per_s, st.temperature_K), 0);
    const w = mode === 'power' ? -r.headline.stackPower_W : r.headline.stackPower_W;
    const scale = Math.max(Math.abs(hIn), Math.abs(hOut), Math.abs(w));
    expect(Math.abs(hIn - hOut + w - r.heat.isothermalHeat_W) / scale).toBeLessThan(1e-9);
    expect(Math.abs(hInFed - hOut + w - r.heat.asFedHeat_W) / scale).toBeLessThan(1e-9);
    // The published stream enthalpies agree with the species data at their temperatures.
    for (const s of r.streams) expect(Math.abs(s.enthalpyFlow_W - enthalpyOf(s.speciesFlows_mol_per_s, s.temperature_K))).toBeLessThan(1e-9 * scale);
  });

  it('every element entering the stack leaves it (1e-9 relative)', () => {
    const sum = (list: typeof inlets) => {
      const total: Record<string, number> = {};
      for (const s of list) for (const [e, v] of Object.entries(elements(s.speciesFlows_mol_per_s))) total[e] = (total[e] ?? 0) + v;
      return total;
    };
    const a = sum(inlets);
    const b = sum(outlets);
    for (const e of new Set([...Object.keys(a), ...Object.keys(b)])) {
      expect(Math.abs((a[e] ?? 0) - (b[e] ?? 0)) / Math.max(a[e] ?? 0, b[e] ?? 0), e).toBeLessThan(1e-9);
    }
  });

  it('no NaN or infinity anywhere in the results', () => {
    const bad: string[] = [];
    const walk = (v: unknown, path: string) => {
      if (typeof v === 'number' && !Number.isFinite(v)) bad.push(path);
      else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) walk(x, `${path}.${k}`);
    };
    walk(JSON.parse(JSON.stringify(r)), '');
    walk(r, '');
    expect(bad).toEqual([]);
  });
});
