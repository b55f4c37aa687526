// The alkaline cell's electrolyte concentration (issue 17 item 3): the KOH mass fraction is an
// input with its unit, required for alkaline cells and refused elsewhere, within the range of the
// water-activity correlation it feeds (Balej, Int. J. Hydrogen Energy 10 (1985) 233-243:
// 2 to 18 mol/kg, i.e. 10.1 to 50.2 wt % with M_KOH = 56.1056 g/mol, and 0 to 200 °C; from memory).
import { describe, expect, it } from 'vitest';
import { loadBasisText } from '../../lib/basis/load.ts';
import { scaffoldText } from '../helpers/scaffold-basis.ts';
import type { Mode, TechnologyId } from '../../lib/electrochem/technologies.ts';

function load(technology: TechnologyId, mode: Mode, edits: Record<string, unknown>) {
  return loadBasisText(scaffoldText(technology, mode, 'test', edits), 'projects/test/basis.yaml', 'test');
}

function errors(result: ReturnType<typeof loadBasisText>): string[] {
  return result.ok ? [] : result.errors.map((e) => `${e.path}: ${e.message}`);
}

describe('cell.koh-mass-fraction', () => {
  it('"30 %" and 0.30 both read as a mass fraction of 0.30', () => {
    for (const value of ['30 %', 0.3]) {
      const result = load('alkaline', 'electrolysis', { 'cell.koh-mass-fraction': value });
      expect(errors(result)).toEqual([]);
      if (result.ok) expect(result.basis.cell.kohMassFraction).toBeCloseTo(0.3, 12);
    }
  });

  it('an alkaline cell without it is refused, naming the key and why it is needed', () => {
    const result = load('alkaline', 'power', { 'cell.koh-mass-fraction': undefined });
    expect(errors(result)).toEqual([
      'cell.koh-mass-fraction: an alkaline cell needs the KOH mass fraction of its electrolyte, e.g. koh-mass-fraction: "30 %", for the water activity (Balej 1985, 10.1 % to 50.2 %)',
    ]);
  });

  it('outside 10.1 % to 50.2 % (2 to 18 mol/kg) it is refused at the value', () => {
    for (const value of ['5 %', '55 %']) {
      expect(errors(load('alkaline', 'electrolysis', { 'cell.koh-mass-fraction': value }))).toEqual([
        `cell.koh-mass-fraction: the KOH mass fraction must lie within the range of Balej's water-activity correlation (1985), 10.1 % to 50.2 % (2 to 18 mol/kg), got ${value}`,
      ]);
    }
  });

  it('a temperature beyond the correlation (above 200 °C) is refused at the operating temperature', () => {
    const result = load('alkaline', 'electrolysis', { 'conditions.operating-temperature': '205 C', 'conditions.fuel-electrode-pressure': '30 bar', 'conditions.air-electrode-pressure': '30 bar' });
    expect(errors(result)).toContain("conditions.operating-temperature: an alkaline cell's water activity is known from 273.15 K (0 °C) to 473.15 K (200 °C) (Balej 1985), got 205 C");
  });

  it('another technology giving it is refused at the key', () => {
    expect(errors(load('pem', 'electrolysis', { 'cell.koh-mass-fraction': '30 %' }))).toEqual(['cell.koh-mass-fraction: koh-mass-fraction applies to alkaline cells only; this cell is pem']);
  });
});
