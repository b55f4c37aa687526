// Issue 17 item 5: the README and the document name what each number is. stackHeat_W is the
// isothermal heat (every inlet and outlet at the stack temperature; Larminie & Dicks, Fuel Cell
// Systems Explained, 2nd ed., §2.4: Q = I (V_tn − V) for a cell at T), not the heat with the
// streams at their own temperatures; and the carbon activity on the fuel path in the stack and
// at the pre-reformer outlet are two numbers at two temperatures, neither the maximum of the other.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { figureTables } from '../../lib/report/sections/results-tables.ts';
import { scaffoldCase } from '../helpers/scaffold-cases.ts';

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
