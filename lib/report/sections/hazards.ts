/**
 * Section 8, hazards and cautions, from the assessment of lib/hazards carried in the results:
 * the standing notice first, then each caution with its severity, the streams that raised it and
 * the standards it cites, the indicators of every stream and the hazard data of the substances,
 * each value with its source, and the method notes.
 */
import { ZERO_CELSIUS_K } from '../../core/units.ts';
import { citation } from '../../hazards/standards.ts';
import type { Caution, HazardAssessment, StreamIndicators, SubstanceRow } from '../../hazards/types.ts';
import type { Results } from '../../plant/results-schema.ts';
import { formatFixed, formatNumber } from '../format.ts';
import { crossTable, recordsTable, type CrossRow, type ItemDatum, type RecordColumn, type Table } from '../table.ts';
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
  /** The cautions as a register, for the CSV link under the blocks (the page shows the blocks). */
  cautionsTable: Table;
  streams: Table;
  substances: Table;
  method: { id: string; text: string }[];
}

const SEVERITY_LABEL: Record<Caution['severity'], string> = { danger: 'Danger', warning: 'Warning', caution: 'Caution' };

/** A row of the stream indicators: shown by `text`, in the data as `data`. */
function indicator(label: string, text: (s: StreamIndicators) => string, data: ItemDatum<StreamIndicators>[]): CrossRow<StreamIndicators> {
  return { label, text, data };
}

const INDICATORS: CrossRow<StreamIndicators>[] = [
  indicator('Role', (s) => s.role, [{ name: 'Role', unit: '', value: (s) => s.role }]),
  indicator('Temperature, °C', (s) => formatFixed(s.temperature_C, 0), [{ name: 'Temperature', unit: 'K', value: (s) => s.temperature_K }]),
  indicator('Pressure, bar', (s) => formatNumber(s.pressure_bar), [{ name: 'Pressure', unit: 'bar', value: (s) => s.pressure_bar }]),
  indicator('Combustibles, mol %', (s) => (s.combustibles.length ? formatNumber(s.combustible_percent, 3) : 'none'), [{ name: 'Combustibles', unit: '%', value: (s) => s.combustible_percent }]),
  indicator('Oxygen, mol %', (s) => formatNumber(s.oxygen_percent, 3), [{ name: 'Oxygen', unit: '%', value: (s) => s.oxygen_percent }]),
  indicator('Lower flammable limit of the stream in air, vol %', (s) => (s.flammability ? formatNumber(s.flammability.streamLfl_percent, 3) : ''), [
    { name: 'Lower flammable limit of the stream in air', unit: '%', value: (s) => s.flammability?.streamLfl_percent ?? null },
  ]),
  indicator('Flammable on mixing with air', (s) => (s.flammableOnMixingWithAir ? 'yes' : 'no'), [{ name: 'Flammable on mixing with air', unit: '', value: (s) => s.flammableOnMixingWithAir }]),
  indicator('The stream as it is', (s) => s.insideFlammableRangeFinding, [{ name: 'The stream as it is', unit: '', value: (s) => s.insideFlammableRangeFinding }]),
  indicator('Carbon monoxide, ppm', (s) => (s.carbonMonoxide ? `${formatNumber(s.carbonMonoxide.coConcentration_ppm, 3)} (${formatNumber(s.carbonMonoxide.timesIdlh, 3)} × IDLH)` : ''), [
    { name: 'Carbon monoxide', unit: 'ppm', value: (s) => s.carbonMonoxide?.coConcentration_ppm ?? null },
    { name: 'Carbon monoxide over its IDLH', unit: '', value: (s) => s.carbonMonoxide?.timesIdlh ?? null },
  ]),
  indicator('Hydrogen partial pressure, bar', (s) => formatNumber(s.hydrogenPartialPressure_bar, 3), [{ name: 'Hydrogen partial pressure', unit: 'bar', value: (s) => s.hydrogenPartialPressure_bar }]),
  indicator('Lowest autoignition temperature', (s) => (s.autoignition ? `${formatFixed(s.autoignition.lowest_C, 0)} °C (${speciesText(s.autoignition.species)})${s.autoignition.streamAbove ? ', stream above it' : ''}` : ''), [
    { name: 'Lowest autoignition temperature', unit: 'K', value: (s) => s.autoignition?.lowest_K ?? null },
    { name: 'Lowest autoignition temperature, species', unit: '', value: (s) => s.autoignition?.species ?? null },
    { name: 'Stream at or above its lowest autoignition temperature', unit: '', value: (s) => s.autoignition?.streamAbove ?? null },
  ]),
  indicator('Temperature class below it (IEC 60079-0)', (s) => (s.autoignition ? (s.autoignition.temperatureClass ? `${s.autoignition.temperatureClass} (${formatFixed(s.autoignition.maxSurface_C!, 0)} °C)` : 'none') : ''), [
    { name: 'Temperature class below it (IEC 60079-0)', unit: '', value: (s) => s.autoignition?.temperatureClass ?? null },
    // The results give the class's maximum surface temperature in °C, as the standard states it; the data is in K like every temperature.
    { name: 'Maximum surface temperature of that class', unit: 'K', value: (s) => (s.autoignition?.maxSurface_C == null ? null : s.autoignition.maxSurface_C + ZERO_CELSIUS_K) },
  ]),
];

/** The hazard indicators of each stream: one column per stream on the page, one row per stream in the data. */
export function hazardStreamTable(streams: readonly StreamIndicators[]): Table {
  return crossTable({ name: 'hazard-streams', title: 'Stream indicators', items: streams, itemName: (s) => s.name, itemColumn: 'Stream', rows: INDICATORS });
}

/** The publications a substance's limits come from. */
function sources(s: SubstanceRow): string {
  const values = [s.lfl_percent, s.ufl_percent, s.lowestAutoignition_C, s.exposure_ppm.idlh];
  return [...new Set(values.flatMap((v) => (v ? [v.source] : [])))].join('; ');
}

/** A substance's limit: shown with its unit, in the data as the number. */
function limit(head: string, name: string, unit: string, shownUnit: string, get: (s: SubstanceRow) => { value: number } | null | undefined): RecordColumn<SubstanceRow> {
  return {
    head,
    align: 'right',
    text: (s) => {
      const v = get(s);
      return v ? `${formatNumber(v.value, 3)}${shownUnit}` : '';
    },
    data: [{ name, unit, value: (s) => get(s)?.value ?? null }],
  };
}

const SUBSTANCE_COLUMNS: RecordColumn<SubstanceRow>[] = [
  {
    head: 'Substance',
    align: 'left',
    text: (s) => `${s.name} (${speciesText(s.species)})`,
    data: [
      { name: 'Substance', unit: '', value: (s) => s.name },
      { name: 'Species', unit: '', value: (s) => s.species },
    ],
  },
  { head: 'CAS', align: 'left', text: (s) => s.cas, data: [{ name: 'CAS', unit: '', value: (s) => s.cas }] },
  { head: 'Presence', align: 'left', text: (s) => s.presence, data: [{ name: 'Presence', unit: '', value: (s) => s.presence }] },
  limit('LFL in air', 'LFL in air', '%', ' %', (s) => s.lfl_percent),
  limit('UFL in air', 'UFL in air', '%', ' %', (s) => s.ufl_percent),
  limit('Lowest autoignition', 'Lowest autoignition temperature', '°C', ' °C', (s) => s.lowestAutoignition_C),
  limit('IDLH', 'IDLH', 'ppm', ' ppm', (s) => s.exposure_ppm.idlh),
  { head: 'Sources', align: 'left', text: sources, data: [{ name: 'Sources', unit: '', value: sources }] },
];

/** The hazard data of the substances, each value's sources in the last column. */
export function substancesTable(substances: readonly SubstanceRow[]): Table {
  return recordsTable({ name: 'substances', title: 'Substances', columns: SUBSTANCE_COLUMNS, groups: [{ items: substances }] });
}

/** What raised a caution: the names of its streams, or the basis itself. */
function raisedBy(a: HazardAssessment, c: Caution): string {
  const names = new Map(a.streams.map((s) => [s.id, s.name]));
  return c.triggeredBy.length ? c.triggeredBy.map((id) => names.get(id) ?? id).join('; ') : 'the basis itself';
}

const cautionText = (head: string, get: (c: Caution) => string): RecordColumn<Caution> => ({ head, align: 'left', text: get, data: [{ name: head, unit: '', value: get }] });

/** The cautions as a table (the command line's, and the CSV under the page's blocks): severity, title (and, in the data, the text), id, what raised it, its standards. */
export function cautionsTable(a: HazardAssessment, cautions: readonly Caution[] = a.cautions): Table {
  return recordsTable({
    name: 'cautions',
    title: 'Hazard cautions',
    columns: [
      cautionText('Severity', (c) => c.severity),
      // The text is in the data (the CSV of a hazard register) but not in the command line's columns.
      { head: 'Caution', align: 'left', text: (c) => c.title, data: [{ name: 'Caution', unit: '', value: (c) => c.title }, { name: 'Text', unit: '', value: (c) => c.text }] },
      cautionText('Id', (c) => c.id),
      cautionText('Raised by', (c) => raisedBy(a, c)),
      cautionText('Standards', (c) => c.standards.map(citation).join('; ')),
    ],
    groups: [{ items: cautions }],
  });
}

export function hazardsSection(r: Results): HazardsSection {
  const a = r.hazards;
  return {
    notice: a.notice,
    cautions: a.cautions.map((c) => ({
      id: c.id,
      severity: c.severity,
      severityLabel: SEVERITY_LABEL[c.severity],
      title: c.title,
      text: c.text,
      raisedBy: c.triggeredBy.length ? `Raised by: ${raisedBy(a, c)}` : 'Raised by the basis itself',
      standards: c.standards.map((s) => `${citation(s)}, ${s.title}`),
    })),
    cautionsTable: cautionsTable(a),
    streams: hazardStreamTable(a.streams),
    substances: substancesTable(a.substances),
    method: a.method,
  };
}
