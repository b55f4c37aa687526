// The bare hazard input the hazards tests start from: a PEM fuel cell at 70 °C, atmospheric on
// both sides, 25 °C ambient, a 48 V stack (below the 120 V DC of extra-low voltage) and no streams.
import type { HazardInput } from '../../lib/hazards/types.ts';

export const C = 273.15;
export const ATM = 1.01325;

export const bareHazardInput: HazardInput = {
  streams: [],
  technology: 'pem',
  mode: 'power',
  nickelBearing: false,
  operatingTemperatureK: 70 + C,
  fuelPressureBar: ATM,
  airPressureBar: ATM,
  ambientTemperatureK: 25 + C,
  dcVoltage: { voltageV: 48, description: 'the stack voltage' },
};
