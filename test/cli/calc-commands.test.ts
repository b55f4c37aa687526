// cellbasis calc and cellbasis hazards on bases written to a temporary projects/ folder:
// the results object, located calculation errors (exit 1), and the hazard cautions the issue
// names for a methane-fed nickel-anode solid oxide plant and a pure-hydrogen PEM unit.
import { describe, expect, it } from 'vitest';
import type { Mode, TechnologyId } from '../../lib/electrochem/technologies.ts';
import { resultsSchema } from '../../lib/plant/results-schema.ts';
import { run } from '../helpers/run-cli.ts';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';

function project(technology: TechnologyId, mode: Mode, edits: Record<string, unknown> = {}): string {
  return projectsRoot('calc', { p1: scaffoldText(technology, mode, 'p1', edits) });
}

describe('cellbasis calc', () => {
  it('prints the document\'s headline table first, and with --json the results object', async () => {
    const root = project('solid-oxide', 'power');
    const table = await run(['calc', 'p1'], root);
    expect(table.code).toBe(0);
    expect(table.out).toMatch(/\nHeadline numbers\n/);
    expect(table.out).toMatch(/Net electrical efficiency, LHV \/ HHV\s+\d+\.\d+ % \/ \d+\.\d+ %/);
    const json = await run(['calc', 'p1', '--json'], root);
    const r = JSON.parse(json.out);
    expect(r.format).toBe('cellbasis-results/1');
    expect(r.headline.meanNernst_V).toBeGreaterThan(0.85);
    expect(r.headline.meanNernst_V).toBeLessThan(r.headline.inletNernst_V);
    // The table is the document's headline table, showing the numbers of the results to 4
    // significant figures: the inlet and outlet values, the area mean (the uniform-voltage cell's)
    // beside the charge mean (an indicator), and the highest local current density beside the mean.
    const sig4 = (x: number) => x.toPrecision(4).replace('.', '\\.');
    const row = (label: string, values: string) => new RegExp(`\\n${label.replace(/[/()]/g, '\\$&')}\\s+${values}\\n`);
    expect(table.out).toMatch(row('Nernst voltage, inlet / outlet', `${sig4(r.headline.inletNernst_V)} V / ${sig4(r.headline.outletNernst_V)} V`));
    expect(table.out).toMatch(row('Nernst voltage, area mean / charge mean', `${sig4(r.electrochemistry.areaMeanNernst_V)} V / ${sig4(r.headline.meanNernst_V)} V`));
    expect(table.out).toMatch(row('Local current density, mean / highest (hot spot)', `0\\.4000 A/cm² / ${sig4(r.headline.maxLocalCurrentDensity_A_per_m2 / 1e4)} A/cm²`));
    // A power cell's area mean lies below its charge mean (the low-voltage outlet takes more area).
    expect(r.electrochemistry.areaMeanNernst_V).toBeLessThan(r.headline.meanNernst_V);
    // calc --json carries the findings, and the whole object passes the results schema.
    expect(Array.isArray(r.findings)).toBe(true);
    expect('notes' in r).toBe(false);
    expect(resultsSchema.safeParse(r).success).toBe(true);
  });

  it('with cases, says the table is the sizing case\'s and prints the envelope with the case that sets each value', async () => {
    const root = project('pem', 'power', {
      cases: {
        rated: { title: 'Rated', purpose: 'Sizing.', sizing: true },
        half: { title: 'Half load', purpose: 'The least hydrogen flow.', overrides: { 'operating-point': { 'target-power': '50 kW' } } },
      },
    });
    const r = await run(['calc', 'p1'], root);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/the figures above are those of the sizing case, rated; the envelope over the 2 cases \(rated, half\):/);
    // Half the power on the same cells: the least fuel at half load, the highest stack voltage there too (less current, less resistive loss).
    // The envelope is the document's table: quantity, governed by its highest or lowest, the value, the case that sets it.
    expect(r.out).toMatch(/\nfuel supplied \(least\)\s+lowest\s+[\d.]+ kg\/h\s+half\s/);
    // The DC rows are the bus's (the electrical layout), not the series voltage of all the cells.
    expect(r.out).toMatch(/\nDC bus voltage \(highest; the voltage of one string\)\s+highest\s+[\d.]+ V\s+half\s/);
    expect(r.out).toMatch(/\nDC bus current \(the strings in parallel\)\s+highest\s+[\d.]+ A\s+rated\s/);
  });

  it('a cell voltage above the outlet Nernst voltage is located at operating-point.cell-voltage, exit 1', async () => {
    const root = project('solid-oxide', 'power', { 'operating-point.cell-voltage': '1.05 V' });
    const r = await run(['calc', 'p1'], root);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/^cellbasis: projects\/p1\/basis\.yaml:\d+:\d+: operating-point\.cell-voltage: the cell voltage 1\.0500 V is not below the lowest Nernst voltage available along the cell, 0\.\d{4} V: the local current would reverse before the fuel utilization 80\.00 % is reached/m);
  });

  it('a cell count that contradicts the target power is located at operating-point.cells', async () => {
    const root = project('solid-oxide', 'power', { 'operating-point.cells': 4000 });
    const r = await run(['calc', 'p1'], root);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/operating-point\.cells: conflicting inputs: 4000 cells give \d+(\.\d+)? kW net .* but the target is 250\.0 kW/);
  });

  it('a PEM fed with methane-rich gas cannot reach its utilization: located, exit 1', async () => {
    const root = project('pem', 'power', { 'streams.fuel-electrode.composition': { H2: 0.6, CH4: 0.4 } });
    const r = await run(['calc', 'p1'], root);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/operating-point\.fuel-utilization: the fuel cannot reach the requested utilization/);
  });

  it('check prints the calculated headline numbers too', async () => {
    const root = project('pem', 'electrolysis');
    const r = await run(['check', 'p1'], root);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Specific electric energy \/ efficiency over electricity alone, LHV \/ HHV\s+\d+(\.\d+)? kWh\/kg/);
  });
});

describe('cellbasis hazards', () => {
  it('methane-fed solid oxide plant with a nickel anode: CO, nickel carbonyl, flammable off-gas and hydrogen cautions, with sources', async () => {
    const root = project('solid-oxide', 'power');
    const r = await run(['hazards', 'p1', '--json'], root);
    expect(r.code).toBe(0);
    const a = JSON.parse(r.out);
    const ids = a.cautions.map((c: { id: string }) => c.id);
    expect(ids).toEqual(expect.arrayContaining(['carbon-monoxide', 'nickel-carbonyl-shutdown']));
    expect(ids.some((id: string) => /off-?gas/.test(id))).toBe(true);
    expect(ids.some((id: string) => /hydrogen/.test(id))).toBe(true);
    for (const c of a.cautions) expect(c.standards.length, c.id).toBeGreaterThan(0);
    const text = await run(['hazards', 'p1'], root);
    expect(text.out).toMatch(/^HAZARDS\n\nInformational only\./);
    expect(text.out).toMatch(/authority having jurisdiction/);
  });

  // The scaffold runs at 1.5 bar absolute, 0.487 bar gauge: below the 0.5 bar gauge of Directive
  // 2014/68/EU, Article 1(1), so no pressure caution; its 100 kW stack is well above the 120 V DC
  // of extra-low voltage (IEC 61140:2016), so the electrical one.
  it('pure-hydrogen PEM unit on humid air: only the hydrogen cautions and the electrical one, no CO, no nickel carbonyl, no CO2, no pressure caution', async () => {
    const root = project('pem', 'power', { 'streams.fuel-electrode.composition': 'hydrogen' });
    const a = JSON.parse((await run(['hazards', 'p1', '--json'], root)).out);
    const ids: string[] = a.cautions.map((c: { id: string }) => c.id);
    expect(a.streams.find((s: { id: string }) => s.id === 'air-inlet').composition.map((c: { species: string }) => c.species)).toContain('CO2');
    expect([...ids].sort()).toEqual(
      ['dc-voltage', 'flammable-area-classification', 'gas-detection-alarm', 'hydrogen-flame', 'hydrogen-leak', 'hydrogen-piping', 'hydrogen-vent', 'offgas-oxidation'].sort(),
    );
  });

  it('calc --json carries the same hazard assessment as hazards --json', async () => {
    const root = project('solid-oxide', 'power');
    const results = JSON.parse((await run(['calc', 'p1', '--json'], root)).out);
    const hazards = JSON.parse((await run(['hazards', 'p1', '--json'], root)).out);
    expect(hazards.cautions.length).toBeGreaterThan(0);
    expect(results.hazards).toEqual(hazards);
  });
});
