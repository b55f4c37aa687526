// The validated DesignBasis: SI conversion, defaults, steam addition, inputs in file order,
// what each technology and mode hands to the calculation, and the loader API.
import { mkdirSync, mkdtempSync, readFileSync, truncateSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadBasisFile, loadBasisText, type LoadResult } from '../../lib/basis/load.ts';
import { BasisError, formatDiagnostic } from '../../lib/basis/diagnostics.ts';
import { MAX_BASIS_BYTES } from '../../lib/basis/source-text.ts';
import { DEFAULT_SENSITIVITY } from '../../lib/basis/read-sensitivity.ts';
import { UserError } from '../../lib/core/errors.ts';
import type { DesignBasis } from '../../lib/basis/types.ts';
import { BASE, edit } from '../helpers/basis-text.ts';

const FILE = 'projects/t/basis.yaml';

function valid(text: string | Uint8Array): { basis: DesignBasis; warnings: string[] } {
  const result: LoadResult = loadBasisText(text, FILE, 't');
  if (!result.ok) throw new Error(result.errors.map(formatDiagnostic).join('\n'));
  return { basis: result.basis, warnings: result.warnings.map(formatDiagnostic) };
}

describe('the base fixture', () => {
  const { basis, warnings } = valid(BASE);

  it('loads without warnings, in SI', () => {
    expect(warnings).toEqual([]);
    expect(basis.id).toBe('t');
    expect(basis.file).toBe(FILE);
    expect(basis.conditions.temperatureK).toBeCloseTo(1073.15, 10);
    expect(basis.conditions.fuelPressureBar).toBeCloseTo(1.2, 12);
    expect(basis.operatingPoint.currentDensityAPerM2).toBeCloseTo(4000, 9);
    expect(basis.operatingPoint.activeAreaM2).toBeCloseTo(0.01, 12);
    expect(basis.operatingPoint.voltage).toEqual({ kind: 'given', cellVoltageV: 0.8 });
    expect(basis.operatingPoint.size).toEqual({ kind: 'cells', cells: 1200 });
    expect(basis.operatingPoint.air).toEqual({ kind: 'utilization', value: 0.25 });
  });

  it('fills the documented defaults', () => {
    expect(basis.document.paper).toBe('A4');
    expect(basis.cell).toMatchObject({ nickelBearing: true, nickelBearingFrom: 'material text', ionicTransferenceNumber: 1, crossoverAllowanceV: 0 });
    expect(basis.conditions).toMatchObject({ fuelInletTemperatureK: 1073.15, airInletTemperatureK: 1073.15, allowedAirTemperatureRiseK: 100, ambientTemperatureK: 298.15 });
    // 150 K either side of 1073.15 K: inside the 200-6000 K of every species fed.
    expect(basis.conditions.sweepFromK).toBeCloseTo(923.15, 9);
    expect(basis.conditions.sweepToK).toBeCloseTo(1223.15, 9);
    expect(basis.operatingPoint.parasiticFraction).toBe(0);
    expect(basis.sensitivity).toEqual(DEFAULT_SENSITIVITY);
    expect(basis.fuelElectrode?.preReforming).toEqual({ kind: 'none' });
  });

  it('adds steam by steam-to-carbon on combustible carbon (worked by hand)', () => {
    // carbon = 0.93 + 2·0.04 + 3·0.01 = 1.04 mol/mol (CO2 excluded); steam = 2.5 · 1.04 = 2.6 mol/mol
    const feed = basis.fuelElectrode!.feed;
    expect(basis.fuelElectrode!.steamToCarbon).toBe(2.5);
    expect(feed.H2O).toBeCloseTo(2.6 / 3.6, 12);
    expect(feed.CH4).toBeCloseTo(0.93 / 3.6, 12);
    expect(feed.CO2).toBeCloseTo(0.01 / 3.6, 12);
    expect(Object.values(feed).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    expect(basis.fuelElectrode!.composition).toEqual({ CH4: 0.93, C2H6: 0.04, C3H8: 0.01, CO2: 0.01, N2: 0.01 });
    expect(basis.fuelElectrode!.compositionName).toBe('site-gas');
  });

  it('records every input in file order, with its source', () => {
    const paths = basis.inputs.map((i) => i.path);
    expect(paths).toEqual([
      'conditions.operating-temperature',
      'conditions.fuel-electrode-pressure',
      'conditions.air-electrode-pressure',
      'mixtures.site-gas.composition.CH4',
      'mixtures.site-gas.composition.C2H6',
      'mixtures.site-gas.composition.C3H8',
      'mixtures.site-gas.composition.CO2',
      'mixtures.site-gas.composition.N2',
      'streams.fuel-electrode.steam-to-carbon',
      'streams.air-electrode.humidity.dew-point',
      'operating-point.fuel-utilization',
      'operating-point.air-utilization',
      'operating-point.current-density',
      'operating-point.cell-voltage',
      'operating-point.active-area',
      'operating-point.cells',
    ]);
    expect(basis.inputs[1]).toEqual({ path: 'conditions.fuel-electrode-pressure', label: 'fuel-electrode pressure', text: '1.2 bar', unit: 'bar', si: 120000, siUnit: 'Pa', line: expect.any(Number), column: expect.any(Number) });
    // Each input carries the position of its value, the same the position map gives.
    for (const input of basis.inputs) {
      expect(basis.positions[`${input.path}.value`] ?? basis.positions[input.path], input.path).toEqual({ line: input.line, column: input.column });
    }
    expect(basis.inputs[3]!.source).toBe('R1');
    expect(basis.inputs[12]).toMatchObject({ text: '0.4 A/cm2', unit: 'A/cm2', si: 4000, siUnit: 'A/m2' });
  });

  it('keeps assumptions and references', () => {
    expect(basis.assumptions).toEqual([{ id: 'A1', text: 'Isothermal stack.', open: true, reference: 'R1', concerns: [] }]);
    expect(basis.references).toEqual([{ id: 'R1', citation: 'Invented gas analysis for tests' }]);
  });
});

describe('written forms', () => {
  it('a value with its source: { value, source }', () => {
    const { basis } = valid(edit(BASE, ['operating-temperature: "800 C"', 'operating-temperature: { value: "1073.15 K", source: R1 }']));
    expect(basis.conditions.temperatureK).toBe(1073.15);
    expect(basis.inputs[0]).toMatchObject({ path: 'conditions.operating-temperature', text: '1073.15 K', source: 'R1' });
  });

  it('a block with one source (the resistance law) gives it to each of its values in the inputs table', () => {
    const text = readFileSync(new URL('../../projects/thistlemere-sofc-chp/basis.yaml', import.meta.url), 'utf8');
    expect(text).toContain('resistance-temperature-law: { activation-energy: "0.65 eV", reference-temperature: "750 C", source: R3 }');
    const { basis } = valid(text);
    const law = basis.inputs.filter((i) => i.path.startsWith('operating-point.resistance-temperature-law.'));
    expect(law.map((i) => i.path)).toEqual(['operating-point.resistance-temperature-law.activation-energy', 'operating-point.resistance-temperature-law.reference-temperature']);
    for (const i of law) expect(i.source).toBe('R3');
  });

  it('a gauge pressure is referred to 1 atm (NIST SP 811: atm = 101 325 Pa)', () => {
    const { basis } = valid(edit(BASE, ['fuel-electrode-pressure: "1.2 bar"', 'fuel-electrode-pressure: "0.2 barg"']));
    expect(basis.conditions.fuelPressureBar).toBeCloseTo(1.21325, 12);
  });

  it('a composition summing to 1.003 is normalised, with a warning', () => {
    const { basis, warnings } = valid(edit(BASE, ['CH4: 0.93,', 'CH4: 0.933,']));
    expect(warnings).toEqual([`${FILE}:23:40: warning: mixtures.site-gas.composition: the mole fractions sum to 1.003; normalised to 1`]);
    expect(basis.fuelElectrode!.composition.CH4).toBeCloseTo(0.933 / 1.003, 12);
    expect(Object.values(basis.fuelElectrode!.composition).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  });

  it('fractions as "x %" and species aliases (H2O(g) for H2O)', () => {
    const { basis } = valid(edit(BASE, ['composition: site-gas', 'composition: { H2: "97 %", "H2O(g)": "3 %" }'], ['    steam-to-carbon: 2.5\n', '']));
    expect(basis.fuelElectrode!.composition).toEqual({ H2: 0.97, H2O: 0.03 });
  });

  it('a byte order mark and CRLF line ends are accepted', () => {
    const crlf = `\uFEFF${BASE.replace(/\n/g, '\r\n')}`;
    expect(valid(Buffer.from(crlf, 'utf8')).basis).toEqual(valid(BASE).basis);
  });

  it('phosphoric-acid is read as ht-pem', () => {
    const text = edit(BASE, ['technology: solid-oxide', 'technology: phosphoric-acid'], ['operating-temperature: "800 C"', 'operating-temperature: "160 C"'], ['composition: site-gas', 'composition: hydrogen'], ['    steam-to-carbon: 2.5\n', '']);
    const { basis, warnings } = valid(text);
    expect(basis.cell.technology).toBe('ht-pem');
    expect(warnings).toEqual([`${FILE}:23:3: warning: mixtures.site-gas: mixture site-gas is defined but no stream uses it`]);
  });

  it('cells and a target are both kept: the target sizes the stack, the cells are stated', () => {
    const { basis } = valid(edit(BASE, ['  cells: 1200\n', '  cells: 1200\n  target-power: "36 kW"\n']));
    expect(basis.operatingPoint.size).toEqual({ kind: 'power', powerW: 36000 });
    expect(basis.operatingPoint.statedCells).toBe(1200);
  });

  it('nickel-bearing stated overrides the material text', () => {
    const { basis } = valid(edit(BASE, ['  fuel-electrode: Ni-YSZ cermet\n', '  fuel-electrode: Ni-YSZ cermet\n  nickel-bearing: false\n']));
    expect(basis.cell).toMatchObject({ nickelBearing: false, nickelBearingFrom: 'stated' });
  });

  it('a fuel electrode without nickel in its text', () => {
    const { basis } = valid(edit(BASE, ['fuel-electrode: Ni-YSZ cermet', 'fuel-electrode: LSCM perovskite']));
    expect(basis.cell).toMatchObject({ nickelBearing: false, nickelBearingFrom: 'material text' });
  });
});

describe('warnings', () => {
  it('a low-temperature cell fed methane: only H2 reacts', () => {
    const text = edit(BASE, ['technology: solid-oxide', 'technology: pem'], ['operating-temperature: "800 C"', 'operating-temperature: "70 C"'], ['composition: site-gas', 'composition: { H2: 0.9, CH4: 0.05, CO: 0.05 }'], ['    steam-to-carbon: 2.5\n', '']);
    const { warnings } = valid(text);
    expect(warnings).toEqual([
      `${FILE}:23:3: warning: mixtures.site-gas: mixture site-gas is defined but no stream uses it`,
      `${FILE}:26:18: warning: streams.fuel-electrode.composition: pem cells react only H2: CH4 and CO pass through unreacted (CO poisons the catalyst, see the hazards section)`,
    ]);
  });

  it('an operating temperature outside the typical range', () => {
    const { warnings } = valid(edit(BASE, ['operating-temperature: "800 C"', 'operating-temperature: "1050 C"']));
    expect(warnings).toEqual([`${FILE}:19:26: warning: conditions.operating-temperature: 1050 C is outside the typical range of solid-oxide cells, 873.15 K (600 °C) to 1273.15 K (1000 °C) (common practice, no source)`]);
  });
});

describe('document control', () => {
  it('warns when the sign-off dates run backwards', () => {
    const text = edit(BASE, ['    prepared: { name: T. Tester, date: 2026-11-20 }\n', '    prepared: { name: T. Tester, date: 2026-11-20 }\n    checked: { name: C. Checker, date: 2026-11-19 }\n']);
    const { basis, warnings } = valid(text);
    expect(warnings).toEqual([`${FILE}:14:40: warning: document.sign-off.checked.date: checked on 2026-11-19, before it was prepared on 2026-11-20`]);
    expect(basis.document.signOff).toEqual({ prepared: { name: 'T. Tester', date: '2026-11-20' }, checked: { name: 'C. Checker', date: '2026-11-19' } });
  });

  it('refuses the revision and status a basis of an earlier version states, at their keys, and reads them past only in a revision issued by that version', () => {
    const old = edit(BASE, ['  # (the revision and its status were written here: the issued revisions decide them now)\n  #\n', '  revision: B\n  status: issued for review\n']);
    const refused = loadBasisText(old, FILE, 't');
    expect(refused.ok).toBe(false);
    if (refused.ok) return;
    expect(refused.errors.map(formatDiagnostic)).toEqual([
      `${FILE}:6:3: document.revision: the revision is no longer written in the basis: the issued revisions number it (cellbasis issue), and the working basis shows itself as the draft of the next one; delete this line`,
      `${FILE}:7:3: document.status: the status is no longer written in the basis: a revision takes its status when it is issued (cellbasis issue --status), and the working basis is always the draft; delete this line`,
    ]);
    const former = loadBasisText(old, FILE, 't', { formerRevisionKeys: true });
    expect(former.ok).toBe(true);
    // The same basis without the two keys: nothing of them reaches the basis.
    expect(former.ok && valid(BASE).basis.document).toEqual(former.ok && former.basis.document);
  });

  it('reads an open assumption accepted for approval, with its reason, who accepted it and when', () => {
    const text = edit(BASE, ['open: true, reference: R1 }', 'open: true, reference: R1, accepted: { reason: Within the margin of R1., by: A. Approver, date: 2026-11-22 } }']);
    expect(valid(text).basis.assumptions[0]).toEqual({ id: 'A1', text: 'Isothermal stack.', open: true, reference: 'R1', concerns: [], accepted: { reason: 'Within the margin of R1.', by: 'A. Approver', date: '2026-11-22' } });
  });
});

describe('electrolysis feeds by technology', () => {
  const electrolysis = (tech: string, temperature: string, streams: string, extra: [string, string][] = []) =>
    edit(
      BASE,
      ['technology: solid-oxide', `technology: ${tech}`],
      ['mode: power', 'mode: electrolysis'],
      ['operating-temperature: "800 C"', `operating-temperature: "${temperature}"`],
      [BASE.slice(BASE.indexOf('streams:\n'), BASE.indexOf('operating-point:')), streams],
      ['fuel-utilization: 0.80', 'steam-conversion: 0.7'],
      ['  air-utilization: 0.25\n', ''],
      ['mixtures:\n  site-gas: { source: R1, composition: { CH4: 0.93, C2H6: 0.04, C3H8: 0.01, CO2: 0.01, N2: 0.01 } }\n', ''],
      ...extra,
    );

  it('solid oxide: steam at the fuel electrode, no sweep (pure oxygen)', () => {
    const { basis } = valid(electrolysis('solid-oxide', '800 C', 'streams:\n  fuel-electrode: { composition: { H2O: 0.9, H2: 0.1 } }\n'));
    expect(basis.fuelElectrode!.feed).toEqual({ H2O: 0.9, H2: 0.1 });
    expect(basis.airElectrode).toBeNull();
    expect(basis.operatingPoint.air).toEqual({ kind: 'none' });
  });

  it('solid oxide: an air sweep with its sweep ratio', () => {
    const { basis } = valid(electrolysis('solid-oxide', '800 C', 'streams:\n  fuel-electrode: { composition: { H2O: 0.9, H2: 0.1 } }\n  air-electrode: { composition: dry-air }\n', [['  current-density:', '  sweep-ratio: 2\n  current-density:']]));
    expect(basis.operatingPoint.air).toEqual({ kind: 'sweep-ratio', value: 2 });
    expect(basis.airElectrode!.compositionName).toBe('dry-air');
  });

  it('proton-conducting ceramic: steam at the air electrode, no fuel feed', () => {
    const { basis } = valid(electrolysis('proton-ceramic', '600 C', 'streams:\n  air-electrode: { composition: steam }\n'));
    expect(basis.fuelElectrode).toBeNull();
    expect(basis.airElectrode!.composition).toEqual({ H2O: 1 });
    expect(basis.operatingPoint.air).toEqual({ kind: 'none' });
  });

  it('PEM: liquid water at the air electrode', () => {
    const { basis } = valid(electrolysis('pem', '60 C', 'streams:\n  air-electrode: { composition: { "H2O(l)": 1 } }\n'));
    expect(basis.fuelElectrode).toBeNull();
    expect(basis.airElectrode!.composition).toEqual({ 'H2O(L)': 1 });
    // 60 °C ± 150 K, inside the liquid-water data (273.15 K to 600 K).
    expect(basis.conditions.sweepFromK).toBe(273.15);
    expect(basis.conditions.sweepToK).toBeCloseTo(483.15, 9);
  });

  it('alkaline: no feeds, or liquid water, which means the same', () => {
    const koh: [string, string][] = [['  fuel-electrode: Ni-YSZ cermet', '  fuel-electrode: Ni-YSZ cermet\n  koh-mass-fraction: "30 %"']];
    const none = valid(electrolysis('alkaline', '80 C', '', koh)).basis;
    const water = valid(electrolysis('alkaline', '80 C', 'streams:\n  fuel-electrode: { composition: liquid-water }\n', koh)).basis;
    expect(none.fuelElectrode).toBeNull();
    expect(none.airElectrode).toBeNull();
    expect(water.fuelElectrode).toBeNull();
  });
});

describe('loader API', () => {
  it('refuses a file over the size limit before parsing', () => {
    const result = loadBasisText('#'.repeat(MAX_BASIS_BYTES + 1), FILE, 't');
    expect(result.ok).toBe(false);
    if (!result.ok) expect(formatDiagnostic(result.errors[0]!)).toBe(`${FILE}:1:1: the file is 262,145 bytes; a design basis may be at most 256 KiB (262,144 bytes): is this the right file?`);
  });

  it('loadBasisFile refuses a large file from its size, before reading it', () => {
    const path = join(mkdtempSync(join(tmpdir(), 'cellbasis-big-')), 'basis.yaml');
    writeFileSync(path, '');
    truncateSync(path, 6 * 1024 * 1024);
    const result = loadBasisFile(path, { displayPath: 'big.yaml' });
    expect(result.ok ? [] : result.errors.map(formatDiagnostic)).toEqual(['big.yaml:1:1: the file is 6,291,456 bytes; a design basis may be at most 256 KiB (262,144 bytes): is this the right file?']);
  });

  it('loadBasisFile reads the file, names it as displayed and takes the id from its folder', () => {
    const dir = mkdtempSync(join(tmpdir(), 'cellbasis-load-'));
    mkdirSync(join(dir, 'demo-7'));
    const path = join(dir, 'demo-7', 'basis.yaml');
    writeFileSync(path, BASE);
    writeFileSync(join(dir, 'x.yaml'), 'document: {}\n');
    const good = loadBasisFile(path);
    expect(good.ok && good.basis.id).toBe('demo-7');
    expect(good.ok && good.basis.file).toBe(path);
    expect(() => loadBasisFile(join(dir, 'missing.yaml'), { displayPath: 'missing.yaml' })).toThrow(new UserError('missing.yaml: cannot read the design basis: it does not exist'));
    const bad = loadBasisFile(join(dir, 'x.yaml'), { displayPath: 'x.yaml', id: 'x' });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.errors[0]!.file).toBe('x.yaml');
  });

  it('formats warnings with "warning: " after the location; BasisError carries the diagnostics with exit code 1', () => {
    const result = loadBasisText(edit(BASE, ['number: TST-DB-0001', 'number: ""'], ['cells: 1200', 'cells: 0']), FILE, 't');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const error = new BasisError(result.errors, result.warnings);
    expect(error).toBeInstanceOf(UserError);
    expect(error.exitCode).toBe(1);
    expect(error.message.split('\n')).toEqual(result.errors.map(formatDiagnostic));
    expect(formatDiagnostic({ severity: 'warning', file: 'f.yaml', line: 3, column: 5, path: 'a.b', message: 'm' })).toBe('f.yaml:3:5: warning: a.b: m');
  });
});
