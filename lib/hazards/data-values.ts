/**
 * Data values the hazard texts can name: `{threshold.<id>}` (thresholds.yaml) and
 * `{<key>.<field>}` for a substance of substances.yaml by its key (`{co.idlh}`, `{h2.lfl}`), or
 * `{substance.<field>}` for the substance a rule is about. Fields: name, lfl, ufl, ait (lowest
 * recorded, °C), mie (lowest recorded, mJ), loc, lflInOxygen, uflInOxygen, inAir,
 * enrichedAbove and the exposure limits (idlh, nioshRelTwa, oshaPelTwa, ...), ppm.
 */
import { substanceByKey, findSubstance, type Substance } from './substances.ts';
import { EXPOSURE_LIMITS } from './types.ts';
import type { ExposureLimit } from './types.ts';
import { formatNumber } from './numbers.ts';
import { thresholds, type ThresholdId } from './thresholds.ts';

function field(s: Substance, name: string): number | string | undefined {
  if ((EXPOSURE_LIMITS as readonly string[]).includes(name)) return s.exposure_ppm[name as ExposureLimit]?.value;
  const lowest = (values: { value: number }[]) => (values.length ? Math.min(...values.map((v) => v.value)) : undefined);
  switch (name) {
    case 'name':
      return s.name;
    case 'lfl':
      return s.lfl_percent?.value;
    case 'ufl':
      return s.ufl_percent?.value;
    case 'ait':
      return s.lowestAutoignition_C?.value;
    case 'mie':
      return lowest(s.minimumIgnitionEnergy_mJ);
    case 'loc':
      return s.limitingOxygen_percent?.value;
    case 'lflInOxygen':
      return s.inOxygen?.lfl_percent;
    case 'uflInOxygen':
      return s.inOxygen?.ufl_percent ?? undefined;
    case 'inAir':
      return s.inAir_percent?.value;
    case 'enrichedAbove':
      return s.enrichedAbove_percent?.value;
    default:
      return undefined;
  }
}

/** The value of a data name, formatted; undefined where the data have none. */
export function dataValue(name: string, ruleSubstance?: string): string | undefined {
  const dot = name.indexOf('.');
  if (dot < 0) return undefined;
  const head = name.slice(0, dot);
  const tail = name.slice(dot + 1);
  if (head === 'threshold') {
    const t = thresholds()[tail as ThresholdId];
    return t ? formatNumber(t.value) : undefined;
  }
  const s = head === 'substance' ? (ruleSubstance ? findSubstance(ruleSubstance) : undefined) : substanceByKey(head);
  const v = s ? field(s, tail) : undefined;
  return typeof v === 'number' ? formatNumber(v) : v;
}
