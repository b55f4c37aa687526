// The carbonate cell's cathode-gas loop (lib/plant/cathode-loop.ts): an off-gas burnt with burner
// air, mixed with a recycled share of the cathode exhaust. The expected numbers are from an
// independent recomputation in Python outside the repository (its own atom counting, complete
// combustion, and the two conditions solved by Cramer's rule on the O2 row and the total moles;
// then the loop run forward, n ← E + r (n − c), 4000 times from n = E, to check that the A and r
// found do give the stated O2 fraction and air utilization). The off-gas is the molten carbonate
// demo's at its rated point, rounded to 4 decimals (an input here, not a result). The law checked
// is the conservation of mass, element by element; the cells' take is Faraday's law with the
// carbonate cathode reaction CO2 + ½ O2 + 2e⁻ → CO3²⁻ (Larminie and Dicks, Fuel Cell Systems
// Explained, 2nd ed., 2003, the molten carbonate fuel cell; from memory, as listed in DEVELOPERS.md).
import { describe, expect, it } from 'vitest';
import { cathodeLoop, type CathodeLoopRequest } from '../../lib/plant/cathode-loop.ts';
import { findPreset } from '../../lib/basis/presets.ts';
import { FARADAY_C_PER_MOL as F } from '../../lib/thermo/constants.ts';
import { CalculationError } from '../../lib/core/errors.ts';

// CO 0.3083, CO2 3.0650, H2 0.5450, H2O 2.6573, CH4 0.0002, N2 0.0179 mol/s, as elements.
const OFF_GAS = {
  C: 0.3083 + 3.065 + 0.0002,
  H: 2 * 0.545 + 2 * 2.6573 + 4 * 0.0002,
  O: 0.3083 + 2 * 3.065 + 2.6573,
  N: 2 * 0.0179,
};
const CURRENT_A = 423792;
const DRY_AIR = findPreset('dry-air')!.composition;

function request(airUtilization: number, inletOxygenFraction: number): CathodeLoopRequest {
  return { offGasElements: OFF_GAS, burnerAir: DRY_AIR, take: { O2: CURRENT_A / (4 * F), CO2: CURRENT_A / (2 * F) }, airUtilization, inletOxygenFraction };
}

const total = (x: Readonly<Record<string, number>>) => Object.values(x).reduce((a, b) => a + b, 0);

describe('the cathode-gas loop of a carbonate cell', () => {
  it('gives the burner air, the recycled share and the inlet of the Python recomputation (U = 0.41, 9.4 % O2)', () => {
    const loop = cathodeLoop(request(0.41, 0.094));
    // Python: A = 11.619091 mol/s, r = 0.424868, D = 0.427050 mol/s. The solution is exact linear
    // algebra on the same doubles: 1e-6 relative is the printed figures' rounding.
    expect(loop.burnerAirMolPerS).toBeCloseTo(11.619091, 5);
    expect(loop.recycledShare).toBeCloseTo(0.424868, 6);
    expect(loop.oxygenDemandMolPerS).toBeCloseTo(0.42705, 6);
    const python: Record<string, number> = { Ar: 0.188691, CO2: 4.251734, H2O: 5.568638, N2: 15.8045, O2: 2.678228 };
    for (const [s, v] of Object.entries(python)) expect(loop.inlet[s], s).toBeCloseTo(v, 5);
    expect(total(loop.inlet)).toBeCloseTo(28.491791, 5);
    // Python's burner exhaust, the off-gas burnt with A of dry air.
    const exhaust: Record<string, number> = { Ar: 0.108522, CO2: 3.37838, H2O: 3.2027, N2: 9.089668, O2: 2.006871 };
    for (const [s, v] of Object.entries(exhaust)) expect(loop.burnerExhaust[s], s).toBeCloseTo(v, 5);
  });

  it('meets its two conditions and closes every element around the loop', () => {
    const loop = cathodeLoop(request(0.41, 0.094));
    expect(loop.inlet.O2! / total(loop.inlet)).toBeCloseTo(0.094, 12);
    expect(CURRENT_A / (4 * F) / loop.inlet.O2!).toBeCloseTo(0.41, 12);
    // inlet = burner exhaust + recycle; outlet = recycle + vent.
    for (const s of Object.keys(loop.inlet)) {
      expect(loop.inlet[s]! - (loop.burnerExhaust[s] ?? 0) - (loop.recycle[s] ?? 0), s).toBeCloseTo(0, 12);
      expect(loop.outlet[s]! - (loop.recycle[s] ?? 0) - (loop.vent[s] ?? 0), s).toBeCloseTo(0, 12);
    }
    // Every carbon atom of the off-gas leaves the loop as vented CO2 or as carbonate (I/2F).
    expect(loop.vent.CO2! + CURRENT_A / (2 * F)).toBeCloseTo(OFF_GAS.C + 0.00042 * loop.burnerAirMolPerS, 10);
    // Every hydrogen atom leaves as vented water: the loop removes none.
    expect(2 * loop.vent.H2O!).toBeCloseTo(OFF_GAS.H, 10);
  });

  it('recycles more at a lower air utilization (Python: U = 0.30 gives A = 12.584961 mol/s, r = 0.566335, CO2 12.6435 %)', () => {
    const loop = cathodeLoop(request(0.3, 0.094));
    expect(loop.burnerAirMolPerS).toBeCloseTo(12.584961, 5);
    expect(loop.recycledShare).toBeCloseTo(0.566335, 6);
    expect(loop.inlet.CO2! / total(loop.inlet)).toBeCloseTo(0.126435, 6);
  });

  it('refuses an O2 fraction above what the burner exhaust alone gives (Python: 12.76 % at r = 0; 15 % needs r = −0.447)', () => {
    expect(() => cathodeLoop(request(0.41, 0.15))).toThrow(/no cathode-gas recycle gives 15\.00 % O2 .* lower the inlet O2 fraction or the air utilization \(more O2 entering\)/);
    expect(() => cathodeLoop(request(0.41, 0.15))).toThrow(CalculationError);
    // As the message says, less air utilization (more O2 entering) makes it feasible: Python gives
    // r = −0.143917 at U = 0.30 and r = 0.010549 at U = 0.25 for the same 15 %.
    expect(() => cathodeLoop(request(0.3, 0.15))).toThrow(/recycle would be -14\.39 %/);
    expect(cathodeLoop(request(0.25, 0.15)).recycledShare).toBeCloseTo(0.010549, 6);
    // Just below the once-through fraction the recycle is small but feasible.
    expect(cathodeLoop(request(0.41, 0.1275)).recycledShare).toBeGreaterThan(0);
    expect(cathodeLoop(request(0.41, 0.1275)).recycledShare).toBeLessThan(0.005);
  });

  it('refuses an O2 fraction at or above the burner air\'s, and an air utilization outside (0, 1)', () => {
    expect(() => cathodeLoop(request(0.41, 0.21))).toThrow(/between 0 and the burner air's 20\.95 %/);
    expect(() => cathodeLoop(request(1, 0.094))).toThrow(/air utilization between 0 and 1/);
  });

  it('a low O2 fraction recycles most of the exhaust (Python: 3 % O2 at U = 0.41, r = 0.870552)', () => {
    expect(cathodeLoop(request(0.41, 0.03)).recycledShare).toBeCloseTo(0.870552, 6);
  });
});
