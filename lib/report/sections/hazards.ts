/**
 * Section 8, hazards and cautions, from the assessment of lib/hazards carried in the results:
 * the standing notice first, then each caution with its severity, the streams that raised it and
 * the standards it cites, the indicators of every stream and the hazard data of the substances,
 * each value with its source, and the method notes.
 */
import type { Caution, HazardAssessment, StreamIndicators, SubstanceRow } from '../../hazards/types.ts';
import type { Results } from '../../plant/results-schema.ts';
import { formatFixed, formatNumber } from '../format.ts';
import { table, type Table } from '../table.ts';

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

/** The assessment object of the results (lib/hazards shape; stored untyped in results.json). */
export function hazardAssessment(r: Results): HazardAssessment {
  return r.hazards as unknown as HazardAssessment;
}

function streamRow(s: StreamIndicators): string[] {
  const f = s.flammability;
  const co = s.carbonMonoxide;
  const ait = s.autoignition;
  return [
    s.name,
    s.role,
    `${formatFixed(s.temperature_C, 0)} °C, ${formatNumber(s.pressure_bar)} bar`,
    s.combustibles.length ? `${formatNumber(s.combustible_percent, 3)} %` : 'none',
    f ? `${formatNumber(f.streamLfl_percent, 3)} %` : '',
    s.flammableOnMixingWithAir ? 'yes' : 'no',
    s.insideFlammableRangeFinding,
    co ? `${formatNumber(co.coConcentration_ppm, 3)} ppm (${formatNumber(co.timesIdlh, 3)} × IDLH)` : '',
    formatNumber(s.hydrogenPartialPressure_bar, 3),
    ait ? `${formatFixed(ait.lowest_C, 0)} °C (${ait.species})${ait.streamAbove ? ', stream above it' : ''}` : '',
  ];
}

function substanceRow(s: SubstanceRow): string[] {
  const value = (v: { value: number; source: string } | null | undefined, unit: string) => (v ? `${formatNumber(v.value, 3)}${unit} (${v.source})` : '');
  return [
    `${s.name} (${s.species})`,
    s.cas,
    s.presence,
    value(s.lfl_percent, ' %'),
    value(s.ufl_percent, ' %'),
    value(s.lowestAutoignition_C, ' °C'),
    value(s.exposure_ppm.idlh, ' ppm'),
  ];
}

export function hazardsSection(r: Results): HazardsSection {
  const a = hazardAssessment(r);
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
      standards: c.standards.map((s) => `${s.number}, ${s.title}`),
    })),
    streams: table(
      ['Stream', 'Role', 'State', 'Combustibles', 'LFL of the stream in air', 'Flammable on mixing with air', 'Own composition', 'Carbon monoxide', 'p(H₂), bar', 'Lowest autoignition'],
      ['left', 'left', 'right', 'right', 'right', 'left', 'left', 'right', 'right', 'left'],
      a.streams.map((s) => ({ cells: streamRow(s) })),
    ),
    substances: table(['Substance', 'CAS', 'Presence', 'LFL in air', 'UFL in air', 'Lowest autoignition', 'IDLH'], ['left', 'left', 'left', 'right', 'right', 'right', 'right'], a.substances.map((s) => ({ cells: substanceRow(s) }))),
    method: a.method,
  };
}
