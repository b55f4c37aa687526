/**
 * Section 8, hazards and cautions, from the assessment of lib/hazards carried in the results:
 * the standing notice first, then each caution with its severity, the streams that raised it and
 * the standards it cites, the indicators of every stream and the hazard data of the substances,
 * each value with its source, and the method notes.
 */
import { citation } from '../../hazards/standards.ts';
import type { Caution, StreamIndicators, SubstanceRow } from '../../hazards/types.ts';
import type { Results } from '../../plant/results-schema.ts';
import { formatFixed, formatNumber } from '../format.ts';
import { table, type Table } from '../table.ts';
import { speciesText } from '../species-text.ts';

export interface CautionItem {
  id: string;
  severity: Caution['severity'];
  severityLabel: string;
  title: string;
  text: string;
  raisedBy: string;
  standards: string[];
}

export interface HazardsSection {
  notice: string;
  cautions: CautionItem[];
  streams: Table;
  substances: Table;
  method: { id: string; text: string }[];
}

const SEVERITY_LABEL: Record<Caution['severity'], string> = { danger: 'Danger', warning: 'Warning', caution: 'Caution' };

/** One indicator as a row across the streams. */
type IndicatorRow = [label: string, cell: (s: StreamIndicators) => string];

const INDICATORS: IndicatorRow[] = [
  ['Role', (s) => s.role],
  ['Temperature, °C', (s) => formatFixed(s.temperature_C, 0)],
  ['Pressure, bar', (s) => formatNumber(s.pressure_bar)],
  ['Combustibles, mol %', (s) => (s.combustibles.length ? formatNumber(s.combustible_percent, 3) : 'none')],
  ['Oxygen, mol %', (s) => formatNumber(s.oxygen_percent, 3)],
  ['Lower flammable limit of the stream in air, vol %', (s) => (s.flammability ? formatNumber(s.flammability.streamLfl_percent, 3) : '')],
  ['Flammable on mixing with air', (s) => (s.flammableOnMixingWithAir ? 'yes' : 'no')],
  ['The stream as it is', (s) => s.insideFlammableRangeFinding],
  ['Carbon monoxide, ppm', (s) => (s.carbonMonoxide ? `${formatNumber(s.carbonMonoxide.coConcentration_ppm, 3)} (${formatNumber(s.carbonMonoxide.timesIdlh, 3)} × IDLH)` : '')],
  ['Hydrogen partial pressure, bar', (s) => formatNumber(s.hydrogenPartialPressure_bar, 3)],
  ['Lowest autoignition temperature', (s) => (s.autoignition ? `${formatFixed(s.autoignition.lowest_C, 0)} °C (${speciesText(s.autoignition.species)})${s.autoignition.streamAbove ? ', stream above it' : ''}` : '')],
  ['Temperature class below it (IEC 60079-0)', (s) => (s.autoignition ? (s.autoignition.temperatureClass ? `${s.autoignition.temperatureClass} (${formatFixed(s.autoignition.maxSurface_C!, 0)} °C)` : 'none') : '')],
];

function streamTable(streams: readonly StreamIndicators[]): Table {
  return table(
    ['', ...streams.map((s) => s.name)],
    ['left', ...streams.map(() => 'right' as const)],
    INDICATORS.map(([label, cell]) => ({ cells: [label, ...streams.map(cell)] })),
  );
}

/** A substance's limits in one row, the publications they come from in the last cell. */
function substanceRow(s: SubstanceRow): string[] {
  const values = [s.lfl_percent, s.ufl_percent, s.lowestAutoignition_C, s.exposure_ppm.idlh];
  const shown = (v: { value: number } | null | undefined, unit: string) => (v ? `${formatNumber(v.value, 3)}${unit}` : '');
  const sources = [...new Set(values.flatMap((v) => (v ? [v.source] : [])))];
  return [`${s.name} (${speciesText(s.species)})`, s.cas, s.presence, shown(s.lfl_percent, ' %'), shown(s.ufl_percent, ' %'), shown(s.lowestAutoignition_C, ' °C'), shown(s.exposure_ppm.idlh, ' ppm'), sources.join('; ')];
}

export function hazardsSection(r: Results): HazardsSection {
  const a = r.hazards;
  const names = new Map(a.streams.map((s) => [s.id, s.name]));
  return {
    notice: a.notice,
    cautions: a.cautions.map((c) => ({
      id: c.id,
      severity: c.severity,
      severityLabel: SEVERITY_LABEL[c.severity],
      title: c.title,
      text: c.text,
      raisedBy: c.triggeredBy.length ? `Raised by: ${c.triggeredBy.map((id) => names.get(id) ?? id).join('; ')}` : 'Raised by the basis itself',
      standards: c.standards.map((s) => `${citation(s)}, ${s.title}`),
    })),
    streams: streamTable(a.streams),
    substances: table(['Substance', 'CAS', 'Presence', 'LFL in air', 'UFL in air', 'Lowest autoignition', 'IDLH', 'Sources'], ['left', 'left', 'left', 'right', 'right', 'right', 'right', 'left'], a.substances.map((s) => ({ cells: substanceRow(s) }))),
    method: a.method,
  };
}
