// The molten carbonate demo's cathode gas is computed by its plant's cathode-gas loop
// (lib/plant/cathode-loop.ts): the anode off-gas burnt with dry air, mixed with a share r of the
// cathode exhaust, A and r fixed by the air utilization (0.41) and the inlet O2 fraction (9.4 %,
// R2). This test checks the model's loop against an independent recomputation in Python outside
// the repository, which takes the anode off-gas and the ionic current of the model's own results
// (its inputs), counts atoms itself, burns the off-gas completely, solves the O2 row and the total
// moles by Cramer's rule and then runs the loop forward, n ← E + r (n − c), 4000 times, to check
// the two conditions. Python gives, at the rated point, A = 11.618947 mol/s, r = 0.424874 and the
// inlet N2 55.4704, O2 9.4000, CO2 14.9224, H2O 19.5450, Ar 0.6623 %; at half load (air
// utilization 0.30, case low-gas-production) A = 5.943426 mol/s, r = 0.566339 and CO2 12.6432 %.
// The basis recorded, before the loop was computed, the rated cathode gas a hand balance gave:
// N2 55.47, O2 9.40, CO2 14.92, H2O 19.55, Ar 0.66 %; the model must reproduce it.
//
// Independently of the loop's own code, each element is conserved around it (the law of
// conservation of mass; no reaction makes or destroys atoms), so with A mol/s of burner air and
// the recycled share r, element by element,
//   b_inlet = b_off-gas + A · b_air + r · b_exhaust,
// four elements (C, H, O, N) and two unknowns. The two solved from C and N must leave H and O
// balanced too: a water knock-out or any other sink would show as a residual.
import { readFileSync } from 'node:fs';
import { parseDocument } from 'yaml';
import { describe, expect, it } from 'vitest';
import { loadBasisText } from '../../lib/basis/load.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { findPreset } from '../../lib/basis/presets.ts';

const ID = 'corrin-beck-mcfc-biogas';

/** Atoms of each element in a species named by its formula (CO2, H2O, NH3, C2H6, Ar ...); a prefix such as n- is dropped. */
function atoms(species: string): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [, element, count] of species.replace(/^[a-z]-/, '').matchAll(/([A-Z][a-z]?)(\d*)/g)) out[element!] = (out[element!] ?? 0) + (count ? Number(count) : 1);
  return out;
}

function elements(flows: Readonly<Record<string, number>>): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [species, n] of Object.entries(flows)) for (const [element, k] of Object.entries(atoms(species))) out[element] = (out[element] ?? 0) + k * n;
  return out;
}

// The burner air is the dry-air preset (lib/basis/data/presets.yaml, its source named there).
const DRY_AIR = findPreset('dry-air')!.composition;

describe('the molten carbonate demo: its cathode gas is what its burner and recycle make (A2)', () => {
  const text = readFileSync(new URL(`../../projects/${ID}/basis.yaml`, import.meta.url), 'utf8');
  const loaded = loadBasisText(text, `projects/${ID}/basis.yaml`, ID);
  if (!loaded.ok) throw new Error(ID);
  const r = calculate(loaded.basis);
  const flows = (id: string) => elements(r.plant.streams.find((s) => s.id === id)!.speciesFlows_mol_per_s);
  const [off, inlet, exhaust, air] = [flows('fuel-outlet'), flows('air-inlet'), flows('air-outlet'), elements(DRY_AIR)];
  const need = (e: string) => (inlet[e] ?? 0) - (off[e] ?? 0);
  // Solve C and N for the air A and the recycled share s (Cramer's rule).
  const [a1, b1, c1] = [air.C!, exhaust.C!, need('C')];
  const [a2, b2, c2] = [air.N!, exhaust.N!, need('N')];
  const det = a1 * b2 - a2 * b1;
  const A = (c1 * b2 - c2 * b1) / det;
  const share = (a1 * c2 - a2 * c1) / det;
  const residual = (e: string) => (off[e] ?? 0) + A * (air[e] ?? 0) + share * (exhaust[e] ?? 0) - (inlet[e] ?? 0);
  const loop = r.plant.power!.cathodeLoop!;

  it('the burner air, the recycled share and the inlet are those of the Python recomputation', () => {
    // Python prints 6 decimals of the same linear algebra on the same inputs: 1e-6.
    expect(loop.burnerAir_mol_per_s).toBeCloseTo(11.618947, 5);
    expect(loop.recycledShare).toBeCloseTo(0.424874, 6);
    const python: Record<string, number> = { N2: 0.554704, O2: 0.094, CO2: 0.149224, H2O: 0.19545, Ar: 0.006623 };
    for (const [s, x] of Object.entries(python)) expect(Math.abs(loop.inletMoleFractions[s]! - x), s).toBeLessThan(1e-6);
  });

  it('reproduces the cathode gas the basis recorded from the hand balance, within its 4-decimal rounding', () => {
    // Half a unit of the 4th decimal is 5e-5. The water sits on that boundary: 0.1954499 here, and
    // 0.19545 in Python, recorded as 0.1955, 5.001e-5 away; 5.1e-5 admits it and nothing larger.
    const recorded: Record<string, number> = { N2: 0.5547, O2: 0.094, CO2: 0.1492, H2O: 0.1955, Ar: 0.0066 };
    for (const [s, x] of Object.entries(recorded)) expect(Math.abs(loop.inletMoleFractions[s]! - x), s).toBeLessThan(5.1e-5);
  });

  it('the element balance of the streams gives the same A and r, and C, H, O, N and Ar close', () => {
    // The equilibrium off-gas conserves its elements to the minimiser's tolerance, far below 1e-8.
    expect(Math.abs(A - loop.burnerAir_mol_per_s) / A).toBeLessThan(1e-8);
    expect(Math.abs(share - loop.recycledShare)).toBeLessThan(1e-8);
    for (const e of ['C', 'H', 'O', 'N', 'Ar']) expect(Math.abs(residual(e)) / inlet[e]!, e).toBeLessThan(1e-8);
  });

  it('every atom of carbon and hydrogen of the anode off-gas reaches the cathode: CO2 utilization 0.52, none of the water removed', () => {
    // The cells take CO2 + ½ O2 per 2F: I/2F of CO2 out of the inlet's CO2 flow.
    expect(Math.abs(loop.carbonDioxideUtilization - 0.5166)).toBeLessThan(0.0005);
    expect(loop.airUtilization).toBeCloseTo(0.41, 12);
  });

  it('the half-load case recycles more, as the Python recomputation finds at an air utilization of 0.30', () => {
    const half = r.cases!.find((c) => c.id === 'low-gas-production')!.plant!.power!.cathodeLoop!;
    expect(half.burnerAir_mol_per_s).toBeCloseTo(5.943426, 5);
    expect(half.recycledShare).toBeCloseTo(0.566339, 6);
    expect(Math.abs(half.inletMoleFractions.CO2! - 0.126432)).toBeLessThan(1e-6);
  });

  it('the burner outlet, the mixing and the cooler that holds the stated inlet are those of the Python recomputation', () => {
    // /tmp/cathodeloop/energy.py: NASA Glenn 9-coefficient polynomials read from thermo.inp
    // (McBride, Zehe and Gordon, NASA/TP-2002-211556, as distributed in Debian's rocketcea 1.1.18)
    // by its own parser; the burner's products (complete combustion) at the temperature where they
    // carry the off-gas at 650 °C and the burner air at 10 °C, the stack's exhaust temperature from
    // its streams and DC power, the recycle mixed at it. It leaves out species below 1e-7 mol/s
    // (the equilibrium traces of the off-gas): 0.01 K and 1 W hold what they could move.
    const C = 273.15;
    const check = (l: typeof loop, burner: number, mixing: number, heatingW: number) => {
      expect(Math.abs(l.burnerOutletTemperature_K - C - burner)).toBeLessThan(0.01);
      expect(Math.abs(l.mixingTemperature_K - C - mixing)).toBeLessThan(0.01);
      expect(Math.abs(l.heating_W - heatingW)).toBeLessThan(1);
    };
    check(loop, 642.135, 644.314, -46529.8);
    check(r.cases!.find((c) => c.id === 'low-gas-production')!.plant!.power!.cathodeLoop!, 615.542, 633.248, -3513.2);
  });

  it('humid burner air (80 % at 10 °C) adds its water to the cathode gas: half a point, as A2 says', () => {
    // The Python recomputation with the burner air at x_w = 0.8 · 1.2282 kPa / 101.325 kPa (the
    // saturation pressure of water at 10 °C, NIST steam tables, from memory), dry air for the rest:
    // A = 11.78202 mol/s, r = 0.418402, H2O 20.0170 % at the inlet (19.5450 % with dry air).
    const doc = parseDocument(text);
    doc.deleteIn(['cases']);
    doc.setIn(['streams', 'air-electrode', 'cathode-loop', 'burner-air'], doc.createNode({ composition: 'humid-air', humidity: { 'relative-humidity': '80 %', at: '10 C' } }));
    const humid = loadBasisText(doc.toString(), `projects/${ID}/basis.yaml`, ID);
    if (!humid.ok) throw new Error(ID);
    const l = calculate(humid.basis).plant.power!.cathodeLoop!;
    // The 5-figure saturation pressure moves x_w by 4e-5 of itself: far below these tolerances.
    expect(Math.abs(l.burnerAir_mol_per_s - 11.78202)).toBeLessThan(1e-4);
    expect(Math.abs(l.recycledShare - 0.418402)).toBeLessThan(1e-5);
    expect(Math.abs(l.inletMoleFractions.H2O! - 0.20017)).toBeLessThan(1e-5);
  });

  it('the plant closes the first law around the loop, its cooler included', () => {
    // The plant's energy balance is evaluated from the boundary streams (power-plant.ts).
    expect(Math.abs(r.plant.power!.energyBalance.residual)).toBeLessThan(1e-9);
  });
});
