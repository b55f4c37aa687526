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
import { recuperate } from '../../lib/plant/recuperator.ts';

const FEEDS = { fuel: '15 C', air: '15 C', water: '12 C' };

function soec(approach: string | null) {
  const edits: Record<string, unknown> = { 'plant.feed-temperatures': FEEDS };
  if (approach) edits['plant.recuperator'] = { 'minimum-approach': approach };
  const basis = basisFrom('solid-oxide', 'electrolysis', edits);
  const point = evaluateBasis(basis);
  return { point, plant: plantBalance(point, basis.plant), waterK: basis.plant.feedWaterTemperatureK };
}

// The independent recomputation quoted below is a Python script outside the repository: its own
// parser of the NASA Glenn 9-coefficient records (shared/data/nasa-glenn-thermo.inp: H2O, H2O(L),
// H2, O2, N2, Ar, CO2 and the traces), T_sat and the dew points by CoolProp's IAPWS-IF97 backend,
// the cold composite curve with the feed water liquid below T_sat, a flat segment at T_sat and
// vapour above (4 000 temperatures between each two kinks and both ends of the flat segment), and
// the duty from the problem-table bound Q ≤ c + H_hot(T_hi) − H_hot(T_c + ΔT_min) over those
// points (not a bisection), capped by the feeds' and the dew point's limits. It uses the same
// species data, so only the solvers separate the two: this module bisects to 1e-9 of the duty
// (≤ 0.2 mW here) and inverts H(T) to 1e-12; 0.01 W and 1e-4 K are ample and still catch a
// misplaced kink or a latent heat left out (kW, tens of K).

const H_SAT = (n: number, t: number) => ({ liquid: enthalpyBySpecies({ 'H2O(L)': n }, t), vapour: enthalpyBySpecies({ H2O: n }, t) });

/** T_h(c) of the hot side over the exchanger, by bisection on the species data (a hand calculation). */
function hotAt(hot: Record<string, number>, hotOutletK: number, hotInletK: number, c: number): number {
  const target = enthalpyBySpecies(hot, hotOutletK) + c;
  let lo = hotOutletK;
  let hi = hotInletK;
  for (let k = 0; k < 100; k++) {
    const mid = (lo + hi) / 2;
    if (enthalpyBySpecies(hot, mid) < target) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

describe('the recuperator of the solid oxide electrolysis scaffold: the feed water raised from its supply temperature', () => {
  const without = soec(null).plant.electrolysis!;
  const { point, plant, waterK } = soec('25 K');
  const x = plant.electrolysis!;
  const r = x.recuperator!;
  const tStack = point.inputs.temperatureK;
  const steam = x.steam[0]!;
  const water = r.feeds.find((f) => f.id === 'fuel-steam')!;

  it('matches the independent recomputation of its duty, hot outlet and cold outlet', () => {
    // The Python script: Q = 205 804.9465 W, limited by the hot side's dew point
    // (T_ho = T_dew = 342.01463 K), every feed out at T* = 384.447525 K (the water evaporated).
    expect(r.limitedBy).toBe('dew-point');
    expect(r.dutyW).toBeCloseTo(205804.9465, 2);
    expect(r.hotOutletK).toBeCloseTo(342.01463, 4);
    expect(r.coldOutletK).toBeCloseTo(384.447525, 4);
    expect(water.fromK).toBe(waterK);
    expect(water.vapourFraction).toBe(1);
    expect(r.hotOutletK).toBeGreaterThanOrEqual(r.hotDewPointK! - 1e-9);
  });

  it('keeps the minimum approach at both ends of the evaporation, where the cold curve is flat', () => {
    // C(T_sat, 0) and C(T_sat, 1): the feeds' heat up to T_sat before and after the water
    // evaporates, by the species data; the script gives T_h − T_sat = 102.83895 K and 690.57933 K.
    const tSat = steam.saturationTemperatureK;
    const n = steam.waterMolPerS;
    const gases = r.feeds.filter((f) => f.saturationK === null);
    const gasHeat = gases.reduce((a, f) => a + enthalpyBySpecies(f.flows, tSat) - enthalpyBySpecies(f.flows, f.fromK), 0);
    const before = gasHeat + H_SAT(n, tSat).liquid - H_SAT(n, water.fromK).liquid;
    const after = before + n * steam.latentHeatJPerMol;
    const sum: Record<string, number> = {};
    for (const o of r.outlets) for (const [k, v] of Object.entries(o.flows)) sum[k] = (sum[k] ?? 0) + v;
    expect(hotAt(sum, r.hotOutletK, tStack, before) - tSat).toBeCloseTo(102.83895, 3);
    expect(hotAt(sum, r.hotOutletK, tStack, after) - tSat).toBeCloseTo(690.57933, 3);
    expect(r.smallestApproachK).toBeGreaterThanOrEqual(25);
  });

  it('gives the feeds exactly what the hot outlets give up (first law of the exchanger)', () => {
    const released = r.outlets.reduce((a, o) => a + enthalpyBySpecies(o.flows, tStack) - enthalpyBySpecies(o.flows, r.hotOutletK), 0);
    // The feed water enters as liquid; every feed leaves with the phases it has at T*.
    const entering = (f: (typeof r.feeds)[number]) => (f.saturationK === null ? f.flows : { 'H2O(L)': steam.waterMolPerS });
    const taken = r.feeds.reduce((a, f) => a + enthalpyBySpecies(f.flows, f.toK) - enthalpyBySpecies(entering(f), f.fromK), 0);
    expect(Math.abs(released - r.dutyW) / r.dutyW).toBeLessThan(1e-9);
    expect(Math.abs(taken - r.dutyW) / r.dutyW).toBeLessThan(1e-9);
  });

  it('reduces the water heater, evaporator, superheater and gas heaters by exactly its duty, and the plant balance closes', () => {
    const heat = (duties: typeof x.duties) => duties.filter((d) => d.dutyW > 0).reduce((a, d) => a + d.dutyW, 0);
    expect(Math.abs(heat(without.duties) - heat(x.duties) - r.dutyW) / r.dutyW).toBeLessThan(1e-12);
    expect(Math.abs(without.heatSuppliedW - x.heatSuppliedW - r.dutyW) / r.dutyW).toBeLessThan(1e-12);
    expect(x.specificEnergy.systemKWhPerKg).toBeLessThan(without.specificEnergy.systemKWhPerKg);
    expect(Math.abs(x.energy.residual)).toBeLessThan(1e-9);
    const duty = (id: string) => x.duties.find((d) => d.id === id)!;
    // The water leaves the recuperator superheated: no water heating or evaporation is left, and
    // the superheater takes the steam from T* (hand: ṅ_w [h°_H2O(T_in) − h°_H2O(T*)]).
    expect(duty('feed-water-heating')).toMatchObject({ dutyW: 0, fromK: steam.saturationTemperatureK, toK: steam.saturationTemperatureK });
    expect(duty('evaporation').dutyW).toBe(0);
    expect(duty('superheating').fromK).toBe(r.coldOutletK);
    expect(duty('superheating').dutyW).toBeCloseTo(enthalpyBySpecies({ H2O: steam.waterMolPerS }, steam.toK) - enthalpyBySpecies({ H2O: steam.waterMolPerS }, r.coldOutletK), 6);
    // The steam raising itself (the worked line) is the whole need, unchanged.
    expect(steam).toEqual(without.steam[0]);
    expect(plant.streams.map((s) => s.id)).toEqual(expect.arrayContaining(['fuel-steam-recuperated', 'air-gas-recuperated', 'fuel-outlet-recuperated', 'air-outlet-recuperated']));
  });

  it('puts the pinch at the cold end when the approach binds, and leaves the water partly evaporated', () => {
    const tight = soec('300 K');
    const t = tight.plant.electrolysis!;
    const tr = t.recuperator!;
    const s = t.steam[0]!;
    // The liquid water's heat capacity flow exceeds the hot outlets', so the curves are closest at
    // the cold end: T_ho = T_w + ΔT_min. The script: Q = 140 285.0288 W, the water at T_sat
    // 62.10437 % evaporated.
    expect(tr.limitedBy).toBe('minimum-approach');
    expect(tr.hotOutletK).toBeCloseTo(tight.waterK + 300, 6);
    expect(tr.dutyW).toBeCloseTo(140285.0288, 2);
    expect(tr.coldOutletK).toBe(s.saturationTemperatureK);
    const w = tr.feeds.find((f) => f.id === 'fuel-steam')!;
    expect(w.vapourFraction!).toBeCloseTo(0.6210437, 6);
    // The evaporator takes the rest, (1 − x) ṅ_w L(T_sat); the superheater all of its duty.
    const duty = (id: string) => t.duties.find((d) => d.id === id)!;
    expect(duty('feed-water-heating').dutyW).toBe(0);
    expect(duty('evaporation').dutyW).toBeCloseTo((1 - w.vapourFraction!) * s.waterMolPerS * s.latentHeatJPerMol, 6);
    expect(duty('superheating').dutyW).toBeCloseTo(s.superheatingW, 6);
    expect(Math.abs(t.energy.residual)).toBeLessThan(1e-9);
  });
});

describe('the pinch at the start of the evaporation (recuperate, streams made for it)', () => {
  // 1 mol/s of water from 300 K to 450 K, evaporating at 373.124 K (T_sat at 101.325 kPa,
  // IAPWS-IF97), against nitrogen, whose heat capacity flow exceeds the liquid's: the curves close
  // in up to T_sat and open along the flat segment, so the pinch is its start, C(T_sat, 0). The
  // Python script (the same cold curve, ΔT_min = 25 K, N2 at 5 mol/s from 480 K): Q = 17 537.9498 W,
  // T_ho = 360.33283 K, the water 29.400836 % evaporated; (ΔT_min = 150 K, 8 mol/s from 700 K):
  // Q = 48 242.7760 W, T_ho = 499.84378 K, the water out superheated at 426.94655 K, and
  // T_h − T_sat = 150 K at the start of the flat segment and 319.37303 K at its end.
  const feed = { id: 'water', name: 'feed water', flows: { H2O: 1 }, fromK: 300, targetK: 450, saturationK: 373.124, pressureBar: 1.01325 };
  const run = (approachK: number, hotInletK: number, nitrogen: number) => recuperate([{ id: 'hot', name: 'nitrogen', flows: { N2: nitrogen }, pressureBar: 1 }], hotInletK, [feed], approachK);

  it('stops inside the evaporation when the pinch is at its start', () => {
    const r = run(25, 480, 5);
    expect(r.limitedBy).toBe('minimum-approach');
    expect(r.dutyW).toBeCloseTo(17537.9498, 2);
    expect(r.hotOutletK).toBeCloseTo(360.33283, 4);
    expect(r.coldOutletK).toBe(373.124);
    expect(r.feeds[0]!.vapourFraction!).toBeCloseTo(0.29400836, 6);
    expect(r.feeds[0]!.flows['H2O(L)']! + r.feeds[0]!.flows.H2O!).toBeCloseTo(1, 12);
    expect(r.smallestApproachK).toBeCloseTo(25, 6);
  });

  it('checks both ends of the flat segment when the water leaves superheated', () => {
    const r = run(150, 700, 8);
    expect(r.dutyW).toBeCloseTo(48242.776, 2);
    expect(r.hotOutletK).toBeCloseTo(499.84378, 4);
    expect(r.coldOutletK).toBeCloseTo(426.94655, 4);
    expect(r.feeds[0]!.vapourFraction).toBe(1);
    const before = H_SAT(1, 373.124).liquid - H_SAT(1, 300).liquid;
    const after = H_SAT(1, 373.124).vapour - H_SAT(1, 300).liquid;
    expect(hotAt({ N2: 8 }, r.hotOutletK, 700, before) - 373.124).toBeCloseTo(150, 4);
    expect(hotAt({ N2: 8 }, r.hotOutletK, 700, after) - 373.124).toBeCloseTo(319.37303, 4);
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
