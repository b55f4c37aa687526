// A cell that runs with liquid water is refused at or above water's boiling point at its lower
// electrode pressure, at the operating temperature's position (issue 17 item 1). Boiling points
// are IAPWS-IF97's saturation temperature (eq. 31), checked against the steam tables:
// T_s(101.325 kPa) = 99.974 °C (IAPWS-95, Wagner & Pruss 2002; the IF97 release gives the same to
// 1 mK; from memory), T_s(1.6 MPa) = 201.37 °C (Çengel & Boles, Thermodynamics, Table A-5; from
// memory). Before this check a PEM basis at 100 °C and 1 atm was accepted as liquid.
import { describe, expect, it } from 'vitest';
import { loadBasisText } from '../../lib/basis/load.ts';
import { formatDiagnostic } from '../../lib/basis/diagnostics.ts';
import { scaffoldText } from '../helpers/scaffold-basis.ts';
import type { Mode, TechnologyId } from '../../lib/electrochem/technologies.ts';

function load(technology: TechnologyId, mode: Mode, temperature: string, fuelPressure: string, airPressure: string) {
  const text = scaffoldText(technology, mode, 'test', {
    'conditions.operating-temperature': temperature,
    'conditions.fuel-electrode-pressure': fuelPressure,
    'conditions.air-electrode-pressure': airPressure,
  });
  return { text, result: loadBasisText(text, 'projects/test/basis.yaml', 'test') };
}

function boilingErrors(result: ReturnType<typeof loadBasisText>) {
  return result.ok ? [] : result.errors.filter((e) => e.message.includes('boils'));
}

describe('liquid-water cells below the boiling point (IAPWS-IF97 eq. 31)', () => {
  it('a PEM cell at 100 °C and 1 atm is refused at the operating temperature, file:line:col and field named', () => {
    const { text, result } = load('pem', 'power', '100 C', '1 atm', '1 atm');
    const errors = boilingErrors(result);
    expect(errors).toHaveLength(1);
    const e = errors[0]!;
    expect(e.path).toBe('conditions.operating-temperature');
    const line = text.split('\n').findIndex((l) => l.includes('operating-temperature:')) + 1;
    expect(e.line).toBe(line);
    expect(e.column).toBe(text.split('\n')[line - 1]!.indexOf('"100 C"') + 1);
    expect(formatDiagnostic(e)).toMatch(/^projects\/test\/basis\.yaml:\d+:\d+: conditions\.operating-temperature: water boils at 373\.12 K \(99\.97 °C\) at the fuel-electrode pressure, 1\.01325 bar/);
  });

  it('99.9 °C at 1 atm is below 99.974 °C and accepted; 99.98 °C is refused', () => {
    expect(boilingErrors(load('pem', 'power', '99.9 C', '1 atm', '1 atm').result)).toEqual([]);
    expect(boilingErrors(load('pem', 'power', '99.98 C', '1 atm', '1 atm').result)).toHaveLength(1);
  });

  it('the lower electrode pressure decides: a PEM electrolyser at 30 bar / 1.5 bar boils on the oxygen side at 111.35 °C', () => {
    // T_s(150 kPa) = 111.35 °C (Çengel & Boles, Table A-5; from memory).
    const errors = boilingErrors(load('pem', 'electrolysis', '112 C', '30 bar', '1.5 bar').result);
    expect(errors).toHaveLength(1);
    expect(errors[0]!.message).toContain('water boils at 384.5 K (111.35 °C) at the air-electrode pressure, 1.5 bar');
    expect(boilingErrors(load('pem', 'electrolysis', '111 C', '30 bar', '1.5 bar').result)).toEqual([]);
  });

  it('an alkaline electrolyser at 16 bar may run at 200 °C (T_s 201.37 °C) but not at 202 °C', () => {
    expect(boilingErrors(load('alkaline', 'electrolysis', '200 C', '16 bar', '16 bar').result)).toEqual([]);
    const errors = boilingErrors(load('alkaline', 'electrolysis', '202 C', '16 bar', '16 bar').result);
    expect(errors).toHaveLength(1);
    expect(errors[0]!.message).toContain('(201.38 °C)');
  });

  it('gas-phase cells are not concerned: a solid oxide cell at 800 °C and 1 atm has no boiling error', () => {
    expect(boilingErrors(load('solid-oxide', 'power', '800 C', '1 atm', '1 atm').result)).toEqual([]);
  });
});
