// The equilibrium and steam-limit commands: the JSON keys the issue names, the acceptance values,
// and one-line messages with exit code 2 for bad feeds.
import { describe, expect, it } from 'vitest';
import { run } from '../helpers/run-cli.ts';

describe('cellbasis equilibrium', () => {
  it('CH4=1, H2O=2 at 800 C and 1 bar gives H2 ≈ 0.640, CO ≈ 0.157, CH4 ≈ 0.0015', async () => {
    const r = await run(['equilibrium', '--temperature', '800C', '--pressure', '1bar', '--feed', 'CH4=1, H2O=2', '--json']);
    expect(r.code).toBe(0);
    const o = JSON.parse(r.out);
    expect(Object.keys(o).sort()).toEqual(['carbonActivity', 'elementBalanceError', 'moleFractions', 'pressure_bar', 'temperature_K']);
    expect(o.moleFractions.H2).toBeCloseTo(0.64, 3);
    expect(o.moleFractions.CO).toBeCloseTo(0.157, 3);
    expect(o.moleFractions.CH4).toBeCloseTo(0.0015, 4);
    expect(o.elementBalanceError).toBeLessThan(1e-12);
    expect(o.moleFractions).toHaveProperty('OH');
  });

  it('bad feeds: one clear line, exit 2', async () => {
    const cases: [string, RegExp][] = [
      ['CH4=1, Xe=1', /unknown species "Xe"/],
      ['CH4=-1', /negative/],
      ['CH4=0', /total amount must be positive/],
      ['CH4', /write SPECIES=AMOUNT/],
      ['', /--feed is given an empty value/],
      ['H2O(L)=1', /condensed phase/],
    ];
    for (const [feed, pattern] of cases) {
      const r = await run(['equilibrium', '--temperature', '800C', '--pressure', '1bar', '--feed', feed]);
      expect(r.code, feed).toBe(2);
      expect(r.err, feed).toMatch(pattern);
      expect(r.err.trim().split('\n')).toHaveLength(1);
    }
  });

  it('prints a readable table', async () => {
    const r = await run(['equilibrium', '--temperature', '1073.15 K', '--pressure', '100 kPa', '--feed', 'CH4=1, H2O=2']);
    expect(r.out).toMatch(/H2\s+0\.63958/);
    expect(r.out).toMatch(/carbon activity/);
  });
});

describe('cellbasis steam-limit', () => {
  it('methane at 800 C, 1 bar: the JSON keys and a limit near 1', async () => {
    const r = await run(['steam-limit', '--fuel', 'CH4=1', '--temperature', '800C', '--pressure', '1bar', '--json']);
    const o = JSON.parse(r.out);
    expect(Object.keys(o).sort()).toEqual(['fuel', 'minimumSteamToCarbon', 'pressure_bar', 'temperature_K']);
    expect(o.minimumSteamToCarbon).toBeGreaterThan(0.8);
    expect(o.minimumSteamToCarbon).toBeLessThan(1.3);
  });

  it('a fuel without carbon: one line, exit 2', async () => {
    const r = await run(['steam-limit', '--fuel', 'H2=1', '--temperature', '800C', '--pressure', '1bar']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/no combustible carbon/);
  });
});
