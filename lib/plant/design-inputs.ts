/**
 * The numbers one evaluation of the stack needs, taken from a validated basis (SI), and the
 * perturbed copies the sensitivity study evaluates. Keeping them apart from the basis lets a
 * sensitivity run change one input and hold the rest, including the cell count of the design.
 */
import type { AirStream, DesignBasis, FuelStream, OperatingPoint, PreReforming } from '../basis/types.ts';
import { technology, type Mode, type Technology } from '../electrochem/technologies.ts';
import { addSteam, combustibleCarbon } from '../equilibrium/carbon.ts';
import type { Solution } from '../equilibrium/fuel-path.ts';

/** The operating point of the basis (OperatingPoint) and the conditions and feeds, in SI. */
export interface DesignInputs extends OperatingPoint {
  technology: Technology;
  mode: Mode;
  temperatureK: number;
  fuelPressureBar: number;
  airPressureBar: number;
  fuelInletTemperatureK: number;
  airInletTemperatureK: number;
  ambientTemperatureK: number;
  allowedAirTemperatureRiseK: number;
  /** Dry fuel (before steam) and feed (after steam) of the fuel electrode, mole fractions; null where it has no feed. */
  dryFuel: Record<string, number> | null;
  fuelFeed: Record<string, number> | null;
  steamToCarbon?: number;
  preReforming: PreReforming;
  /** Share of the fuel-electrode off-gas returned to the fuel inlet and the tolerance its loop must close to; null without a recycle. */
  anodeRecycle: { ratio: number; tolerance: number } | null;
  /** Air-electrode feed, mole fractions; with a cathode-gas loop, the burner air's. */
  airFeed: Record<string, number> | null;
  /** A carbonate cell's cathode-gas loop (lib/plant/cathode-loop.ts): the air-electrode feed is made from the off-gas and the burner air (airFeed); null where the basis gives the feed. */
  cathodeLoop: { inletOxygenFraction: number } | null;
  ionicTransferenceNumber: number;
  crossoverAllowanceV: number;
  /** Alkaline cells: mass fraction of KOH in the electrolyte (sets its water activity). */
  kohMassFraction?: number;
  /** Resolution of the fuel path (reported paths: at least 100). */
  intervals: number;
  refineV: number;
  /** Equilibria of a neighbouring path to start from (sensitivity runs). */
  seeds?: readonly Solution[];
}

function feedOf(stream: FuelStream | null): { dry: Record<string, number> | null; feed: Record<string, number> | null } {
  if (!stream) return { dry: null, feed: null };
  return { dry: { ...stream.composition }, feed: { ...stream.feed } };
}

function airOf(stream: AirStream | null): Record<string, number> | null {
  return stream ? { ...stream.composition } : null;
}

export function designInputs(basis: DesignBasis): DesignInputs {
  const fuel = feedOf(basis.fuelElectrode);
  const c = basis.conditions;
  const op = basis.operatingPoint;
  return {
    technology: technology(basis.cell.technology),
    mode: basis.cell.mode,
    temperatureK: c.temperatureK,
    fuelPressureBar: c.fuelPressureBar,
    airPressureBar: c.airPressureBar,
    fuelInletTemperatureK: c.fuelInletTemperatureK,
    airInletTemperatureK: c.airInletTemperatureK,
    ambientTemperatureK: c.ambientTemperatureK,
    allowedAirTemperatureRiseK: c.allowedAirTemperatureRiseK,
    dryFuel: fuel.dry,
    fuelFeed: fuel.feed,
    ...(basis.fuelElectrode?.steamToCarbon !== undefined ? { steamToCarbon: basis.fuelElectrode.steamToCarbon } : {}),
    preReforming: basis.fuelElectrode?.preReforming ?? { kind: 'none' },
    anodeRecycle: basis.plant.anodeRecycle,
    airFeed: airOf(basis.airElectrode),
    cathodeLoop: basis.airElectrode?.cathodeLoop ?? null,
    ...op,
    // The law's reference is the operating temperature of the basis unless it names another.
    ...(op.resistanceLaw ? { resistanceLaw: { ...op.resistanceLaw, referenceTemperatureK: op.resistanceLaw.referenceTemperatureK ?? c.temperatureK } } : {}),
    ionicTransferenceNumber: basis.cell.ionicTransferenceNumber,
    crossoverAllowanceV: basis.cell.crossoverAllowanceV,
    ...(basis.cell.kohMassFraction !== undefined ? { kohMassFraction: basis.cell.kohMassFraction } : {}),
    intervals: 120,
    refineV: 1e-3,
  };
}

/** The same inputs with a different steam-to-carbon ratio (the feed rebuilt from the dry fuel). */
export function withSteamToCarbon(inputs: DesignInputs, steamToCarbon: number): DesignInputs {
  if (!inputs.dryFuel) return inputs;
  const feed = addSteam(inputs.dryFuel, steamToCarbon * combustibleCarbon(inputs.dryFuel));
  const total = Object.values(feed).reduce((a, b) => a + b, 0);
  return { ...inputs, steamToCarbon, fuelFeed: Object.fromEntries(Object.entries(feed).map(([k, v]) => [k, v / total])) };
}
