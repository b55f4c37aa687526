/**
 * The hazard assessment as terminal text, for the CLI: the standing notice first, then the
 * cautions by severity with their standards, the stream indicators, the substance data with
 * their sources (marked where quoted from memory) and the method notes. Display only: every
 * number comes computed in the assessment.
 */
import { grid } from '../core/plain-text.ts';
import { formatCelsius, formatNumber } from './numbers.ts';
import { citation } from './standards.ts';
import { SEVERITIES, type Caution, type HazardAssessment, type SourcedValue, type StreamIndicators, type SubstanceRow } from './types.ts';

const WIDTH = 96;

/** Greedy word wrap to WIDTH columns, every line prefixed by `indent`. */
export function wrap(text: string, indent = ''): string {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/[ \t\n]+/).filter(Boolean)) {
    if (line && indent.length + line.length + 1 + word.length > WIDTH) {
      lines.push(indent + line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(indent + line);
  return lines.join('\n') + '\n';
}

const num = (v: number | null | undefined): string => (v === null || v === undefined ? '-' : formatNumber(v));
const yes = (b: boolean): string => (b ? 'yes' : 'no');

function caution(c: Caution): string {
  const standards = c.standards.map((s) => `${citation(s)} (${s.title})`).join('; ');
  return (
    `${c.severity.toUpperCase().padEnd(8)}${c.title}  [${c.id}]\n` +
    wrap(c.text, '  ') +
    wrap(`Standards: ${standards}`, '  ') +
    (c.triggeredBy.length ? wrap(`Streams: ${c.triggeredBy.join(', ')}`, '  ') : '')
  );
}

function streamRow(s: StreamIndicators): string[] {
  return [
    s.id,
    s.role + (s.roleAssumed ? '*' : ''),
    formatCelsius(s.temperature_K),
    num(s.pressure_bar),
    num(s.combustible_percent),
    num(s.flammability?.lfl_percent),
    num(s.flammability?.ufl_percent),
    num(s.flammability?.streamLfl_percent),
    yes(s.flammableOnMixingWithAir),
    s.insideFlammableRangeFinding,
    num(s.carbonMonoxide?.coConcentration_ppm),
    num(s.carbonMonoxide?.timesIdlh),
    num(s.hydrogenPartialPressure_bar),
    s.autoignition ? `${formatNumber(s.autoignition.lowest_C)} ${s.autoignition.species}` : '-',
    s.autoignition?.temperatureClass ?? '-',
  ];
}

const STREAM_HEADER = ['stream', 'role', 'T °C', 'p bar', 'combustibles %', 'LFL %', 'UFL %', 'gas LFL %', 'with air', 'inside range', 'CO ppm', '× IDLH', 'pH2 bar', 'AIT °C', 'class'];

function sourced(label: string, v: SourcedValue<number | string>): string {
  return `${label} ${typeof v.value === 'number' ? formatNumber(v.value) : v.value} (${v.source}${v.memory ? ', from memory' : ''})`;
}

function substanceSources(s: SubstanceRow): string {
  const parts = [
    ...(s.lfl_percent ? [sourced('LFL %', s.lfl_percent)] : []),
    ...(s.ufl_percent ? [sourced('UFL %', s.ufl_percent)] : []),
    ...s.autoignition_C.map((v) => sourced('AIT °C', v)),
    ...s.minimumIgnitionEnergy_mJ.map((v) => sourced('MIE mJ', v)),
    ...(s.limitingOxygen_percent ? [sourced('LOC % O2', s.limitingOxygen_percent)] : []),
    ...(s.gasGroup ? [sourced('group', s.gasGroup)] : []),
    ...(s.temperatureClass ? [`class ${s.temperatureClass.id} (below the lowest AIT)`] : []),
    ...Object.entries(s.exposure_ppm).map(([limit, v]) => sourced(`${limit} ppm`, v)),
    ...(s.inAir_percent ? [sourced('in dry air %', s.inAir_percent)] : []),
    ...(s.enrichedAbove_percent ? [sourced('enriched above %', s.enrichedAbove_percent)] : []),
    ...(s.carcinogen ? [sourced('carcinogen:', s.carcinogen)] : []),
  ];
  return wrap(`${s.species} (${s.name}, ${s.presence}): ${parts.join('; ')}`, '  ');
}

export function formatHazardsText(a: HazardAssessment): string {
  const b = a.basis;
  const counts = SEVERITIES.map((sev) => `${a.cautions.filter((c) => c.severity === sev).length} ${sev}`).join(', ');
  const out = [
    'HAZARDS\n',
    wrap(a.notice),
    '',
    wrap(
      `Basis: ${b.technologyName}, ${b.mode} mode; nickel-bearing fuel electrode or catalyst: ${yes(b.nickelBearing)}; ` +
        `operating ${formatCelsius(b.operatingTemperature_K)}\u00a0°C; fuel side ${num(b.fuelPressure_bar)}\u00a0bar, air side ${num(b.airPressure_bar)}\u00a0bar (absolute); ` +
        `ambient ${formatCelsius(b.ambientTemperature_K)}\u00a0°C; DC voltage ${num(b.dcVoltage_V)}\u00a0V (${b.dcVoltageDescription}).`,
    ),
    '',
    `Cautions: ${counts}\n`,
    ...a.cautions.map((c) => caution(c) + '\n'),
    'Streams (* role assumed: outlet)\n',
    grid(STREAM_HEADER, a.streams.map(streamRow)),
    '',
    'Substances and sources\n',
    ...a.substances.map(substanceSources),
    '',
    'Method\n',
    ...a.method.map((m) => wrap(`- ${m.text}`, '  ').replace(/^ {2}- /, '- ')),
  ];
  return out.join('\n').replace(/\n{3,}/g, '\n\n');
}
