/**
 * The headline numbers a revision comparison reports (results.headline), each with its label
 * and how it is written: voltages in V with changes in mV, powers in kW, efficiencies in % with
 * changes in percentage points, flows as computed. Formatting only; no arithmetic on meaning.
 */
import type { HeadlineKey } from '../plant/comparable-results.ts';
import { sig } from '../core/plain-text.ts';

export type Style = 'voltage' | 'power' | 'fraction' | 'count' | 'current' | 'plain';

export interface HeadlineQuantity {
  key: HeadlineKey;
  label: string;
  /** SI unit of the value in the results. */
  unit: string;
  style: Style;
  /** Unit written after plain values. */
  shownUnit?: string;
}

export const HEADLINE_QUANTITIES: readonly HeadlineQuantity[] = [
  { key: 'meanNernst_V', label: 'mean Nernst voltage', unit: 'V', style: 'voltage' },
  { key: 'inletNernst_V', label: 'inlet Nernst voltage', unit: 'V', style: 'voltage' },
  { key: 'outletNernst_V', label: 'outlet Nernst voltage', unit: 'V', style: 'voltage' },
  { key: 'openCircuit_V', label: 'open-circuit voltage', unit: 'V', style: 'voltage' },
  { key: 'cellVoltage_V', label: 'cell voltage', unit: 'V', style: 'voltage' },
  { key: 'stackVoltage_V', label: 'series voltage of all cells', unit: 'V', style: 'voltage' },
  { key: 'cells', label: 'cells', unit: '1', style: 'count' },
  { key: 'cellCurrent_A', label: 'cell current', unit: 'A', style: 'current' },
  { key: 'totalCurrent_A', label: 'sum of the cell currents', unit: 'A', style: 'current' },
  { key: 'stackPower_W', label: 'stack power', unit: 'W', style: 'power' },
  { key: 'netPower_W', label: 'net power', unit: 'W', style: 'power' },
  { key: 'electricalEfficiencyLhv', label: 'net electrical efficiency (LHV)', unit: '1', style: 'fraction' },
  { key: 'electricalEfficiencyHhv', label: 'net electrical efficiency (HHV)', unit: '1', style: 'fraction' },
  { key: 'thermodynamicLimitLhv', label: 'thermodynamic limit (LHV)', unit: '1', style: 'fraction' },
  { key: 'thermodynamicLimitHhv', label: 'thermodynamic limit (HHV)', unit: '1', style: 'fraction' },
  { key: 'stackHeat_W', label: 'stack heat (isothermal)', unit: 'W', style: 'power' },
  { key: 'airFlow_kg_per_h', label: 'air-electrode feed', unit: 'kg/h', style: 'plain', shownUnit: 'kg/h' },
  { key: 'hydrogenProduction_kg_per_h', label: 'hydrogen production', unit: 'kg/h', style: 'plain', shownUnit: 'kg/h' },
  { key: 'hydrogenProduction_kg_per_day', label: 'hydrogen production per day', unit: 'kg/day', style: 'plain', shownUnit: 'kg/day' },
  { key: 'specificEnergy_kWh_per_kg', label: 'specific energy', unit: 'kWh/kg', style: 'plain', shownUnit: 'kWh/kg' },
  { key: 'minimumSteamToCarbon', label: 'minimum steam-to-carbon ratio', unit: '1', style: 'plain' },
  { key: 'carbonMargin', label: 'carbon margin (S/C above the minimum)', unit: '1', style: 'plain' },
  { key: 'maxCarbonActivity', label: 'highest carbon activity', unit: '1', style: 'plain' },
];

const MINUS = '−';

function signed(text: string): string {
  return text.startsWith('-') ? `${MINUS}${text.slice(1)}` : text === '0' ? '0' : `+${text}`;
}

function negative(text: string): string {
  return text.startsWith('-') ? `${MINUS}${text.slice(1)}` : text;
}

/** A value as the document writes it; "none" for null. */
export function formatValue(q: HeadlineQuantity, value: number | null): string {
  if (value === null) return 'none';
  switch (q.style) {
    case 'voltage':
      return `${negative(value.toFixed(4))} V`;
    case 'power':
      return `${negative(sig(value / 1000, 5))} kW`;
    case 'fraction':
      return `${negative((value * 100).toFixed(2))} %`;
    case 'count':
      return String(value);
    case 'current':
      return `${negative(sig(value, 5))} A`;
    case 'plain':
      return `${negative(sig(value, 4))}${q.shownUnit ? ` ${q.shownUnit}` : ''}`;
  }
}

/** The absolute change, and the relative one when there is one: "+5.4 mV, +0.58 %". */
export function formatChange(q: HeadlineQuantity, delta: number, relative: number | null): string {
  let absolute: string;
  switch (q.style) {
    case 'voltage':
      absolute = Math.abs(delta) < 1 ? `${signed(sig(delta * 1000, 2))} mV` : `${signed(sig(delta, 3))} V`;
      break;
    case 'power':
      absolute = `${signed(sig(delta / 1000, 3))} kW`;
      break;
    case 'fraction':
      absolute = `${signed(sig(delta * 100, 2))} percentage points`;
      break;
    case 'count':
      absolute = signed(String(delta));
      break;
    case 'current':
      absolute = `${signed(sig(delta, 3))} A`;
      break;
    case 'plain':
      absolute = `${signed(sig(delta, 2))}${q.shownUnit ? ` ${q.shownUnit}` : ''}`;
      break;
  }
  return relative === null ? absolute : `${absolute}, ${signed(sig(relative * 100, 2))} %`;
}
