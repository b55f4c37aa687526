/**
 * The feed recuperator of a steam-fed electrolysis plant (lib/plant/recuperator.ts, plant.recuperator):
 * its duty and outlet temperatures against an independent recomputation, the pinch where the
 * composite curves put it, the plant's first law, the heat it saves, and the located refusals.
 */
import { describe, expect, it } from 'vitest';
import { evaluateBasis } from '../../lib/plant/calculate.ts';
import { plantBalance } from '../../lib/plant/plant-balance.ts';
import { enthalpyBySpecies } from '../helpers/hand-enthalpy.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';

const FEEDS = { fuel: '15 C', air: '15 C', water: '12 C' };

function soec(approach: string | null) {
  const edits: Record<string, unknown> = { 'plant.feed-temperatures': FEEDS };
  if (approach) edits['plant.recuperator'] = { 'minimum-approach': approach };
  const basis = basisFrom('solid-oxide', 'electrolysis', edits);
  const point = evaluateBasis(basis);
  return { point, plant: plantBalance(point, basis.plant) };
}

describe('the recuperator of the solid oxide electrolysis scaffold', () => {
  const without = soec(null).plant.electrolysis!;
  const { point, plant } = soec('25 K');
  const x = plant.electrolysis!;
  const r = x.recuperator!;
  const tStack = point.inputs.temperatureK;

  it('matches an independent recomputation of its duty and hot outlet temperature', () => {
    // A script outside the repository (NASA Glenn 9-coefficient polynomials parsed from the
    // database file, composite curves sampled at 2 000 points, bisection) gave Q = 174 969.3369 W
    // and T_ho = 457.59605 K for this basis; both use the same NASA Glenn data, so only rounding
    // and the solver tolerances (1e-9 of the duty) separate them: 0.01 W and 1 mK are ample.
    expect(r.dutyW).toBeCloseTo(174969.3369, 2);
    expect(r.hotOutletK).toBeCloseTo(457.59605, 3);
    // Every feed reaches its stack inlet: the hot side carries more heat than the feeds can take.
    expect(r.limitedBy).toBe('feeds-at-target');
    expect(r.coldOutletK).toBe(point.inputs.fuelInletTemperatureK);
  });

  it('gives the feeds exactly what the hot outlets give up, and keeps its minimum approach', () => {
    const hot = r.outlets.map((o) => o.flows);
    const released = hot.reduce((a, f) => a + enthalpyBySpecies(f, tStack) - enthalpyBySpecies(f, r.hotOutletK), 0);
    const taken = r.feeds.reduce((a, f) => a + enthalpyBySpecies(f.flows, f.toK) - enthalpyBySpecies(f.flows, f.fromK), 0);
    // First law of the exchanger, by the species data directly.
    expect(Math.abs(released - r.dutyW) / r.dutyW).toBeLessThan(1e-9);
    expect(Math.abs(taken - r.dutyW) / r.dutyW).toBeLessThan(1e-9);
    expect(r.smallestApproachK).toBeGreaterThanOrEqual(25 - 1e-9);
    // No water condenses in it: the hot side leaves above its dew point.
    expect(r.hotOutletK).toBeGreaterThan(r.hotDewPointK!);
  });

  it('takes its duty off the heat supplied, and the plant balance still closes', () => {
    // The stack and the evaporator are unchanged; the feed heaters supply only what is left.
    expect(without.heatSuppliedW - x.heatSuppliedW).toBeCloseTo(r.dutyW, 6);
    expect(x.specificEnergy.systemKWhPerKg).toBeLessThan(without.specificEnergy.systemKWhPerKg);
    expect(Math.abs(x.energy.residual)).toBeLessThan(1e-9);
    const superheat = x.duties.find((d) => d.id === 'superheating')!;
    expect(superheat.dutyW).toBeCloseTo(0, 6);
    expect(plant.streams.map((s) => s.id)).toEqual(expect.arrayContaining(['fuel-steam-recuperated', 'air-gas-recuperated', 'fuel-outlet-recuperated', 'air-outlet-recuperated']));
  });

  it('puts the pinch at the hot end when the approach binds: the feeds leave ΔT_min below the stack', () => {
    const tight = soec('300 K');
    const t = tight.plant.electrolysis!.recuperator!;
    // The hot outlets carry more heat capacity than the feeds (the oxygen made joins the sweep), so
    // the curves are closest at the hot end: T* = T_stack − ΔT_min. The independent script gave
    // Q = 107 287.381 W and T_ho = 703.86134 K (bisection to 1e-9 of the duty: 0.01 W).
    expect(t.limitedBy).toBe('minimum-approach');
    expect(t.coldOutletK).toBeCloseTo(tStack - 300, 5);
    expect(t.dutyW).toBeCloseTo(107287.381, 1);
    expect(t.hotOutletK).toBeCloseTo(703.86134, 3);
    expect(Math.abs(tight.plant.electrolysis!.energy.residual)).toBeLessThan(1e-9);
    const trim = tight.plant.electrolysis!.duties.find((d) => d.id === 'air-gas-preheat')!;
    expect(trim.fromK).toBeCloseTo(tStack - 300, 5);
  });
});

describe('plant.recuperator is refused where it does not apply, at its key', () => {
  it('in power mode', () => {
    expect(() => basisFrom('solid-oxide', 'power', { 'plant.recuperator': { 'minimum-approach': '25 K' } })).toThrow(/plant\.recuperator: recuperator belongs to electrolysis/);
  });
  it('for cells fed liquid water', () => {
    expect(() => basisFrom('pem', 'electrolysis', { 'plant.recuperator': { 'minimum-approach': '25 K' } })).toThrow(/plant\.recuperator: the recuperator heats the steam and sweep gas .* pem cells are fed liquid water/);
  });
  it('without its minimum approach, or with one beyond the limits of heat exchangers', () => {
    expect(() => basisFrom('solid-oxide', 'electrolysis', { 'plant.recuperator': {} })).toThrow(/plant\.recuperator\.minimum-approach/);
    expect(() => basisFrom('solid-oxide', 'electrolysis', { 'plant.recuperator': { 'minimum-approach': '900 K' } })).toThrow(/plant\.recuperator\.minimum-approach/);
  });
});
