// The Arrhenius law of the area-specific resistance, ASR(T) = ASR_ref exp[(E_a/R)(1/T − 1/T_ref)]
// (the usual form for thermally activated conduction; e.g. R. O'Hayre et al., Fuel Cell
// Fundamentals, 3rd ed., ch. 4): how a basis states it, the refusals at its fields, and its use
// at the design point, in the stack-temperature sweep and in the temperature sensitivity, each
// checked against the exponential written out here. 1 eV per particle = 96 485.332 J/mol (2019 SI,
// e N_A exact).
import { describe, expect, it } from 'vitest';
import { loadBasisText } from '../../lib/basis/load.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { GAS_CONSTANT_J_PER_MOL_K as R } from '../../lib/thermo/constants.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';
import { parseDocument } from 'yaml';
import { renderScaffold } from '../../lib/basis/scaffolds.ts';

const EV = 96485.33212331001;
const arrhenius = (ea: number, t: number, ref: number) => Math.exp((ea / R) * (1 / t - 1 / ref));

/** The solid-oxide scaffold on humidified hydrogen with a resistance of 0.35 ohm cm2, edited. */
function sofc(edits: Record<string, unknown> = {}) {
  return basisFrom('solid-oxide', 'power', {
    'streams.fuel-electrode': { composition: { H2: 0.97, H2O: 0.03 }, 'pre-reforming': 'none' },
    'operating-point.target-power': undefined,
    'operating-point.cells': 100,
    'operating-point.cell-voltage': undefined,
    'operating-point.area-specific-resistance': '0.35 ohm cm2',
    ...edits,
  });
}

/** The loader's errors for the scaffold with `edits` (path → value), as "path: message". */
function errorsOf(edits: Record<string, unknown>): string[] {
  const doc = parseDocument(renderScaffold('solid-oxide', 'power', 'test', '2026-11-30'));
  for (const [path, value] of Object.entries(edits)) {
    if (value === undefined) doc.deleteIn(path.split('.'));
    else doc.setIn(path.split('.'), value);
  }
  const result = loadBasisText(doc.toString(), 'projects/test/basis.yaml', 'test');
  return result.ok ? [] : result.errors.map((e) => `${e.path}: ${e.message}`);
}

describe('stating the law in a basis', () => {
  it('reads the activation energy in eV or kJ/mol and defaults the reference to the operating temperature', () => {
    const b = sofc({ 'operating-point.resistance-temperature-law': { 'activation-energy': '0.8 eV', source: 'stack maker, test data' } });
    expect(b.operatingPoint.resistanceLaw!.activationEnergyJPerMol).toBeCloseTo(0.8 * EV, 9);
    expect(b.operatingPoint.resistanceLaw!.referenceTemperatureK).toBeUndefined();
    const k = sofc({ 'operating-point.resistance-temperature-law': { 'activation-energy': '77 kJ/mol', 'reference-temperature': '750 C', source: 'R1' }, references: [{ id: 'R1', citation: 'x' }] });
    expect(k.operatingPoint.resistanceLaw).toEqual({ activationEnergyJPerMol: 77000, referenceTemperatureK: 1023.15, source: 'R1' });
  });

  it('refuses a negative activation energy, one beyond the limit, a missing source, and a reference temperature beside a given cell voltage, each at its field', () => {
    const law = (over: Record<string, unknown>) => ({ 'operating-point.resistance-temperature-law': { 'activation-energy': '0.8 eV', source: 'data', ...over } });
    expect(errorsOf(law({ 'activation-energy': '-0.1 eV' }))).toEqual([
      'operating-point.resistance-temperature-law.activation-energy: the activation energy is 0 or more (a resistance that rises with temperature is not modelled), got -0.1 eV',
    ]);
    expect(errorsOf(law({ 'activation-energy': '900 kJ/mol' }))[0]).toMatch(/activation-energy: the activation energy 900 kJ\/mol is above 500 kJ\/mol/);
    expect(errorsOf(law({ 'activation-energy': '0.8 V' }))[0]).toMatch(/activation-energy: expected an activation energy such as "80 kJ\/mol" or "0\.8 eV", got "0\.8 V", which is a voltage/);
    expect(errorsOf({ 'operating-point.resistance-temperature-law': { 'activation-energy': '0.8 eV' } })).toEqual(['operating-point.resistance-temperature-law.source: this key is required but missing']);
    // The scaffold gives cell-voltage: the law then scales the resistance implied at the operating temperature.
    expect(errorsOf(law({ 'reference-temperature': '800 C' }))).toEqual([
      'operating-point.resistance-temperature-law.reference-temperature: with cell-voltage given the law scales the resistance implied at the operating temperature: omit reference-temperature (it applies to area-specific-resistance)',
    ]);
  });
});

describe('the law in the calculation', () => {
  const ea = 0.8 * EV;

  it('a resistance stated at another temperature is carried to the operating temperature by the exponential', () => {
    // 0.35 ohm cm2 at 750 °C, operated at 800 °C: the same as stating 0.35 × exp[(E_a/R)(1/1073.15 − 1/1023.15)] there.
    const withLaw = calculate(sofc({ 'operating-point.resistance-temperature-law': { 'activation-energy': '0.8 eV', 'reference-temperature': '750 C', source: 'data' } }));
    const scaled = 0.35 * arrhenius(ea, 1073.15, 1023.15);
    const direct = calculate(sofc({ 'operating-point.area-specific-resistance': `${scaled} ohm cm2` }));
    expect(withLaw.electrochemistry.areaSpecificResistance_ohm_m2).toBeCloseTo(scaled * 1e-4, 15);
    expect(withLaw.headline.cellVoltage_V).toBeCloseTo(direct.headline.cellVoltage_V, 12);
    expect(withLaw.electrochemistry.resistanceLaw).toEqual({ activationEnergy_J_per_mol: ea, referenceTemperature_K: 1023.15, source: 'data' });
  });

  it('the stack-temperature sweep follows ASR(T) = ASR(T_op) exp[(E_a/R)(1/T − 1/T_op)]; without a law it holds the resistance', () => {
    const r = calculate(sofc({ 'operating-point.resistance-temperature-law': { 'activation-energy': '0.8 eV', source: 'data' } }));
    const sweep = r.sweeps.stackTemperature;
    expect(sweep.length).toBe(7);
    for (const p of sweep) expect(p.areaSpecificResistance_ohm_m2 / (0.35e-4 * arrhenius(ea, p.temperature_K, 1073.15))).toBeCloseTo(1, 12);
    const held = calculate(sofc()).sweeps.stackTemperature;
    for (const p of held) expect(p.areaSpecificResistance_ohm_m2).toBe(0.35e-4);
    expect(calculate(sofc()).electrochemistry.resistanceLaw).toBeNull();
  });

  it('with the law a colder stack is less efficient; held constant, the resistance makes it look more efficient (the Nernst voltage rises as it cools)', () => {
    const entry = (r: ReturnType<typeof calculate>) => r.sensitivities.find((s) => s.input === 'operating temperature')!;
    const law = entry(calculate(sofc({ 'operating-point.resistance-temperature-law': { 'activation-energy': '0.8 eV', source: 'data' } })));
    expect(law.efficiency.low!).toBeLessThan(law.efficiency.base);
    expect(law.cellVoltage_V.low!).toBeLessThan(law.cellVoltage_V.base);
    const constant = entry(calculate(sofc()));
    expect(constant.efficiency.low!).toBeGreaterThan(constant.efficiency.base);
  });

  it('with a given cell voltage the law scales the resistance it implies at the operating temperature', () => {
    const r = calculate(
      basisFrom('solid-oxide', 'power', {
        'streams.fuel-electrode': { composition: { H2: 0.97, H2O: 0.03 }, 'pre-reforming': 'none' },
        'operating-point.resistance-temperature-law': { 'activation-energy': '0.8 eV', source: 'data' },
      }),
    );
    const implied = r.electrochemistry.areaSpecificResistance_ohm_m2;
    for (const p of r.sweeps.stackTemperature) expect(p.areaSpecificResistance_ohm_m2 / (implied * arrhenius(ea, p.temperature_K, r.conditions.temperature_K))).toBeCloseTo(1, 12);
  });
});
