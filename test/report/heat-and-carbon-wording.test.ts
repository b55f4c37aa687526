// Issue 17 item 5: the README and the document name what each number is. stackHeat_W is the
// isothermal heat (every inlet and outlet at the stack temperature; Larminie & Dicks, Fuel Cell
// Systems Explained, 2nd ed., §2.4: Q = I (V_tn − V) for a cell at T), not the heat with the
// streams at their own temperatures; and the carbon activity on the fuel path in the stack and
// at the pre-reformer outlet are two numbers at two temperatures, neither the maximum of the other.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { figureTables } from '../../lib/report/sections/results-tables.ts';
import { scaffoldCase } from '../helpers/scaffold-cases.ts';
import { EquationBook } from '../../lib/report/equation-book.ts';
import { methodSection } from '../../lib/report/method.ts';
import { resultLines } from '../../lib/report/result-lines.ts';

const README = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');

describe('heat and carbon wording', () => {
  it('README: stackHeat_W is the isothermal heat, equal to heat.isothermalHeat_W and not the heat as fed', () => {
    const row = README.split('\n').find((l) => l.startsWith('| `stackHeat_W` |'))!;
    expect(row).toMatch(/isothermal/);
    expect(row).toMatch(/every inlet and outlet at the stack temperature/);
    expect(row).not.toMatch(/every stream at its temperature/);
    // A solid oxide stack fed below its temperature: the two heats differ, and the headline is the isothermal one.
    const r = scaffoldCase('solid-oxide', 'power').results;
    expect(r.headline.stackHeat_W).toBe(r.heat.isothermalHeat_W);
    expect(Math.abs(r.heat.asFedHeat_W - r.heat.isothermalHeat_W)).toBeGreaterThan(1);
  });

  it('README and the carbon table name the fuel path in the stack and the pre-reformer outlet each with its temperature', () => {
    const row = README.split('\n').find((l) => l.includes('`maxCarbonActivity`'))!;
    expect(row).toMatch(/fuel path in the stack at the stack temperature/);
    expect(row).toMatch(/pre-reformer outlet's is `carbon\.preReformerCarbonActivity`/);
    const r = scaffoldCase('solid-oxide', 'power').results;
    expect(r.carbon.preReformerCarbonActivity).not.toBeNull();
    const rows = JSON.stringify(figureTables(r).find((t) => t.title.toLowerCase().includes('carbon')));
    expect(rows).toContain('Highest carbon activity on the fuel path in the stack, at the stack temperature (the pre-reformer not included)');
    expect(rows).toContain('Carbon activity at the pre-reformer outlet, at the pre-reformer temperature (before the stack; not on the fuel path)');
  });
});

// In electrolysis the reactions absorb enthalpy: splitting liquid water takes ΔH = +285.83 kJ/mol
// at 25 °C (NIST-JANAF, ΔfH° of H2O(l)), so V_tn,eff = (H_out − H_in)/I is what they absorb per
// charge and Q = I (V − V_tn,eff) the electric work less it; in power mode they release it. The
// worked line and the method must say which, not "released" for both.
describe('the effective thermoneutral voltage says whether the reactions release or absorb', () => {
  const heatVoltage = (technology: 'pem' | 'proton-ceramic' | 'solid-oxide', mode: 'power' | 'electrolysis') => {
    const c = scaffoldCase(technology, mode);
    const book = new EquationBook();
    const steps = methodSection(c.results, book, 5);
    const line = resultLines(c.results, c.basis, book).flatMap((g) => g.lines).find((l) => l.id === 'heat-voltage')!;
    const method = JSON.stringify(steps.find((s) => s.id === 'method-heat')!.blocks);
    const r = c.results;
    return { r, origins: line.quantities.map((q) => q.origin).join(' | '), method };
  };

  it.each([
    ['pem', 'electrolysis'],
    ['proton-ceramic', 'electrolysis'],
  ] as const)('%s %s: absorbed, and H_out − H_in > 0 is I_ion V_tn,eff', (technology, mode) => {
    const { r, origins, method } = heatVoltage(technology, mode);
    const absorbed = r.heat.outletEnthalpy_W - r.heat.inletEnthalpyIsothermal_W;
    expect(absorbed).toBeGreaterThan(0);
    expect(r.electrochemistry.ionicCurrent_A * r.electrochemistry.effectiveThermoneutralVoltage_V).toBeCloseTo(absorbed, 3);
    expect(origins).toMatch(/enthalpy absorbed by the reactions/);
    expect(origins).not.toMatch(/released/);
    expect(method).toMatch(/enthalpy (the reactions|they) absorb/);
    expect(method).not.toMatch(/enthalpy (the reactions|they) release/);
  });

  it('solid-oxide power: released, H_in − H_out > 0', () => {
    const { r, origins, method } = heatVoltage('solid-oxide', 'power');
    expect(r.heat.inletEnthalpyIsothermal_W - r.heat.outletEnthalpy_W).toBeGreaterThan(0);
    expect(origins).toMatch(/enthalpy released by the reactions/);
    expect(method).toMatch(/enthalpy the reactions release/);
  });
});
