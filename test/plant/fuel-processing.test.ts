/**
 * The pre-reformer and the anode off-gas recycle at the design point. Checks by conservation,
 * outside the code under test: the adiabatic pre-reformer's outlet carries the enthalpy of its
 * feed (first law, summed here from the species data), and in a recycle loop every atom of
 * carbon and hydrogen fed leaves in the share (1 − r) of the off-gas that is not returned
 * (element balance of the loop at steady state); carbon passes the electrolyte in neither
 * direction, so carbon closes without the current.
 */
import { describe, expect, it } from 'vitest';
import { evaluateBasis } from '../../lib/plant/calculate.ts';
import { mixtureEnthalpyJ } from '../../lib/thermo/mixture.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';

function carbon(flows: Readonly<Record<string, number>>): number {
  return Object.entries(flows).reduce((s, [k, v]) => s + v * (getSpecies(k).formula.C ?? 0), 0);
}

describe('pre-reformer and anode recycle', () => {
  it('an adiabatic pre-reformer: outlet enthalpy equals the feed enthalpy, and steam reforming of natural gas cools the gas', () => {
    const point = evaluateBasis(basisFrom('solid-oxide', 'power', { 'streams.fuel-electrode.pre-reforming': { kind: 'adiabatic', 'inlet-temperature': '520 C' } }));
    const pre = point.unit.preReformer!;
    expect(pre.inletTemperatureK).toBeCloseTo(793.15, 9);
    const hIn = mixtureEnthalpyJ(pre.feed, pre.inletTemperatureK);
    const hOut = mixtureEnthalpyJ(point.unit.fuelStackInlet!, pre.outletTemperatureK);
    // The HP solve closes to 1e-12 of its own scale; 1e-9 of the feed's enthalpy is the bar.
    expect(Math.abs(hOut - hIn) / Math.abs(hIn)).toBeLessThan(1e-9);
    // Net endothermic at S/C 2.5 on a methane-rich gas (steam reforming outweighs methanation and
    // shift at this pressure): the outlet is colder than the inlet.
    expect(pre.outletTemperatureK).toBeLessThan(pre.inletTemperatureK - 10);
  });

  it('an anode recycle: the loop closes to its tolerance and the fresh carbon leaves in the unreturned off-gas', () => {
    const point = evaluateBasis(basisFrom('solid-oxide', 'power', { 'plant.anode-recycle': { ratio: 0.6 } }));
    expect(point.recycle!.residual).toBeLessThan(1e-9);
    const fresh = carbon(point.unit.fuelRaw!);
    const offGas = carbon(point.path.fuelOutlet);
    expect(Math.abs(offGas * (1 - 0.6) - fresh) / fresh).toBeLessThan(1e-9);
    // The recycle holds steam: the fresh steam-to-carbon ratio is not the pre-reformer's.
    expect(point.unit.recycle!.H2O).toBeGreaterThan(0);
  });
});
