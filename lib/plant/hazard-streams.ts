/**
 * The streams of a design point as the hazards library reads them (lib/hazards/types.ts): gas
 * mole fractions (traces below 1e-12 dropped), with what each stream is (feed, internal, outlet,
 * product) and which electrode side it belongs to.
 */
import type { HazardInput, HazardStream, StreamRole } from '../hazards/types.ts';
import type { DesignBasis } from '../basis/types.ts';
import type { DesignPoint } from './design-point.ts';
import { gasMoleFractions } from './streams.ts';
import type { PlantBalance } from './plant-balance.ts';

function role(id: string, point: DesignPoint): StreamRole {
  const power = point.inputs.mode === 'power';
  switch (id) {
    case 'fuel-feed':
      return 'feed';
    case 'pre-reformer-outlet':
      return 'internal';
    case 'fuel-inlet':
      return point.inputs.preReforming.kind === 'none' ? 'feed' : 'internal';
    case 'air-inlet':
      return 'feed';
    default:
      return power ? 'outlet' : 'product';
  }
}

/**
 * The plant's streams the hazards read beside the stack's: the off-gas oxidiser's outlet and the
 * exhaust after the heat recovery (their temperature and what is left in them: CO, unburnt fuel),
 * and the compressed hydrogen an electrolysis plant delivers (its pressure). The exhaust streams
 * belong to the air side, the hydrogen to the fuel side.
 */
const PLANT_STREAMS = new Set(['oxidiser-outlet', 'exhaust-mixed', 'exhaust', 'hydrogen-delivered']);
const EXHAUST_STREAMS = new Set(['oxidiser-outlet', 'exhaust-mixed', 'exhaust']);

/**
 * The highest DC voltage of the array: the cells in series on the bus (stacks in series × cells
 * per stack) at the open-circuit voltage in power mode (a string unloaded), at the operating cell
 * voltage in electrolysis (above open circuit), V.
 */
function busVoltage(point: DesignPoint, plant: PlantBalance): HazardInput['dcVoltage'] {
  const e = plant.electrical;
  const inSeries = e.stacksInSeries * e.cellsPerStack;
  const power = point.inputs.mode === 'power';
  const cellV = power ? Math.max(point.voltage.openCircuitV, point.voltage.cellVoltageV) : point.voltage.cellVoltageV;
  const at = power ? 'at open circuit' : 'at the operating cell voltage';
  return { voltageV: inSeries * cellV, description: `the DC bus ${at}: ${inSeries} cells in series (${e.stacksInSeries} stack${e.stacksInSeries === 1 ? '' : 's'} of ${e.cellsPerStack})` };
}

export function hazardInput(basis: DesignBasis, point: DesignPoint, plant: PlantBalance): HazardInput {
  const streams: HazardStream[] = [...point.streams, ...plant.streams.filter((s) => PLANT_STREAMS.has(s.id))]
    .map((s) => {
      const x = gasMoleFractions(s.flows);
      const moleFractions = Object.fromEntries(Object.entries(x).filter(([, v]) => v >= 1e-12));
      const side = s.id.startsWith('air') || EXHAUST_STREAMS.has(s.id) ? 'air' : 'fuel';
      return { id: s.id, name: s.name, temperatureK: s.temperatureK, pressureBar: s.pressureBar, moleFractions, role: role(s.id, point), side } as HazardStream;
    })
    .filter((s) => Object.keys(s.moleFractions).length > 0);
  return {
    streams,
    technology: basis.cell.technology,
    mode: basis.cell.mode,
    nickelBearing: basis.cell.nickelBearing,
    operatingTemperatureK: point.inputs.temperatureK,
    fuelPressureBar: point.inputs.fuelPressureBar,
    airPressureBar: point.inputs.airPressureBar,
    ambientTemperatureK: point.inputs.ambientTemperatureK,
    dcVoltage: busVoltage(point, plant),
  };
}
