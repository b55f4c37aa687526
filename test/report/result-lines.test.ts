// Each worked line of section 6 must be redoable by hand: its formula, evaluated here on the
// numbers the line shows (line.inputs), gives the result the line states, and that result is the
// number of the results object. The formulas below are written out independently of lib/report.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { EquationBook } from '../../lib/report/equation-book.ts';
import { methodSection } from '../../lib/report/method.ts';
import { resultLines } from '../../lib/report/result-lines.ts';
import type { CalcLine } from '../../lib/report/calc-line.ts';
import { formatTrimmed } from '../../lib/report/format.ts';
import type { Results } from '../../lib/plant/results-schema.ts';
import { CASES, scaffoldCase } from '../helpers/scaffold-cases.ts';
import { loadBasisText } from '../../lib/basis/load.ts';
import { calculate } from '../../lib/plant/calculate.ts';

type Formula = (n: Record<string, number>) => number;

function nernst(n: Record<string, number>, r: Results): number {
  const p = (k: string) => n[k]!;
  const ion = r.technology.ion;
  const liquid = r.technology.waterPhase === 'liquid';
  if (r.fuelPath.nernstForm === 'oxygen-potential') {
    // The oxygen concentration cell (the zirconia sensor's relation), E = RT/4F ln(p_O2,a/p_O2,f),
    // and for carbonate + RT/2F ln(p_CO2,a/p_CO2,f).
    let e = ((n.R! * n.T!) / (4 * n.F!)) * Math.log(p('p_O2_a') / p('p_O2_f'));
    if (ion === 'carbonate') e += ((n.R! * n.T!) / (2 * n.F!)) * Math.log(p('p_CO2_a') / p('p_CO2_f'));
    return e;
  }
  let lnQ = Math.log(p('p_H2_f')) + 0.5 * Math.log(p('p_O2_a'));
  if (ion === 'oxide' && !liquid) lnQ -= Math.log(p('p_H2O_f'));
  if (ion === 'proton' && !liquid) lnQ -= Math.log(p('p_H2O_a'));
  if (ion === 'carbonate') lnQ += Math.log(p('p_CO2_a')) - Math.log(p('p_H2O_f')) - Math.log(p('p_CO2_f'));
  // Liquid-water cells: the water's activity p_H2O/p_w,sat at the electrode whose reaction forms it
  // (air for the proton, fuel for the hydroxide ion), 1 where the gas is saturated.
  if (liquid) lnQ += Math.log(p('p_wsat')) - Math.log(p(ion === 'proton' ? 'p_H2O_a' : 'p_H2O_f'));
  return n.E0! + ((n.R! * n.T!) / (2 * n.F!)) * lnQ;
}

function formulas(r: Results): Record<string, Formula> {
  const power = r.technology.mode === 'power';
  // A pure ionic conductor's lines leave out t_ion (it is 1) and the leakage; a power cell's carry ΔV_x.
  const t = (n: Record<string, number>) => n.t ?? 1;
  const dV = (n: Record<string, number>) => n.dV ?? 0;
  return {
    'standard-voltage': (n) => -(n.dH! - n.T! * n.dS!) / (2 * n.F!),
    'thermoneutral-voltage': (n) => -n.dH! / (2 * n.F!),
    'nernst-inlet': (n) => nernst(n, r),
    'nernst-outlet': (n) => nernst(n, r),
    'open-circuit': (n) => n.t! * n.Ein! - n.dV!,
    // The uniform-voltage cell: i(u) = (t E − ΔV_x − V)/ASR (power) or (V − t E)/ASR, the leakage
    // (1 − t) V/ASR carrying no ions; the mean ionic current density is the harmonic mean of the
    // local one, U/∫du/(t E − ΔV_x − t V) = j ASR + (1 − t) V (electrolysis: U/∫du/(t V − t E) =
    // j ASR − (1 − t) V), and averaging i over the area gives V = t Ē_A ∓ ΔV_x ∓ j ASR.
    // With an activation loss (t_ion = 1) the lines are written over the local ohmic loss: no V in it.
    'uniform-voltage': (n) => n.U! / (n.j! * n.ASR! + (power ? 1 : -1) * (1 - t(n)) * (n.V ?? 0)),
    // With an activation loss its area mean η̄_A adds to the losses (eta; 0 without).
    'cell-voltage': (n) =>
      r.electrochemistry.voltageSource === 'given'
        ? power
          ? (t(n) * n.EA! - n.dV! - (n.eta ?? 0) - n.V!) / n.j!
          : (n.V! - t(n) * n.EA! - (n.eta ?? 0)) / n.j!
        : power
          ? t(n) * n.EA! - n.dV! - (n.eta ?? 0) - n.j! * n.ASR!
          : t(n) * n.EA! + (n.eta ?? 0) + n.j! * n.ASR!,
    // The symmetric Butler–Volmer loss η = (b/ln 10) asinh(i/(2 i0)) (O'Hayre et al., Fuel Cell
    // Fundamentals, ch. 3, from memory); with it the hot spot's line puts i_max into the local
    // balance E − ΔV_x − η(i) − i ASR = V (electrolysis E + η(i) + i ASR = V) and gives V back.
    'activation-loss': (n) => (n.b! / Math.LN10) * Math.asinh(n.i! / (2 * n.i0!)),
    'hot-spot': (n) =>
      n.b !== undefined
        ? (power ? n.E! - dV(n) - (n.b / Math.LN10) * Math.asinh(n.i! / (2 * n.i0!)) - n.i! * n.ASR! : n.E! + (n.b / Math.LN10) * Math.asinh(n.i! / (2 * n.i0!)) + n.i! * n.ASR!)
        : power
          ? (t(n) * n.E! - dV(n) - n.V!) / n.ASR!
          : (n.V! - t(n) * n.E!) / n.ASR!,
    'ionic-current': (n) => n.N! * n.A! * (n.j! + (power ? 1 : -1) * ((1 - n.t!) * n.V!) / n.ASR!),
    'cell-current': (n) => n.j! * n.A!,
    cells: (n) =>
      n.P !== undefined ? Math.ceil(n.P / (n.V! * n.Icell! * (power ? n.eta! - n.f! : 1 / n.eta! + n.f!)) - 1e-9) : Math.ceil(n.m! / n.mc! - 1e-9),
    'stack-current': (n) => n.N! * n.Icell!,
    'stack-power': (n) => (n.V! * n.I!) / 1000,
    'net-power': (n) => n.P! * (n.eta! - n.f!),
    'stack-voltage': (n) => n.n! * n.V!,
    'bus-voltage': (n) => n.m! * n.Vs!,
    'bus-current': (n) => n.k! * n.Icell!,
    // Whole stacks: strings of stacks in series, n cells each (Kirchhoff's laws for the rest of the layout).
    'installed-cells': (n) => n.m! * n.k! * n.n!,
    'installed-cell-current': (n) => n.j! * n.A!,
    'dc-power': (n) => n.Vbus! * n.Ibus! / 1000,
    // The inverter delivers η P_DC; the rectifier draws P_DC / η (definition of the conversion efficiency).
    'ac-power': (n) => (power ? n.eta! * n.P! : n.P! / n.eta!),
    'steam-raising': (n) => n.n! * (n.hl! + n.L! + n.hg!),
    'steam-raising-air': (n) => n.n! * (n.hl! + n.L! + n.hg!),
    'compressor-power': (n) => n.n! * n.w!,
    'fuel-preheat': (n) => n.Hout! - n.Hin!,
    'air-preheat': (n) => n.Hout! - n.Hin!,
    'blower-power': (n) => (n.n! * n.hs!) / n.eta!,
    'oxidiser-enthalpy': (n) => n.Hog! + n.Hox!,
    // The cathode-gas loop's O2 row and total of its mole balance, and its adiabatic mixing
    // (the conservation of mass and the steady-flow energy balance; lib/plant/cathode-loop.ts).
    'cathode-loop-air': (n) => (n.Q! + n.D! - n.r! * (n.Q! - n.c!)) / n.y!,
    'cathode-loop-recycle': (n) => (n.N! - n.NB! + n.D! - n.A!) / (n.N! - n.ct!),
    'cathode-loop-mixing': (n) => n.HB! + n.Hr!,
    // kW over kg/h is kWh/kg.
    'system-specific-energy': (n) => (n.P! + n.Qe! + n.Pc!) / n.m!,
    'delivered-heat': (n) => n.R! - n.D! - n.L!,
    'chp-efficiency': (n) => (n.P! + n.Q!) / n.L!,
    'charge-basis': (n) => n.I! / n.U!,
    'fuel-flow': (n) => n.I! / (n.U! * n.F! * n.z!),
    hydrogen: (n) => n.I! / (2 * n.F!),
    oxygen: (n) => n.I! / (4 * n.F!),
    'air-flow': (n) => n.nO2! / (n.x! * n.U!),
    // Dalton's law for an ideal gas: the water's mole fraction is its partial pressure over the
    // total, φ p_s(T)/p for a relative humidity φ at T, p_s(T_d)/p at a dew point (φ = 1).
    'air-humidity': (n) => ((n.phi ?? 1) * n.ps!) / n.p!,
    'eff-electrical': (n) => n.P! / n.L!,
    'eff-voltage': (n) => (power ? n.V! / n.E! : n.E! / n.V!),
    'eff-carnot': (n) => 1 - n.T0! / n.T!,
    'specific-energy': (n) => n.P! / (n.n! * n.M!) / 3.6e6,
    'eff-electrolysis': (n) => n.Lp! / n.P!,
    // The reactions release V_tn,eff per ionic charge; the terminals take or give the work I V.
    'heat-voltage': (n) => {
      const ionic = n.Iion ?? n.I!;
      return (power ? ionic * n.Vtn! - n.I! * n.V! : n.I! * n.V! - ionic * n.Vtn!) / 1000;
    },
    'heat-balance': (n) => n.Hin! - n.Hout! + n.W!,
    // An air-cooled stack with its feeds as fed: Q_fed = Q − ΔH_fuel − ΔH_air, and the air that makes it zero,
    // ṅ = (Q − ΔH_fuel)/Δh_air (kW over kJ/mol is mol/s); lib/plant/stack-heat-balance.ts, checked
    // against an independent recomputation in test/plant/stack-heat-balance.test.ts.
    'heat-as-fed': (n) => n.Q! - n.dHf! - n.dHa!,
    'cooling-air': (n) => (n.Q! - n.dHf!) / n.dha!,
    'carbon-margin': (n) => n.sc! - Math.max(n.st!, n.pr ?? -Infinity),
  };
}

/** The number of the results object each line states. */
function resultOf(id: string, r: Results): number | null {
  const h = r.headline;
  const table: Record<string, number | null> = {
    'standard-voltage': r.electrochemistry.standardVoltage_V,
    'thermoneutral-voltage': r.electrochemistry.thermoneutralVoltage_V,
    'nernst-inlet': h.inletNernst_V,
    'nernst-outlet': h.outletNernst_V,
    'mean-nernst': h.meanNernst_V,
    'open-circuit': h.openCircuit_V,
    'cell-current': h.cellCurrent_A,
    cells: h.cells,
    'stack-current': h.totalCurrent_A,
    'stack-power': h.stackPower_W / 1000,
    'net-power': h.netPower_W / 1000,
    'charge-basis': r.electrochemistry.chargeBasis_A,
    'heat-voltage': h.stackHeat_W / 1000,
    'heat-balance': h.stackHeat_W / 1000,
    'heat-as-fed': r.heat.asFedHeat_W / 1000,
    'cooling-air': r.heat.coolingAir_mol_per_s,
    'eff-electrical': h.electricalEfficiencyLhv,
    'eff-voltage': r.efficiency.voltageEfficiency,
    'eff-carnot': r.efficiency.carnotLimit,
    'specific-energy': h.specificEnergy_kWh_per_kg,
    'eff-electrolysis': r.efficiency.electrolysisEfficiencyLhv,
    'carbon-margin': h.carbonMargin,
    'air-humidity': r.conditions.airHumidity?.waterFraction ?? null,
    'stack-voltage': r.plant.electrical.stackVoltage_V,
    'bus-voltage': r.plant.electrical.busVoltage_V,
    'bus-current': r.plant.electrical.busCurrent_A,
    'installed-cells': r.plant.electrical.installedCells,
    'installed-cell-current': r.plant.electrical.cellCurrent_A,
    'dc-power': r.plant.electrical.dcPower_W / 1000,
    'ac-power': r.plant.electrical.acPower_W / 1000,
    'steam-raising': r.plant.power?.steam ? (r.plant.power.steam.liquidHeating_W + r.plant.power.steam.evaporation_W + r.plant.power.steam.superheating_W) / 1000 : null,
    'delivered-heat': r.plant.power?.heatRecovery ? r.plant.power.heatRecovery.deliveredHeat_W / 1000 : null,
    'chp-efficiency': r.plant.power?.chp?.totalEfficiencyLhv ?? null,
    'compressor-power': r.plant.electrolysis?.compression ? r.plant.electrolysis.compression.power_W / 1000 : null,
    'system-specific-energy': r.plant.electrolysis?.specificEnergy.system_kWh_per_kg ?? null,
    'fuel-preheat': (r.plant.power?.duties.find((d) => d.id === 'fuel-preheat')?.duty_W ?? NaN) / 1000,
    'air-preheat': (r.plant.power?.duties.find((d) => d.id === 'air-preheat')?.duty_W ?? NaN) / 1000,
    'blower-power': r.plant.power?.blower ? r.plant.power.blower.power_W / 1000 : null,
  };
  const steam = r.plant.electrolysis?.steam.find((s) => (id === 'steam-raising' ? s.electrode === 'fuel' : id === 'steam-raising-air' && s.electrode === 'air'));
  if (steam) return (steam.liquidHeating_W + steam.evaporation_W + steam.superheating_W) / 1000;
  if (id === 'cell-voltage') return r.electrochemistry.voltageSource === 'given' ? r.electrochemistry.areaSpecificResistance_ohm_m2 * 1e4 : h.cellVoltage_V;
  if (id === 'uniform-voltage') return r.electrochemistry.harmonicIntegral_per_V;
  if (id === 'hot-spot') return r.electrochemistry.activationLoss ? h.cellVoltage_V : h.maxLocalCurrentDensity_A_per_m2 / 1e4;
  if (id === 'activation-loss') return r.electrochemistry.activationLoss!.atMeanCurrentDensity_V;
  if (id === 'ionic-current') return r.electrochemistry.ionicCurrent_A;
  return id in table ? table[id]! : null;
}

/** The line's formula, evaluated with the numbers the line shows, gives the line's result, and that is the results' number. */
function recomputes(c: ReturnType<typeof scaffoldCase>, f: Record<string, Formula>, id: string, line: CalcLine): void {
  const formula = f[id];
  expect(formula, `no formula for ${id}`).toBeDefined();
  const recomputed = formula!(line.inputs);
  // The products of a re-equilibrated fuel gas hold traces of dissociation products (H, OH near
  // 1e-8) that I/2F does not count: 1e-7 relative covers them; every other line is exact.
  const tolerance = id === 'hydrogen' && c.results.technology.fuelGasEquilibrium ? 1e-7 : 1e-9;
  expect(Math.abs(recomputed - line.value)).toBeLessThanOrEqual(tolerance * Math.max(1, Math.abs(line.value)));
  const stated = resultOf(id, c.results);
  if (stated !== null) expect(line.value).toBeCloseTo(stated, 9);
}

function lines(c: ReturnType<typeof scaffoldCase>): CalcLine[] {
  const book = new EquationBook();
  methodSection(c.results, book, 5);
  return resultLines(c.results, c.basis, book).flatMap((g) => g.lines);
}

/** The PEM scaffolds with an activation loss: the power cell at its given voltage, the electrolyser at a given resistance. */
const ACTIVATION = {
  power: (y: string) => y.replace(/^(  cell-voltage: "0\.68 V".*)$/m, '$1\n  activation-loss: { tafel-slope: "65 mV", exchange-current-density: "1e-5 A/cm2", source: "test" }'),
  electrolysis: (y: string) =>
    y.replace(/^  cell-voltage: "1\.90 V".*$/m, '  area-specific-resistance: "0.15 ohm cm2"\n  activation-loss: { tafel-slope: "50 mV", exchange-current-density: "1e-3 A/cm2", source: "test" }'),
};

describe.each([...CASES.map(([t, m]) => [t, m, ''] as const), ['pem', 'power', 'with an activation loss'] as const, ['pem', 'electrolysis', 'with an activation loss'] as const])('worked lines of the %s %s scaffold %s', (technology, mode, variant) => {
  const c = variant ? scaffoldCase(technology, mode, ACTIVATION[mode]) : scaffoldCase(technology, mode);
  const all = lines(c);
  const f = formulas(c.results);

  it('has the lines a review needs', () => {
    const ids = all.map((l) => l.id);
    for (const id of ['standard-voltage', 'mean-nernst', 'uniform-voltage', 'cell-voltage', 'hot-spot', 'cell-current', 'stack-current', 'stack-power', 'oxygen', 'heat-voltage', 'heat-balance', 'eff-voltage']) expect(ids).toContain(id);
    expect(ids.some((id) => id.startsWith('nernst-'))).toBe(true);
    expect(ids).toContain(mode === 'power' ? 'fuel-flow' : 'hydrogen');
    expect(ids.includes('activation-loss')).toBe(variant !== '');
    // The water of a humid-air feed, for the feeds of humid air only.
    expect(ids.includes('air-humidity')).toBe(c.basis.airElectrode?.compositionName === 'humid-air');
  });

  it.each(all.filter((l) => l.id !== 'mean-nernst').map((l) => [l.id, l] as const))('%s: the numbers shown give the result shown', (id, line) => recomputes(c, f, id, line));

  it('shows every input with the digits it has, and cites an equation of the method', () => {
    for (const line of all) {
      expect(line.equation.number).toBeGreaterThan(0);
      line.quantities.forEach((q, i) => {
        const value = Object.values(line.inputs)[i]!;
        expect(q.value.startsWith(formatTrimmed(value, 6))).toBe(true);
      });
    }
  });
});

it.each(CASES)('the Nernst lines of the %s %s scaffold put a multiplication sign between the partial pressures they substitute', (technology, mode) => {
  const nernst = lines(scaffoldCase(technology, mode)).filter((l) => l.id.startsWith('nernst-'));
  expect(nernst.length).toBeGreaterThan(0);
  for (const line of nernst) {
    // The LaTeX source KaTeX keeps in its MathML annotation; the substituted quotient follows the second \ln.
    const tex = /<annotation encoding="application\/x-tex">([^<]*)<\/annotation>/.exec(line.math.html)![1]!;
    const substituted = tex.split('\\ln ')[2]!;
    // (A liquid-water cell's quotient is bracketed with the water's activity: \left(…\right).)
    expect(substituted, line.id).toMatch(/^\\frac\{|^[\d{]|^\\left\(/);
    // A number (or a {number}^{1/2}) followed by another with only a thin space between: two pressures read as one.
    expect(substituted, `${line.id}: ${substituted}`).not.toMatch(/[\d}]\\,[\d{]/);
    if (Object.keys(line.inputs).filter((k) => k.startsWith('p_')).length > 1) expect(substituted, line.id).toContain('\\times');
  }
});

it('the inlet Nernst line uses the partial pressures of the first fuel-path point', () => {
  const c = scaffoldCase('solid-oxide', 'power');
  const line = lines(c).find((l) => l.id === 'nernst-inlet')!;
  const p0 = c.results.fuelPath.points[0]!;
  expect(line.inputs.p_H2_f).toBeCloseTo(p0.fuelSide.H2! * c.results.conditions.fuelPressure_bar, 12);
  expect(line.inputs.p_O2_a).toBeCloseTo(p0.airSide.O2! * c.results.conditions.airPressure_bar, 12);
  expect(line.inputs.E0).toBe(c.results.fuelPath.standardVoltage_V);
});

it('the dry fuel flow by Faraday equals the stream table: methane in the pre-reformer feed over its dry fraction', () => {
  const c = scaffoldCase('solid-oxide', 'power');
  const line = lines(c).find((l) => l.id === 'fuel-flow')!;
  const feed = c.results.streams.find((s) => s.id === 'fuel-feed')!;
  const x = c.basis.fuelElectrode!.composition.CH4!;
  expect(line.value).toBeCloseTo(feed.speciesFlows_mol_per_s.CH4! / x, 9);
});

it.each(CASES)('the integral of the uniform-voltage line of the %s %s scaffold is that of the fuel-path table', (technology, mode) => {
  // Recomputed from the table of the path alone: between two points E is taken linear in u, so the
  // ionic driving voltage y = a E + b is too, and ∫du/y = Δu ln(y2/y1)/(y2 − y1) exactly
  // (elementary calculus). The tool integrates its own model of E(u), linear between the same grid
  // points: the two agree to the rounding of the sums, 1e-9 relative.
  const c = scaffoldCase(technology, mode);
  const r = c.results;
  const line = lines(c).find((l) => l.id === 'uniform-voltage')!;
  const n = line.inputs;
  const t = n.t ?? 1;
  const power = r.technology.mode === 'power';
  const y = (e: number) => (power ? t * e - n.dV! - t * n.V! : t * n.V! - t * e);
  expect(r.fuelPath.inlet, 'a table that starts at u = 0').not.toBe('first-increment');
  let integral = 0;
  const p = r.fuelPath.points;
  for (let k = 1; k < p.length; k++) {
    const [y1, y2] = [y(p[k - 1]!.nernst_V), y(p[k]!.nernst_V)];
    const du = p[k]!.utilization - p[k - 1]!.utilization;
    integral += Math.abs(y2 - y1) < 1e-12 * y1 ? du / y1 : (du * Math.log(y2 / y1)) / (y2 - y1);
  }
  expect(Math.abs(integral / line.value - 1)).toBeLessThan(1e-9);
});

it('the hot-spot line takes the inlet Nernst voltage, where the local current density peaks', () => {
  const c = scaffoldCase('solid-oxide', 'power');
  const line = lines(c).find((l) => l.id === 'hot-spot')!;
  expect(line.inputs.E).toBe(c.results.headline.inletNernst_V);
  expect(line.value).toBeGreaterThan(c.results.operatingPoint.currentDensity_A_per_m2 / 1e4);
});

describe('a solid oxide cell on carbon monoxide and dioxide (no hydrogen)', () => {
  const coFed = (yaml: string) =>
    yaml
      .replace('composition: site-natural-gas ', 'composition: { CO: 0.7, CO2: 0.3 } ')
      .replace(/\n {4}steam-to-carbon: 2\.5 [^\n]*/, '')
      .replace(/pre-reforming: \{ kind: equilibrium, temperature: "480 C" \}/, 'pre-reforming: none');
  const c = scaffoldCase('solid-oxide', 'power', coFed);
  const all = lines(c);

  it('derives the oxygen-potential form and evaluates the Nernst lines with it', () => {
    expect(c.results.fuelPath.nernstForm).toBe('oxygen-potential');
    const book = new EquationBook();
    const steps = methodSection(c.results, book, 5);
    expect(book.has('nernst-oxygen')).toBe(true);
    const text = steps.flatMap((s) => s.blocks).flatMap((b) => (b.kind === 'paragraph' ? b.paragraph.map((p) => p.text ?? '') : [])).join(' ');
    expect(text).toMatch(/holds no hydrogen/);
    for (const id of ['nernst-inlet', 'nernst-outlet']) {
      const line = all.find((l) => l.id === id)!;
      expect(Object.keys(line.inputs).sort()).toEqual(['F', 'R', 'T', 'p_O2_a', 'p_O2_f']);
      // E = RT/4F ln(p_O2,a/p_O2,f), the zirconia oxygen-sensor relation; the fuel gas's p_O2 near 1e-19 bar.
      expect(line.inputs.p_O2_f).toBeLessThan(1e-15);
      const e = ((line.inputs.R! * line.inputs.T!) / (4 * line.inputs.F!)) * Math.log(line.inputs.p_O2_a! / line.inputs.p_O2_f!);
      expect(Math.abs(e - line.value)).toBeLessThan(1e-9);
      expect(line.value).toBe(id === 'nernst-inlet' ? c.results.headline.inletNernst_V : c.results.headline.outletNernst_V);
    }
  });
});

/** The plant options the electrolysis scaffolds carry commented out, switched on. */
const withPlant = (yaml: string) =>
  yaml.replace(/^# plant:/m, 'plant:').replace(/^# {3}(feed-temperatures|heat-supply|heat-loss|hydrogen-compression|air-blower|off-gas-oxidiser|heat-recovery)/gm, '  $1');

describe.each(['solid-oxide', 'molten-carbonate'] as const)('worked lines of the %s power plant', (technology) => {
  const c = scaffoldCase(technology, 'power', withPlant);
  const plant = lines(c).filter((l) => ['fuel-preheat', 'air-preheat', 'blower-power', 'oxidiser-enthalpy', 'steam-raising'].includes(l.id));
  const f = formulas(c.results);

  it('shows the fuel and air preheat, the blower power and the oxidiser balance', () => {
    expect(plant.map((l) => l.id).sort()).toEqual(['air-preheat', 'blower-power', 'fuel-preheat', 'oxidiser-enthalpy', 'steam-raising']);
  });

  it.each(plant.map((l) => [l.id, l] as const))('%s: the numbers shown give the result shown', (id, line) => recomputes(c, f, id, line));
});

describe('worked lines of the molten carbonate scaffold with its cathode gas made by a cathode-gas loop', () => {
  const loop = (y: string) => y.replace(/^ {4}composition: cathode-gas .*$/m, '    cathode-loop: { burner-air: { composition: dry-air }, inlet-oxygen: "9.4 %" }');
  const c = scaffoldCase('molten-carbonate', 'power', loop);
  const ids = ['cathode-loop-air', 'cathode-loop-recycle', 'cathode-loop-mixing'];
  const plant = lines(c).filter((l) => ids.includes(l.id));
  const f = formulas(c.results);

  it('shows the burner air, the recycled share and the mixing, and the air-electrode feed at the inlet O2 fraction', () => {
    expect(plant.map((l) => l.id)).toEqual(ids);
    expect(lines(c).find((l) => l.id === 'air-flow')!.inputs.x).toBeCloseTo(0.094, 12);
  });

  it.each(plant.map((l) => [l.id, l] as const))('%s: the numbers shown give the result shown', (id, line) => recomputes(c, f, id, line));

  it("with humid burner air, the water line is the burner air's (80 % at 10 °C over the standard atmosphere), and the cathode gas carries more water", () => {
    const humid = (y: string) => y.replace(/^ {4}composition: cathode-gas .*$/m, '    cathode-loop: { burner-air: { composition: humid-air, humidity: { relative-humidity: "80 %", at: "10 C" } }, inlet-oxygen: "9.4 %" }');
    const h = scaffoldCase('molten-carbonate', 'power', humid);
    const line = lines(h).find((l) => l.id === 'air-humidity')!;
    expect(line.title).toBe("Water in the cathode-gas loop's burner air");
    expect(line.quantities.map((q) => q.origin).join(' | ')).toContain('streams.air-electrode.cathode-loop.burner-air.humidity');
    // p_s(10 °C) = 1.2282 kPa (IAPWS-95 steam tables; from memory), to half a unit of its last digit
    // plus IF97's 0.025 % from IAPWS-95 (from memory): 0.36 Pa; on x, 0.8 × 0.36/101 325 = 2.9e-6.
    expect(Math.abs(line.value - (0.8 * 1228.2) / 101325)).toBeLessThan(2.9e-6);
    recomputes(h, formulas(h.results), line.id, line);
    expect(lines(h).find((l) => l.id === 'air-flow')!.quantities.map((q) => q.origin)).toContain("air-electrode feed: the cathode-gas loop's inlet, its O2 fraction held at the design input (the loop's mole balance, plant section)");
    // Conservation of mass: the loop removes no water, so the burner air's water reaches the cathode gas.
    const water = (k: typeof c) => k.results.streams.find((s) => s.id === 'air-inlet')!.moleFractions.H2O!;
    expect(water(h)).toBeGreaterThan(water(c));
  });
});

describe.each(['solid-oxide', 'pem'] as const)('worked lines of the %s electrolysis plant', (technology) => {
  const c = scaffoldCase(technology, 'electrolysis', withPlant);
  const plant = lines(c).filter((l) => ['steam-raising', 'compressor-power', 'system-specific-energy'].includes(l.id));
  const f = formulas(c.results);

  it('shows the compressor power and the electricity per kg of the whole plant, and the steam raised where steam is fed', () => {
    const ids = plant.map((l) => l.id);
    expect(ids).toContain('compressor-power');
    expect(ids).toContain('system-specific-energy');
    expect(ids.includes('steam-raising')).toBe(technology === 'solid-oxide');
  });

  it.each(plant.map((l) => [l.id, l] as const))('%s: the numbers shown give the result shown', (id, line) => recomputes(c, f, id, line));
});

it('the Nernst lines of a PEM cell put in the water vapour the water balance gives: below saturation at the humid-air inlet, saturated at the outlet (issue 17 item 2)', () => {
  // The PEM power scaffold feeds dry hydrogen and air of 60 °C dew point into a 70 °C cell at
  // 1.5 bar: at the inlet no water has formed, so the gases are drier than saturated; at the outlet
  // liquid water is left. p_w,sat at 70 °C: 31.20 kPa (IAPWS-IF97; steam tables, e.g. Çengel and
  // Boles, Table A-4, 31.202 kPa; from memory), to the 4 digits quoted: 1e-4 bar.
  const c = scaffoldCase('pem', 'power');
  const byId = new Map(lines(c).map((l) => [l.id, l]));
  const inlet = byId.get('nernst-inlet')!;
  const outlet = byId.get('nernst-outlet')!;
  for (const line of [inlet, outlet]) expect(Math.abs(line.inputs.p_wsat! - 0.31202)).toBeLessThan(1e-4);
  const points = c.results.fuelPath.points;
  const p = c.results.conditions.airPressure_bar;
  expect(inlet.inputs.p_H2O_a).toBe(points[0]!.airSide.H2O! * p);
  expect(inlet.inputs.p_H2O_a!).toBeLessThan(0.6 * inlet.inputs.p_wsat!);
  expect(outlet.inputs.p_H2O_a).toBe(points[points.length - 1]!.airSide.H2O! * p);
  expect(outlet.inputs.p_H2O_a! / outlet.inputs.p_wsat!).toBeCloseTo(1, 12);
  // The quantity list says where the water's pressure comes from.
  expect(inlet.quantities.some((q) => q.origin.includes('vapour mole fraction of the water balance at this point'))).toBe(true);
});

// The fuel path's u is the utilization (or conversion) reached, the share of the feed's charge Q₁
// passed, so the outlet is at u = U_f and carries U_f Q₁ = I (Faraday's law, methods note); the
// method must not call u "a fraction of the fuel utilization", which would put the outlet at u = 1.
describe.each([
  ['solid-oxide', 'power'],
  ['pem', 'electrolysis'],
] as const)('the fuel path of the %s %s method', (technology, mode) => {
  it('defines u as the utilization reached, the outlet at u = U_f', () => {
    const c = scaffoldCase(technology, mode);
    const points = c.results.fuelPath.points;
    expect(points[points.length - 1]!.utilization).toBeCloseTo(c.results.electrochemistry.utilization, 12);
    expect(c.results.electrochemistry.utilization * c.results.electrochemistry.chargeBasis_A).toBeCloseTo(c.results.electrochemistry.ionicCurrent_A, 6);
    const step = methodSection(c.results, new EquationBook(), 5).find((s) => s.id === 'method-path')!;
    const text = step.blocks.flatMap((b) => (b.kind === 'paragraph' ? b.paragraph.map((p) => p.text ?? p.math.html) : [])).join(' ');
    expect(text).not.toMatch(/fraction/);
    expect(text).toMatch(/has reached/);
    expect(text).toMatch(mode === 'power' ? /u = U_\\mathrm\{f\}/ : /u = X/);
  });
});

describe('the water of a humid-air feed', () => {
  const waterLine = (c: ReturnType<typeof scaffoldCase>) => lines(c).find((l) => l.id === 'air-humidity')!;
  const airInlet = (c: ReturnType<typeof scaffoldCase>) => c.results.streams.find((s) => s.id === 'air-inlet')!.moleFractions.H2O!;

  it('at a dew point: p_s(T_d) over the air-electrode pressure, the water of the air-inlet stream (the PEM scaffold, 60 °C at 1.5 bar)', () => {
    const c = scaffoldCase('pem', 'power');
    const line = waterLine(c);
    // p_s(60 °C) = 19.946 kPa (IAPWS-95 steam tables, Wagner and Pruss 2002; Çengel and Boles, Table A-4, 19.947 kPa; from memory):
    // half a unit in the last printed digit plus IF97's 0.025 % from IAPWS-95 (from memory), 0.0055 kPa.
    expect(Math.abs(line.inputs.ps! / 1000 - 19.946)).toBeLessThan(0.0055);
    expect(line.inputs.phi).toBeUndefined();
    expect(line.inputs.p).toBe(150000);
    expect(line.quantities.map((q) => q.origin).join(' | ')).toMatch(/the dew point, 333\.15 K \(60\.0 °C\).*\| air-electrode pressure/);
    expect(line.value).toBeCloseTo(airInlet(c), 12);
    // 19.946/150 = 0.13297: 13.30 % to the four digits a percentage shows.
    expect(line.result).toBe('13.30 %');
  });

  it('at a relative humidity: φ p_s(T) over the ambient pressure, the standard atmosphere where the basis gives none (the proton-ceramic scaffold, 60 % at 25 °C)', () => {
    const c = scaffoldCase('proton-ceramic', 'power');
    const line = waterLine(c);
    // p_s(25 °C) = 3.1699 kPa (IAPWS-95 steam tables; from memory), to the same tolerance as above, 0.0009 kPa.
    expect(Math.abs(line.inputs.ps! / 1000 - 3.1699)).toBeLessThan(0.0009);
    expect(line.inputs.phi).toBeCloseTo(0.6, 12);
    // The standard atmosphere, 101 325 Pa (ISO 2533:1975), not the air electrode's pressure.
    expect(line.inputs.p).toBeCloseTo(101325, 6);
    expect(c.results.conditions.airPressure_bar * 1e5).not.toBeCloseTo(101325, 0);
    expect(line.quantities.find((q) => q.value.endsWith('Pa') && q.origin.startsWith('ambient'))!.origin).toContain('not given, the standard atmosphere');
    expect(line.value).toBeCloseTo(airInlet(c), 12);
  });

  it("Thistlemere's 1.178 % by hand: 0.70 × p_s(15 °C) / 101 325 Pa, p_s(15 °C) = 1705.8 Pa", () => {
    // The CHP demo states 70 % at 15 °C and the standard atmosphere as its ambient pressure (R5).
    // p_s(15 °C) = 1.7058 kPa (IAPWS-95 steam tables; from memory); IF97 gives 1705.74 Pa (an
    // independent evaluation of IAPWS R7-97 eq. 30 outside the project). Tolerance: half a unit
    // in the printed 1.7058 kPa plus IF97's 0.025 % from IAPWS-95, 0.48 Pa; on x that is 0.7 ×
    // 0.48/101 325 = 3.3e-6, plus half a unit of the 4th decimal of the percentage.
    const loaded = loadBasisText(readFileSync(new URL('../../projects/thistlemere-sofc-chp/basis.yaml', import.meta.url), 'utf8'), 'projects/thistlemere-sofc-chp/basis.yaml', 'thistlemere-sofc-chp');
    if (!loaded.ok) throw new Error(loaded.errors.map((e) => e.message).join('; '));
    const c = { name: 'thistlemere', basis: loaded.basis, results: calculate(loaded.basis) };
    const line = waterLine(c);
    expect(line.inputs.phi).toBeCloseTo(0.7, 12);
    expect(Math.abs(line.inputs.ps! - 1705.8)).toBeLessThan(0.48);
    expect(line.inputs.p).toBeCloseTo(101325, 6);
    const hand = (0.7 * 1705.8) / 101325;
    expect(Math.abs(line.value - hand)).toBeLessThan(3.3e-6);
    expect(Math.abs(line.value * 100 - 1.1784)).toBeLessThan(0.00005 + 3.3e-4);
    expect(line.result).toBe('1.178 %');
    expect(line.quantities.find((q) => q.origin.startsWith('ambient'))!.origin).toBe('ambient pressure (conditions.ambient-pressure), design input: a relative humidity is that of the ambient air');
    expect(line.value).toBeCloseTo(airInlet(c), 12);
  });
});
