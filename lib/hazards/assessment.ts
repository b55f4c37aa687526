/**
 * The hazards section of a design basis: `assessHazards` checks the input, computes the
 * indicators of every stream (indicators.ts), evaluates the caution rules (rules.ts) and returns
 * one JSON-serialisable object with the standing notice first, the hazard data of the substances
 * concerned with their sources, the stream indicators, the cautions by severity and the method
 * notes. Pure: the same input gives the same assessment.
 */
import { UserError } from '../core/errors.ts';
import { TECHNOLOGY_IDS, technology } from '../electrochem/technologies.ts';
import { streamIndicators } from './indicators.ts';
import { HAZARD_NOTICE, methodNotes } from './notice.ts';
import { evaluateRules } from './rules.ts';
import { allSubstances, substanceRow } from './substances.ts';
import { SEVERITIES, STREAM_ROLES, STREAM_SIDES, type HazardAssessment, type HazardInput, type StreamIndicators, type SubstanceRow } from './types.ts';

function checkInput(input: HazardInput): void {
  if (!(TECHNOLOGY_IDS as readonly string[]).includes(input.technology)) {
    throw new UserError(`hazards: unknown technology "${input.technology}" (expected one of ${TECHNOLOGY_IDS.join(', ')})`);
  }
  if (input.mode !== 'power' && input.mode !== 'electrolysis') throw new UserError(`hazards: unknown mode "${input.mode}"`);
  for (const field of ['operatingTemperatureK', 'fuelPressureBar', 'airPressureBar', 'ambientTemperatureK'] as const) {
    const v = input[field];
    if (!Number.isFinite(v) || v <= 0) throw new UserError(`hazards: ${field} must be a positive finite number, got ${v}`);
  }
  const dc = input.dcVoltage;
  if (!dc || !Number.isFinite(dc.voltageV) || dc.voltageV < 0) throw new UserError(`hazards: dcVoltage.voltageV must be a finite number ≥ 0, got ${dc?.voltageV}`);
  if (!dc.description.trim()) throw new UserError('hazards: dcVoltage.description must say what the voltage is');
  const ids = new Set<string>();
  for (const s of input.streams) {
    if (ids.has(s.id)) throw new UserError(`hazards: stream id "${s.id}" is used twice`);
    ids.add(s.id);
    if (s.role !== undefined && !STREAM_ROLES.includes(s.role)) {
      throw new UserError(`hazard stream "${s.id}": unknown role "${s.role}" (expected one of ${STREAM_ROLES.join(', ')})`);
    }
    if (s.side !== undefined && !STREAM_SIDES.includes(s.side)) {
      throw new UserError(`hazard stream "${s.id}": unknown side "${s.side}" (expected one of ${STREAM_SIDES.join(', ')})`);
    }
  }
}

/** Substances in any stream, then those a triggered caution says the basis can form; in data-file order. */
function substanceRows(streams: StreamIndicators[], concerns: Set<string>): SubstanceRow[] {
  const inStreams = new Set(streams.flatMap((s) => s.composition.map((c) => c.species)));
  return allSubstances().flatMap((s) => {
    if (inStreams.has(s.species)) return [substanceRow(s, 'in streams')];
    return concerns.has(s.species) ? [substanceRow(s, 'can form')] : [];
  });
}

export function assessHazards(input: HazardInput): HazardAssessment {
  checkInput(input);
  const streams = input.streams.map((s) => streamIndicators(s, input));
  const technologyName = technology(input.technology).name;
  const triggered = evaluateRules({ input, technologyName, streams });
  const concerns = new Set(triggered.flatMap((t) => t.rule.concerns ?? []));
  const cautions = triggered
    .map((t, order) => ({ caution: t.caution, order }))
    .sort((a, b) => SEVERITIES.indexOf(a.caution.severity) - SEVERITIES.indexOf(b.caution.severity) || a.order - b.order)
    .map((t) => t.caution);
  return {
    notice: HAZARD_NOTICE,
    basis: {
      technology: input.technology,
      technologyName,
      mode: input.mode,
      nickelBearing: input.nickelBearing,
      operatingTemperature_K: input.operatingTemperatureK,
      fuelPressure_bar: input.fuelPressureBar,
      airPressure_bar: input.airPressureBar,
      ambientTemperature_K: input.ambientTemperatureK,
      dcVoltage_V: input.dcVoltage.voltageV,
      dcVoltageDescription: input.dcVoltage.description,
    },
    substances: substanceRows(streams, concerns),
    streams,
    cautions,
    method: methodNotes(),
  };
}
