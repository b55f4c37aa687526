/**
 * The `plant:` section of a basis: read with its units and defaults, refused at the key that is
 * wrong. (Unit conversions are the project's unit table; the defaults are those the schema
 * documents.)
 */
import { describe, expect, it } from 'vitest';
import { loadBasisText } from '../../lib/basis/load.ts';
import { basisFrom, scaffoldText } from '../helpers/scaffold-basis.ts';

function errors(technology: Parameters<typeof scaffoldText>[0], mode: Parameters<typeof scaffoldText>[1], edits: Record<string, unknown>): string[] {
  const result = loadBasisText(scaffoldText(technology, mode, 'test', edits), 'projects/test/basis.yaml', 'test');
  return result.ok ? [] : result.errors.map((e) => `${e.path}: ${e.message}`);
}

describe('plant section', () => {
  it('defaults without a plant section: feeds at the ambient temperature, no oxidiser, no recovery', () => {
    const b = basisFrom('solid-oxide', 'power');
    expect(b.plant.electrical).toEqual({});
    expect(b.plant.fuelSupplyTemperatureK).toBe(b.conditions.ambientTemperatureK);
    expect(b.plant.offGasOxidiser).toBeNull();
    expect(b.plant.heatRecovery).toBeNull();
    expect(b.plant.airBlower).toBeNull();
    expect(b.operatingPoint.conversionEfficiency).toBe(1);
  });

  it('reads every block of power mode in SI', () => {
    const b = basisFrom('solid-oxide', 'power', {
      'operating-point.power-conversion-efficiency': '96 %',
      'plant.electrical': { 'cells-per-stack': 80, 'dc-bus-window': { from: '0.6 kV', to: '800 V' } },
      'plant.feed-temperatures': { water: '10 C', fuel: '15 C' },
      'plant.air-blower': { 'isentropic-efficiency': '70 %', 'inlet-pressure': '1.01325 bar' },
      'plant.off-gas-oxidiser': { oxidant: 'fresh-air', 'air-ratio': 1.5, 'material-limit': '950 C' },
      'plant.heat-recovery': { 'exhaust-exit-temperature': '90 C' },
      'plant.anode-recycle': { ratio: '60 %' },
    });
    expect(b.operatingPoint.conversionEfficiency).toBeCloseTo(0.96, 12);
    expect(b.plant.electrical).toEqual({ cellsPerStack: 80, busVoltageWindowV: { minV: 600, maxV: 800 } });
    expect(b.plant.feedWaterTemperatureK).toBeCloseTo(283.15, 9);
    expect(b.plant.fuelSupplyTemperatureK).toBeCloseTo(288.15, 9);
    // 70 % is read as 70/100, 0.7 to rounding.
    expect(b.plant.airBlower?.isentropicEfficiency).toBeCloseTo(0.7, 14);
    expect(b.plant.airBlower?.inletPressureBar).toBeCloseTo(1.01325, 12);
    expect(b.plant.offGasOxidiser).toEqual({ oxidant: { kind: 'fresh-air', airRatio: 1.5 }, materialLimitK: 1223.15 });
    expect(b.plant.heatRecovery?.exhaustExitTemperatureK).toBeCloseTo(363.15, 9);
    expect(b.plant.anodeRecycle).toEqual({ ratio: 0.6, tolerance: 1e-9 });
  });

  it('refuses a block at its key', () => {
    expect(errors('solid-oxide', 'power', { 'plant.electrical': { 'stacks-in-series': 4, 'dc-bus-window': { from: '600 V', to: '800 V' } } })).toEqual([
      'plant.electrical.dc-bus-window: give stacks-in-series or dc-bus-window, not both',
    ]);
    expect(errors('solid-oxide', 'power', { 'plant.electrical': { 'cells-per-stack': 2.5 } })[0]).toMatch(/^plant\.electrical\.cells-per-stack: the number of cells per stack must be a whole number/);
    expect(errors('solid-oxide', 'power', { 'plant.hydrogen-compression': { 'delivery-pressure': '30 bar', stages: 2, 'isentropic-efficiency': 0.75 } })[0]).toMatch(
      /^plant\.hydrogen-compression: hydrogen-compression belongs to electrolysis/,
    );
    expect(errors('pem', 'power', { 'plant.anode-recycle': { ratio: 0.5 } })[0]).toMatch(/^plant\.anode-recycle: the anode recycle applies to cells that reform/);
    expect(errors('solid-oxide', 'power', { 'plant.off-gas-oxidiser': { oxidant: 'air-electrode-exhaust', 'air-ratio': 2, 'material-limit': '950 C' } })[0]).toMatch(
      /^plant\.off-gas-oxidiser\.air-ratio: air-ratio applies to fresh air/,
    );
    expect(errors('solid-oxide', 'power', { 'plant.feed-temperatures': { water: '-5 C' } })[0]).toMatch(/^plant\.feed-temperatures\.water: the feed-water temperature must be 0 °C or above/);
    expect(errors('solid-oxide', 'power', { 'plant.heat-recovery': { 'exhaust-exit-temperature': '90 C' } })[0]).toMatch(/^plant\.heat-recovery: the heat recovery cools the oxidiser's exhaust/);
  });
});
