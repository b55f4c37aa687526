// Electrical layout of cells, stacks, strings and the DC bus, against hand arithmetic with the
// circuit laws: series elements share a current and add voltages, parallel strings share a
// voltage and add currents.
import { describe, expect, it } from 'vitest';
import { electricalLayout, type LayoutRequest } from '../../lib/flowsheet/electrical-layout.ts';
import { FlowsheetInputError } from '../../lib/flowsheet/input-error.ts';

// A solid-oxide power module (invented numbers): 2400 cells needed, 80 cells a stack, 50 A a cell
// (0.5 A/cm² on 100 cm²) at 0.80 V, 0.72-0.92 V between full load at end of life and part load,
// an inverter whose DC input accepts 600-850 V at 96 % efficiency.
const sofc = (overrides: Partial<LayoutRequest> = {}): LayoutRequest => ({
  mode: 'power',
  requiredCells: 2400,
  cellsPerStack: 80,
  cellVoltageV: 0.8,
  cellCurrentA: 50,
  cellVoltageRangeV: { minV: 0.72, maxV: 0.92 },
  busVoltageWindowV: { minV: 600, maxV: 850 },
  conversionEfficiency: 0.96,
  ...overrides,
});

describe('electrical layout', () => {
  it('derives the series stacks from the bus window and the parallel strings from the cells needed', () => {
    const layout = electricalLayout(sofc());
    // Hand: N_series = ⌈600 / (80 · 0.72)⌉ = ⌈10.42⌉ = 11; bus 11 · 80 · 0.92 = 809.6 V ≤ 850 V.
    expect(layout.stacksInSeries).toBe(11);
    expect(layout.stacksInSeriesFrom).toBe('bus-voltage-window');
    // Stacks needed ⌈2400 / 80⌉ = 30, strings ⌈30 / 11⌉ = 3, installed 3 · 11 · 80 = 2640 cells.
    expect(layout.stringsInParallel).toBe(3);
    expect(layout.stringsInParallelFrom).toBe('required-cells');
    expect(layout.stackCount).toBe(33);
    expect(layout.installedCells).toBe(2640);
    expect(layout.busVoltageRangeV.minV).toBeCloseTo(11 * 80 * 0.72, 9);
    expect(layout.busVoltageRangeV.maxV).toBeCloseTo(809.6, 9);
  });

  it('names each voltage and current for what it is: a stack carries one cell current, the bus the strings’ sum', () => {
    const layout = electricalLayout(sofc());
    expect(layout.stackVoltageV).toBeCloseTo(80 * 0.8, 12); // 64 V
    expect(layout.stackCurrentA).toBe(50);
    expect(layout.stackPowerW).toBeCloseTo(3200, 9);
    expect(layout.stringVoltageV).toBeCloseTo(11 * 64, 9); // 704 V
    expect(layout.stringCurrentA).toBe(50);
    expect(layout.busVoltageV).toBeCloseTo(704, 9);
    expect(layout.busCurrentA).toBe(150);
    // P_DC = V_bus · I_bus = N_installed · V_cell · I_cell = 105.6 kW.
    expect(layout.dcPowerW).toBeCloseTo(704 * 150, 6);
    expect(layout.dcPowerW).toBeCloseTo(2640 * 0.8 * 50, 6);
    expect(layout.dcPowerW).toBeCloseTo(layout.stackCount * layout.stackPowerW, 6);
  });

  it('an inverter delivers η · P_DC; a rectifier draws P_DC / η', () => {
    const power = electricalLayout(sofc());
    expect(power.acPowerW).toBeCloseTo(0.96 * 105600, 6);
    expect(power.conversionLossW).toBeCloseTo(0.04 * 105600, 6);
    // A PEM electrolyser (invented): 1.9 V cells, 1000 A (2 A/cm² on 500 cm²), 100 cells a stack,
    // 2 stacks in series, 4 strings, rectifier 97 %: P_DC = 8 · 100 · 1.9 · 1000 = 1.52 MW,
    // P_AC = 1.52 MW / 0.97 = 1.567 MW drawn.
    const electrolysis = electricalLayout({
      mode: 'electrolysis',
      requiredCells: 800,
      cellsPerStack: 100,
      cellVoltageV: 1.9,
      cellCurrentA: 1000,
      stacksInSeries: 2,
      stringsInParallel: 4,
      conversionEfficiency: 0.97,
    });
    expect(electrolysis.stacksInSeriesFrom).toBe('given');
    expect(electrolysis.stringsInParallelFrom).toBe('given');
    expect(electrolysis.busVoltageV).toBeCloseTo(380, 9);
    expect(electrolysis.busCurrentA).toBe(4000);
    expect(electrolysis.dcPowerW).toBeCloseTo(1.52e6, 3);
    expect(electrolysis.acPowerW).toBeCloseTo(1.52e6 / 0.97, 3);
    expect(electrolysis.conversionLossW).toBeCloseTo(1.52e6 / 0.97 - 1.52e6, 3);
    // Without a cell-voltage range the bus range is the design point.
    expect(electrolysis.busVoltageRangeV).toEqual({ minV: electrolysis.busVoltageV, maxV: electrolysis.busVoltageV });
  });

  it('keeps a given series count and checks it against the window', () => {
    // 12 · 80 · 0.92 = 883.2 V: inside a 600-900 V window, outside the 600-850 V one.
    const layout = electricalLayout(sofc({ stacksInSeries: 12, busVoltageWindowV: { minV: 600, maxV: 900 } }));
    expect(layout.stacksInSeries).toBe(12);
    expect(layout.stringsInParallel).toBe(3); // ⌈30 / 12⌉
    expect(() => electricalLayout(sofc({ stacksInSeries: 12 }))).toThrow(/^stacksInSeries \(12\) does not fit the bus window 600 V to 850 V: .* 691\.2 V to 883\.2 V/);
    expect(() => electricalLayout(sofc({ stacksInSeries: 10 }))).toThrow(/^stacksInSeries \(10\) does not fit the bus window 600 V to 850 V: 10 stacks in series of 80 cells give a bus of 576\.0 V to 736\.0 V/);
  });
});

describe('bad layouts', () => {
  it('a window no whole number of stacks fits', () => {
    // 11 stacks are the fewest that reach 600 V at 0.72 V, and reach 809.6 V at 0.92 V: over 800 V.
    expect(() => electricalLayout(sofc({ busVoltageWindowV: { minV: 600, maxV: 800 } }))).toThrow(
      /^busVoltageWindowV \(600 V to 800 V\) fits no whole number of stacks in series: 11 stacks in series of 80 cells, the fewest that reach its minimum, give a bus of 633\.6 V to 809\.6 V/,
    );
  });

  it('too few strings, or inputs out of range, name their field', () => {
    expect(() => electricalLayout(sofc({ stringsInParallel: 2 }))).toThrow(/^stringsInParallel \(2\) is too few: 2 strings of 11 stacks of 80 cells install 1760 cells, fewer than the 2400 required/);
    const cases: [Partial<LayoutRequest>, string][] = [
      [{ cellsPerStack: 0 }, 'cellsPerStack'],
      [{ requiredCells: 10.5 }, 'requiredCells'],
      [{ conversionEfficiency: 0 }, 'conversionEfficiency'],
      [{ cellVoltageV: 0.7 }, 'cellVoltageRangeV'],
      [{ cellCurrentA: -1 }, 'cellCurrentA'],
      [{ busVoltageWindowV: { minV: 900, maxV: 800 } }, 'busVoltageWindowV'],
      [{ busVoltageWindowV: undefined }, 'stacksInSeries'],
    ];
    for (const [overrides, field] of cases) {
      let caught: unknown;
      try {
        electricalLayout(sofc(overrides));
      } catch (error) {
        caught = error;
      }
      expect(caught, field).toBeInstanceOf(FlowsheetInputError);
      expect((caught as FlowsheetInputError).field).toBe(field);
    }
  });
});
