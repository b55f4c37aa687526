/**
 * The fuel path of a co-flow cell: fuel-electrode and air-electrode gas, local Nernst voltage and
 * carbon activity from the inlet to the design utilization.
 *
 * The charge passed up to a point moves through the electrolyte what its ion carries
 * (lib/equilibrium/electrolyte-exchange.ts). Where the fuel electrode catalyses reforming and
 * shift (technology data: fuel-gas-equilibrium) the fuel gas is re-equilibrated at every point
 * with the element potentials of lib/equilibrium/gibbs-minimiser.ts, warm-started from the
 * solutions already found on either side (interpolated, or extrapolated beyond the last two); elsewhere only H2 reacts and the other species pass through. The air gas is
 * not reactive. Local Nernst voltage: lib/electrochem/nernst.ts with both electrodes' local
 * partial pressures (co-flow: the same position on both sides); where the fuel gas is
 * re-equilibrated and the ion has a couple of air-electrode gases (lib/electrochem/electrolytes.ts:
 * oxide ½O2, carbonate ½O2 + CO2), from the potentials of that couple across the electrolyte,
 * E = RT/4F ln(p_O2,air/p_O2,fuel) (+ RT/2F ln of the CO2 ratio), which is the H2/H2O form where
 * the gas holds hydrogen and serves any fuel, a CO/CO2 feed included. The fuel gas's
 * ln p_i = Σ_e a_ie π_e − g°_i/RT (ln p_O2 = 2π_O − g°_O2/RT) comes from the element potentials
 * π of its equilibrium (p in bar; gibbs-minimiser.ts).
 *
 * The inlet: where the inlet gas holds every species of the quotient, E(0) is that gas's
 * ("feed"). Where one electrode has no feed, the first increment of charge fills it with pure
 * product and E(u) tends to a finite limit as u → 0⁺ ("limit", e.g. the hydrogen side of a PEM
 * electrolyser). Where the inlet holds no product and nothing to form it from (dry hydrogen into
 * an oxide-ion cell, a dry hydrocarbon), E rises without bound as u → 0⁺, like −RT/2F ln u; the
 * inlet value reported is then the Nernst voltage of the first equilibrated increment, the first
 * point u_1 of the grid ("first-increment"), and the reported path starts there.
 *
 * Utilization U = q / Q. Power mode: Q = F Σ ṅ_i z_i, the charge of complete oxidation of the
 * fuel feed (lib/electrochem/charge.ts). Electrolysis: Q = 2F (ṅ_H2O + ṅ_CO2) of the
 * water-electrode feed (steam, or steam and CO2, conversion; CO2 only for oxide-ion cells).
 *
 * Liquid-water cells (PEM, alkaline): at every point u the gases carry the vapour the local water
 * balance gives (liquid-water.ts: the water fed plus the water formed or split by the charge u·Q,
 * against what saturates both dry gases there). Where liquid is left, both gases are saturated,
 * x_H2O = x_s = a_w p_s(T)/P with p_s by IAPWS-IF97 (lib/thermo/water-saturation.ts) and a_w the
 * activity of the water the gases stand over: 1 for a PEM cell's pure water, the KOH solution's
 * for an alkaline cell (Balej 1985, lib/thermo/koh-solution.ts), which enters E° as
 * −RT/2F ln a_w (nernst.ts). Where the balance leaves no liquid (dry feeds near a power cell's
 * inlet, too little water fed to an electrolyser), all the water is vapour below saturation,
 * x_H2O < x_s, and the water of the cell reaction is that vapour: its chemical potential is
 * μ_H2O(l, a_w) + RT ln(p_H2O/(a_w p_s)), liquid and vapour being in equilibrium at a_w p_s
 * (the vapour pressure of a solvent, a_w = p/p*: Raoult's law as the definition of the solvent's
 * activity, e.g. P. Atkins and J. de Paula, Physical Chemistry, ch. 5; from memory). So
 *
 *   E(u) = E°_l(T) − RT/2F ln a_w + RT/2F ln Q_dry(u) − RT/2F ln( p_H2O,w(u) / (a_w p_s(T)) )
 *
 * with p_H2O,w the vapour partial pressure at the water electrode (the one whose reaction forms or
 * consumes the water: the air electrode of a PEM cell, the fuel electrode of an alkaline one).
 * The last term is 0 where the gas is saturated, the E of liquid water and saturated gases;
 * below saturation it is the gas-phase Nernst voltage E°_g + RT/2F ln(p_H2 p_O2^½/p_H2O), since
 * E°_l = E°_g − RT/2F ln p_s/p° (the two agree within 0.1–0.3 mV at 60–100 °C, by which the
 * species data's own vapour pressure differs from IF97's), and a gas with no vapour at all makes E unbounded at that
 * point like a dry gas-phase inlet. The local balance, not the outlet's alone, because a gas that
 * is saturated at the outlet may be dry near the inlet (dry hydrogen and partly humidified air
 * into a PEM cell, whose membrane carries water across but not along the cell). Where the water
 * belongs to a circulating aqueous electrolyte (the hydroxide ion's, electrolytes.yaml
 * `electrolyte-water`) the gases at every point stand over the same electrolyte, which the whole
 * cell's water balance sets: the outlet's (power mode gains water along the cell, electrolysis
 * loses it, so the outlet holds the cell's water), and every point takes the outlet's vapour
 * fraction of each gas, saturated wherever the outlet is.
 *
 * The mean Nernst voltage and the grid are in lib/equilibrium/path-integral.ts.
 */
import { FARADAY_C_PER_MOL as F, PA_PER_BAR } from '../thermo/constants.ts';
import { gOverRT } from '../thermo/properties.ts';
import { waterSaturationPressurePa } from '../thermo/water-saturation.ts';
import { kohWaterActivity } from '../thermo/koh-solution.ts';
import { getSpecies } from '../thermo/species-data.ts';
import { electronsOfStream } from '../electrochem/charge.ts';
import { hydrogenStandardVoltage, nernstVoltage, oxygenPotentialNernstV, waterActivityVoltage } from '../electrochem/nernst.ts';
import { activeQuotient, electrolyte, potentialCouple } from '../electrochem/electrolytes.ts';
import type { Mode, Technology } from '../electrochem/technologies.ts';
import { minimiseGibbs, type MinimiserResult } from './gibbs-minimiser.ts';
import { EquilibriumMemo } from './equilibrium-memo.ts';
import { liquidCellWater } from './liquid-water.ts';
import { elementAmounts, elementsOfFeed, gasGibbsOverRT, systemFor, type ChemicalSystem } from './species-set.ts';
import { exchangeFor, type Exchange } from './electrolyte-exchange.ts';
import { amountsOn, layout, moleFractions, shifted, sum, toRecord, type GasLayout } from './gas-state.ts';
import { integrateAlongUtilization, type PathIntegral, type Profile, type Sample } from './path-integral.ts';
import { CalculationError, ConvergenceError, UserError } from '../core/errors.ts';

export interface FuelPathRequest {
  technology: Technology;
  mode: Mode;
  temperatureK: number;
  fuelPressureBar: number;
  airPressureBar: number;
  /** Fuel-electrode feed, species label → mol/s; null when that electrode has no feed. */
  fuelFeed: Readonly<Record<string, number>> | null;
  /** Air-electrode feed, mol/s on the same scale; null when it has none. */
  airFeed: Readonly<Record<string, number>> | null;
  /** Alkaline cells: the mass fraction of KOH in the electrolyte, whose water activity sets the vapour over it and the Nernst voltage; absent for pure water. */
  kohMassFraction?: number;
  /** Design fuel utilization (power) or steam/CO2 conversion (electrolysis), in (0, 1). */
  utilization: number;
  /**
   * Base number of intervals (default 120; a reported path uses at least 100). Sensitivity runs
   * may use fewer (not below 20): they difference two paths on the same grid.
   */
  intervals?: number;
  /** Refine intervals whose end values differ by more than this, V (default 1e-3; Infinity: no refinement). */
  refineV?: number;
  /** Solutions of a neighbouring path (FuelPath.solutions) to start this one's equilibria from. */
  seeds?: readonly Solution[];
}

/** An equilibrium solved along a path: ln n on the minimiser's normalised scale, at a utilization. */
export interface Solution {
  utilization: number;
  ln: Float64Array;
}

export interface PathPoint {
  utilization: number;
  /** Local Nernst voltage, V. */
  nernstV: number;
  /** Carbon activity of the fuel-electrode gas relative to graphite (0 without carbon). */
  carbonActivity: number;
  /** Mole fractions of the fuel-electrode and air-electrode gas (species that reach 1e-5 anywhere on the path). */
  fuelSide: Record<string, number>;
  airSide: Record<string, number>;
  /** Partial pressures (bar) of the gases of the ion's couple in the equilibrated fuel gas, from its element potentials (p_O2 of 1e-20 bar and less); null where E is not taken from the couple. */
  fuelCoupleBar: Record<string, number> | null;
}

export interface FuelPath {
  points: PathPoint[];
  /** Charge that corresponds to U = 1, A (C/s) on the feed's scale. */
  chargeBasisA: number;
  /** Charge passed at the design utilization, A. */
  currentA: number;
  /** E at the inlet: of the inlet gas, its limit u → 0⁺, or at the first equilibrated increment (see inlet). */
  inletNernstV: number;
  /** How inletNernstV was found (the module comment): the inlet gas, the limit u → 0⁺, or the first increment u_1 of an unbounded inlet. */
  inlet: 'feed' | 'limit' | 'first-increment';
  /** Utilization at which inletNernstV is evaluated: 0, or u_1 for 'first-increment'. */
  inletUtilization: number;
  /**
   * The form of the Nernst equation that a reader can evaluate E with: 'quotient', the pressure
   * quotient of the electrode reactions (nernst.ts), or 'oxygen-potential', the couple of the ion
   * across the electrolyte, where the equilibrated fuel gas holds no hydrogen to write the
   * quotient with (a CO/CO2 feed). Where both apply they give the same E.
   */
  nernstForm: 'quotient' | 'oxygen-potential';
  outletNernstV: number;
  meanNernstV: number;
  maxCarbonActivity: number;
  /** Gases at the inlet (the fuel gas equilibrated at cell temperature where the electrode reforms) and outlet, mol/s. Liquid-water cells: dry gases. */
  fuelInlet: Record<string, number>;
  fuelOutlet: Record<string, number>;
  airInlet: Record<string, number>;
  airOutlet: Record<string, number>;
  /** Largest relative element-balance error of any equilibrium along the path. */
  elementBalanceError: number;
  /** E° of H2 + ½O2 → H2O at T used by the Nernst equation, V. */
  standardVoltageV: number;
  /** Activity of the liquid water of a liquid-water cell (the KOH solution's for an alkaline cell), 1 otherwise; E° above includes −RT/2F ln a_w. */
  waterActivity: number;
  /** Vapour mole fraction of each side saturated, a_w p_s/P, for liquid-water cells (0 otherwise); the path's points carry the vapour the local water balance gives. */
  vapourFractionFuel: number;
  vapourFractionAir: number;
  /** The equilibria solved, by utilization, to seed a neighbouring path (empty without fuel-gas equilibrium). */
  solutions: Solution[];
  /** E(u) as integrated (lib/equilibrium/path-integral.ts), for the integrals of the cell model. */
  profile: Profile;
}

type Stream = Readonly<Record<string, number>>;

function pct(x: number): string {
  return `${(x * 100).toPrecision(4)} %`;
}

/** Water of a feed as one species (H2O(L) in a feed is the same water; the cell fixes the phase); without water for liquid-water cells. */
function normaliseFeed(feed: Stream | null, liquid: boolean): Record<string, number> | null {
  if (!feed) return null;
  const out: Record<string, number> = {};
  for (const [k, v] of Object.entries(feed)) {
    const key = k === 'H2O(L)' ? 'H2O' : k;
    if (liquid && key === 'H2O') continue;
    out[key] = (out[key] ?? 0) + v;
  }
  return out;
}

function withoutWater(change: Stream, liquid: boolean): Stream {
  if (!liquid) return change;
  const { H2O: _water, ...rest } = change;
  return rest;
}

function atomsOf(stream: Stream, element: string): number {
  let n = 0;
  for (const [k, v] of Object.entries(stream)) n += v * (getSpecies(k).formula[element] ?? 0);
  return n;
}

/** Q for U = 1 (A), with the check that the design utilization can be reached. */
function chargeBasis(request: FuelPathRequest): number {
  const { technology, mode } = request;
  if (mode === 'power') {
    if (!request.fuelFeed) throw new CalculationError('power mode needs a fuel-electrode feed', 'fuel-electrode-feed');
    const q = F * electronsOfStream(request.fuelFeed);
    if (!(q > 0)) throw new CalculationError('the fuel-electrode feed has no oxidisable fuel (its charge on complete oxidation is not positive)', 'fuel-electrode-feed');
    if (technology.ion === 'proton' && technology.fuelGasEquilibrium) {
      // A proton conductor takes only hydrogen from the fuel gas, one electron per H atom: the
      // carbon stays behind, so the H of the feed (steam's included) bounds the utilization.
      const reachable = (F * atomsOf(request.fuelFeed, 'H')) / q;
      if (request.utilization >= reachable) {
        throw new CalculationError(
          `the fuel cannot reach the requested utilization ${pct(request.utilization)}: a ${technology.name} electrolyte takes only hydrogen from the fuel gas, and the feed's hydrogen (steam included) carries ${pct(reachable)} of its charge; add steam`,
          'utilization',
        );
      }
    }
    if (!technology.fuelGasEquilibrium) {
      const reachable = (2 * F * (request.fuelFeed.H2 ?? 0)) / q;
      if (request.utilization >= reachable) {
        throw new CalculationError(
          `the fuel cannot reach the requested utilization ${pct(request.utilization)}: a ${technology.name} fuel electrode oxidises only H2, which carries ${pct(reachable)} of the feed's charge`,
          'utilization',
        );
      }
    }
    return q;
  }
  const feed = technology.waterElectrode === 'fuel' ? request.fuelFeed : request.airFeed;
  const reactant = feed ? (feed.H2O ?? 0) + (feed['H2O(L)'] ?? 0) + (technology.ion === 'oxide' ? (feed.CO2 ?? 0) : 0) : 0;
  if (!(reactant > 0)) throw new CalculationError(`electrolysis in a ${technology.name} cell needs water in the ${technology.waterElectrode}-electrode feed`, `${technology.waterElectrode}-electrode-feed`);
  return 2 * F * reactant;
}

interface State {
  fuel: Float64Array;
  air: Float64Array;
  carbonActivity: number;
  elementError: number;
  /** ln p (bar) of the gases of the ion's couple in the equilibrated fuel gas, from its element potentials; empty without equilibrium, NaN for a gas whose elements it lacks. */
  coupleLnBar: Record<string, number>;
}

/** The gases of both electrodes as a function of the charge passed. */
class PathModel {
  readonly fuelGas: GasLayout;
  readonly airGas: GasLayout;
  /** Vapour fraction of each gas when saturated (liquid-water cells; 0 otherwise). */
  readonly vapourFuel: number;
  readonly vapourAir: number;
  /** Liquid-water cells: the water of both feeds, vapour and liquid, mol/s on the feed's scale. */
  private readonly waterFed: number;
  /** The water belongs to a circulating aqueous electrolyte (hydroxide): the gases all along stand over the electrolyte the outlet balance leaves (module comment). */
  private readonly pooled: boolean;
  private outletVapour: [number, number] | undefined;
  /** Activity of the liquid water the gases stand over (1 for pure water). */
  readonly waterActivity: number;
  /** An element reaches the fuel gas only through the electrolyte (a dry inlet): E(0) is unbounded. */
  readonly seeded: boolean;
  /** The re-equilibrated fuel gas holds every element of the ion's couple, so the couple's potentials are defined along the path. */
  readonly coupleDefined: boolean = false;
  /** The re-equilibrated fuel gas holds hydrogen. */
  readonly hasHydrogen: boolean = false;
  private readonly sign: number;
  private readonly exchange: Exchange;
  private readonly fuelChange: Stream;
  private readonly airChange: Stream;
  private readonly fuelIn: Float64Array;
  private readonly airIn: Float64Array;
  private readonly system: ChemicalSystem | null = null;
  private readonly gRT: Float64Array | null = null;
  private readonly gGraphite: number = 0;
  /** The gases of the ion's couple with g°/RT at T and their atoms by element index, for their partial pressures from the element potentials. */
  private readonly couple: { label: string; gRT: number; atoms: [number, number][] }[] = [];
  private readonly bInlet: Float64Array | null = null;
  private readonly elementChange: Float64Array | null = null;
  /** Solutions found so far, by utilization: the start of each new equilibrium is predicted from them. */
  readonly solved: Solution[] = [];
  private readonly seeds: readonly Solution[];
  private readonly basisA: number;
  /** This path's equilibria (kept unless it starts from seeds), and those of earlier paths it may take (equilibrium-memo.ts). */
  readonly equilibria: EquilibriumMemo | null = null;
  private readonly earlier: EquilibriumMemo[] = [];

  constructor(private readonly request: FuelPathRequest, basisA: number, earlier: readonly EquilibriumMemo[] = []) {
    const { technology, temperatureK } = request;
    this.basisA = basisA;
    this.seeds = request.seeds ?? [];
    const liquid = technology.waterPhase === 'liquid';
    this.waterActivity = liquid && request.kohMassFraction !== undefined ? kohWaterActivity(request.kohMassFraction, temperatureK) : 1;
    const pSat = liquid ? (waterSaturationPressurePa(temperatureK) / PA_PER_BAR) * this.waterActivity : 0;
    this.vapourFuel = pSat / request.fuelPressureBar;
    this.vapourAir = pSat / request.airPressureBar;
    if (this.vapourFuel >= 1 || this.vapourAir >= 1) {
      throw new UserError(`at ${temperatureK.toFixed(2)} K water boils at the electrode pressure (vapour pressure ${pSat.toFixed(3)} bar by IAPWS-IF97): raise the pressure or lower the temperature`);
    }
    const waterOf = (feed: Stream | null) => (feed ? (feed.H2O ?? 0) + (feed['H2O(L)'] ?? 0) : 0);
    this.waterFed = liquid ? waterOf(request.fuelFeed) + waterOf(request.airFeed) : 0;
    this.pooled = liquid && electrolyte(technology.ion).electrolyteWater;
    this.sign = request.mode === 'power' ? 1 : -1;
    this.exchange = exchangeFor(technology.ion);
    this.fuelChange = withoutWater(this.exchange.fuelSpecies, liquid);
    this.airChange = withoutWater(this.exchange.airSpecies, liquid);
    const fuelFeed = normaliseFeed(request.fuelFeed, liquid);
    const airFeed = normaliseFeed(request.airFeed, liquid);
    this.airGas = layout([...Object.keys(airFeed ?? {}), ...Object.keys(this.airChange), ...(liquid ? ['H2O'] : [])]);
    this.airIn = amountsOn(this.airGas, airFeed);

    if (technology.fuelGasEquilibrium && fuelFeed && sum(Object.values(fuelFeed)) > 0) {
      const inFeed = new Set(elementsOfFeed(fuelFeed));
      const elements = new Set(inFeed);
      for (const [e, v] of Object.entries(this.exchange.fuelElements)) if (v * this.sign > 0) elements.add(e);
      this.seeded = [...elements].some((e) => !inFeed.has(e));
      const system = systemFor(elements);
      this.system = system;
      this.gRT = gasGibbsOverRT(system, temperatureK);
      this.gGraphite = system.graphite ? gOverRT(system.graphite, temperatureK) : 0;
      if (!request.seeds) {
        this.equilibria = new EquilibriumMemo(system, this.gRT, Math.log(request.fuelPressureBar), this.gGraphite);
        this.earlier = this.equilibria.compatible(earlier);
      }
      this.hasHydrogen = system.elements.includes('H');
      this.couple = (potentialCouple(technology.ion) ?? []).map(({ species }) => {
        const s = getSpecies(species);
        return { label: species, gRT: gOverRT(s, temperatureK), atoms: Object.entries(s.formula).map(([e, n]): [number, number] => [system.elements.indexOf(e), n]) };
      });
      this.coupleDefined = this.couple.length > 0 && this.couple.every((c) => c.atoms.every(([i]) => i >= 0));
      const b = elementAmounts(system, fuelFeed);
      // An element introduced only by the electrolyte is seeded at a trace so the system is complete.
      const seed = 1e-12 * sum(Object.values(fuelFeed));
      for (let i = 0; i < b.length; i++) if (!(b[i]! > 0)) b[i] = seed;
      this.bInlet = b;
      this.elementChange = new Float64Array(system.elements.map((e) => this.exchange.fuelElements[e] ?? 0));
      this.fuelGas = layout(system.gas.map((s) => s.label));
      this.fuelIn = new Float64Array(system.gas.length);
    } else {
      this.seeded = false;
      this.fuelGas = layout([...Object.keys(fuelFeed ?? {}), ...Object.keys(this.fuelChange), ...(liquid ? ['H2O'] : [])]);
      this.fuelIn = amountsOn(this.fuelGas, fuelFeed);
    }
  }

  /**
   * The vapour fraction of each gas at a point of a liquid-water cell (0, 0 for others): saturated
   * where the local water balance (liquid-water.ts) leaves liquid, else its own vapour below that.
   */
  vapourAt(chargeA: number, state: State): [number, number] {
    if (this.request.technology.waterPhase !== 'liquid') return [0, 0];
    if (this.pooled && chargeA !== this.basisA * this.request.utilization) {
      // One circulating electrolyte under the whole cell: every point at the outlet's saturation.
      this.outletVapour ??= this.vapourAt(this.basisA * this.request.utilization, this.at(this.basisA * this.request.utilization));
      return this.outletVapour;
    }
    const dryFuel = sum(state.fuel);
    const dryAir = sum(state.air);
    const split = liquidCellWater(this.request.mode, this.waterFed, chargeA, dryFuel, dryAir, this.vapourFuel, this.vapourAir);
    if (split.saturated) return [this.vapourFuel, this.vapourAir];
    const fraction = (vapour: number, dry: number) => (dry + vapour > 0 ? vapour / (dry + vapour) : 0);
    return [fraction(split.fuelVapour, dryFuel), fraction(split.airVapour, dryAir)];
  }

  /**
   * Start for the equilibrium at utilization u: interpolated between this path's neighbours, or,
   * with seeds from a neighbouring path, the seed at u shifted by how this path differs from the
   * seeds at its nearest solved point.
   */
  private predict(u: number): Float64Array | undefined {
    const seeds = this.seeds;
    if (seeds.length < 2 || seeds[0]!.ln.length !== this.system?.gas.length) return predictFrom(this.solved, u);
    const seeded = predictFrom(seeds, u)!;
    if (this.solved.length === 0) return seeded;
    let nearest = this.solved[0]!;
    for (const s of this.solved) if (Math.abs(s.utilization - u) < Math.abs(nearest.utilization - u)) nearest = s;
    const offset = predictFrom(seeds, nearest.utilization)!;
    for (let j = 0; j < seeded.length; j++) seeded[j] = seeded[j]! + nearest.ln[j]! - offset[j]!;
    return seeded;
  }

  /** The fuel gas's equilibrium at utilization u: an earlier path's answer to the same question, or solved (and kept). */
  private equilibrium(u: number, b: Float64Array, warm: Float64Array | undefined): MinimiserResult {
    const taken = this.equilibria?.take(this.earlier, u, b, warm);
    if (taken) return taken;
    const r = minimiseGibbs(this.system!, this.gRT!, Math.log(this.request.fuelPressureBar), b, this.gGraphite, warm ? { warmStart: warm } : {});
    this.equilibria?.keep(u, b, warm, r);
    return r;
  }

  private remember(u: number, ln: Float64Array): void {
    let k = this.solved.length;
    while (k > 0 && this.solved[k - 1]!.utilization > u) k--;
    this.solved.splice(k, 0, { utilization: u, ln });
  }

  at(chargeA: number): State {
    const electrons = (this.sign * chargeA) / F;
    const air = shifted(this.airGas, this.airIn, this.airChange, electrons);
    let fuel: Float64Array;
    let carbonActivity = 0;
    let elementError = 0;
    const coupleLnBar: Record<string, number> = {};
    if (this.system) {
      const b = new Float64Array(this.bInlet!);
      for (let i = 0; i < b.length; i++) b[i] = b[i]! + this.elementChange![i]! * electrons;
      for (let i = 0; i < b.length; i++) {
        if (!(b[i]! > 0)) {
          throw new CalculationError(`the fuel-electrode gas runs out of ${this.system.elements[i]} before the design utilization`, 'utilization');
        }
      }
      const u = chargeA / this.basisA;
      const warm = this.predict(u);
      let r;
      try {
        r = this.equilibrium(u, b, warm);
      } catch (error) {
        if (!(error instanceof ConvergenceError)) throw error;
        const held = this.system.elements.map((e, i) => `${e} ${b[i]!.toPrecision(4)}`).join(', ');
        throw new CalculationError(
          `the fuel-electrode gas has no gas-phase equilibrium at utilization ${pct(u)} (atoms per second on the feed's scale: ${held}): too little hydrogen and oxygen remain to hold its carbon as gas, so carbon would deposit; add steam or lower the utilization (${error.message})`,
          'utilization',
        );
      }
      this.remember(u, r.lnScaled);
      fuel = r.n;
      carbonActivity = r.carbonActivity;
      elementError = r.elementBalanceError;
      // μ_i/RT = Σ_e a_ie π_e = g°_i/RT + ln(p_i/p°) at equilibrium, p° = 1 bar.
      for (const c of this.couple) coupleLnBar[c.label] = c.atoms.reduce((a, [i, n]) => a + (i >= 0 ? n * r.pi[i]! : Number.NaN), 0) - c.gRT;
    } else {
      fuel = shifted(this.fuelGas, this.fuelIn, this.fuelChange, electrons);
    }
    checkNonNegative(this.fuelGas, fuel, 'fuel');
    checkNonNegative(this.airGas, air, 'air');
    return { fuel, air, carbonActivity, elementError, coupleLnBar };
  }
}

/** Linear prediction of ln n at utilization u from the two nearest solutions (interpolation between neighbours where there are). */
function predictFrom(solved: readonly Solution[], u: number): Float64Array | undefined {
  if (solved.length === 0) return undefined;
  let upper = solved.findIndex((s) => s.utilization >= u);
  if (upper === -1) upper = solved.length;
  const pick = upper === 0 ? [0, 1] : upper === solved.length ? [solved.length - 2, solved.length - 1] : [upper - 1, upper];
  const a = solved[pick[0]!];
  const b = solved[pick[1]!];
  if (!a || !b || a.utilization === b.utilization) return new Float64Array((a ?? b)!.ln);
  const f = (u - a.utilization) / (b.utilization - a.utilization);
  const out = new Float64Array(a.ln.length);
  for (let j = 0; j < out.length; j++) out[j] = a.ln[j]! + f * (b.ln[j]! - a.ln[j]!);
  return out;
}

function checkNonNegative(gas: GasLayout, n: Float64Array, side: 'fuel' | 'air'): void {
  const scale = sum(n) || 1;
  for (let i = 0; i < n.length; i++) {
    if (n[i]! < -1e-12 * scale) {
      throw new CalculationError(`the ${side}-electrode gas runs out of ${gas.labels[i]} before the design utilization: supply more ${gas.labels[i]} to that electrode`, `${side}-electrode-feed`);
    }
    if (n[i]! < 0) n[i] = 0;
  }
}

interface Evaluated extends Sample {
  state: State;
  xFuel: Float64Array;
  xAir: Float64Array;
}

/** E of a fuel-side state and an air-side state (the same point, or the inlet's limit); NaN (a species of the quotient absent) as +∞. */
type NernstOf = (fuel: { state: State; xFuel: Float64Array }, air: { xAir: Float64Array }) => number;

/**
 * The Nernst voltage of a point of the path: the oxygen-potential form wherever the fuel gas is
 * equilibrated and holds the elements of the ion's couple, else the quotient of the ion's
 * electrode reactions over the partial pressures p_i = x_i p at E°(T) (module comment), plus the
 * term of a liquid-water cell's unsaturated water electrode (waterElectrodeVoltage).
 */
function nernstOfPoints(request: FuelPathRequest, model: PathModel, e0: number): NernstOf {
  const { technology, temperatureK } = request;
  const pf = request.fuelPressureBar;
  const pa = request.airPressureBar;
  const fuelP: Record<string, number> = {};
  const airP: Record<string, number> = {};
  const nernstSpecies = [...new Set([...activeQuotient(technology.ion, technology.waterPhase).map((t) => t.species), ...(potentialCouple(technology.ion) ?? []).map((t) => t.species)])];
  const fIdx = nernstSpecies.map((s) => model.fuelGas.index.get(s));
  const aIdx = nernstSpecies.map((s) => model.airGas.index.get(s));
  const unsaturatedVoltage = waterElectrodeVoltage(request, model);
  return (fuel, air) => {
    nernstSpecies.forEach((s, k) => {
      fuelP[s] = fIdx[k] === undefined ? 0 : fuel.xFuel[fIdx[k]!]! * pf;
      airP[s] = aIdx[k] === undefined ? 0 : air.xAir[aIdx[k]!]! * pa;
    });
    const nernstV = model.coupleDefined
      ? oxygenPotentialNernstV(technology.ion, temperatureK, fuel.state.coupleLnBar, airP)
      : nernstVoltage(technology.ion, technology.waterPhase, temperatureK, fuelP, airP, e0) + unsaturatedVoltage(fuel, air);
    return Number.isNaN(nernstV) ? Infinity : nernstV;
  };
}

/** Liquid-water cells: −RT/2F ln(p_H2O,w / (a_w p_s)) of the water electrode's gas (module comment), 0 where it is saturated and for other cells. */
function waterElectrodeVoltage(request: FuelPathRequest, model: PathModel): (fuel: { xFuel: Float64Array }, air: { xAir: Float64Array }) => number {
  const { technology, temperatureK } = request;
  const waterSide = technology.waterElectrode === 'fuel' ? { gas: model.fuelGas, key: 'xFuel' as const, saturated: model.vapourFuel } : { gas: model.airGas, key: 'xAir' as const, saturated: model.vapourAir };
  const waterIndex = waterSide.gas.index.get('H2O');
  return (fuel, air) => {
    if (technology.waterPhase !== 'liquid' || waterIndex === undefined) return 0;
    const x = (waterSide.key === 'xFuel' ? fuel.xFuel : air.xAir)[waterIndex]!;
    return x === waterSide.saturated ? 0 : waterActivityVoltage(temperatureK, x / waterSide.saturated);
  };
}

/**
 * The fuel path at the request's utilization (module comment): E°(T) with the water activity's
 * −RT/2F ln a_w, each point's gases and Nernst voltage, Ē = (1/U_f) ∫₀^U_f E dU over the grid of
 * path-integral.ts, and the inlet as inletOf reports it. `earlier`: paths of the same calculation
 * whose fuel-gas equilibria this one may take where it asks the same question (equilibrium-memo.ts:
 * the same numbers as solving it again).
 */
export function fuelPath(request: FuelPathRequest, earlier: readonly FuelPath[] = []): FuelPath {
  if (!(request.utilization > 0 && request.utilization < 1)) {
    throw new CalculationError(`utilization must lie strictly between 0 and 1, got ${request.utilization}`, 'utilization');
  }
  const basisA = chargeBasis(request);
  const model = new PathModel(request, basisA, earlier.flatMap((p) => equilibriaOf.get(p) ?? []));
  const { technology, temperatureK } = request;
  const e0 = hydrogenStandardVoltage(temperatureK, technology.waterPhase) + waterActivityVoltage(temperatureK, model.waterActivity);
  const nernstOf = nernstOfPoints(request, model, e0);
  const evaluate = (utilization: number): Evaluated => {
    const state = model.at(utilization * basisA);
    const [vapourFuel, vapourAir] = model.vapourAt(utilization * basisA, state);
    const point = { utilization, value: 0, state, xFuel: moleFractions(model.fuelGas, state.fuel, vapourFuel), xAir: moleFractions(model.airGas, state.air, vapourAir) };
    point.value = nernstOf(point, point);
    return point;
  };
  const result = integrateAlongUtilization(evaluate, request.utilization, Math.max(20, Math.round(request.intervals ?? 120)), request.refineV ?? 1e-3);
  const inlet = inletOf(result.points, result.all, model.seeded, nernstOf);
  const path = reportedPath(request, model, basisA, e0, result, inlet);
  if (model.equilibria) equilibriaOf.set(path, model.equilibria);
  return path;
}

/** The equilibria each fuel path solved (PathModel.equilibria), for later paths of the same calculation that are given it (fuelPath's `earlier`). */
const equilibriaOf = new WeakMap<FuelPath, EquilibriumMemo>();

/** How many fuel-gas equilibria a path solved and how many it took from earlier paths; null for a path that keeps none (no fuel-gas equilibrium, or solved from seeds). */
export function equilibriumCounts(path: FuelPath): { solved: number; taken: number } | null {
  const memo = equilibriaOf.get(path);
  return memo ? { solved: memo.solved, taken: memo.taken } : null;
}

/** The path as reported: its points with the species that reach 1e-5 anywhere, the inlet and outlet gases, the mean and the largest errors. */
function reportedPath(request: FuelPathRequest, model: PathModel, basisA: number, e0: number, result: PathIntegral<Evaluated>, inlet: ReturnType<typeof inletOf>): FuelPath {
  const { technology } = request;
  const potentialForm = model.coupleDefined;
  const all = result.all;
  const first = result.points[0]!;
  const last = result.points[result.points.length - 1]!;
  const points = inlet.points;

  // Species worth reporting along the path: those that reach 1e-5 anywhere.
  const keep = (gas: GasLayout, key: 'xFuel' | 'xAir') =>
    gas.labels.filter((_, i) => points.some((p) => p[key][i]! >= 1e-5));
  const fuelKeep = keep(model.fuelGas, 'xFuel');
  const airKeep = keep(model.airGas, 'xAir');
  const pick = (gas: GasLayout, x: Float64Array, labels: string[]) =>
    Object.fromEntries(labels.map((l) => [l, x[gas.index.get(l)!]!]));
  return {
    points: points.map((p) => ({
      utilization: p.utilization,
      nernstV: p.value,
      carbonActivity: p.state.carbonActivity,
      fuelSide: pick(model.fuelGas, p.xFuel, fuelKeep),
      airSide: pick(model.airGas, p.xAir, airKeep),
      fuelCoupleBar: potentialForm ? Object.fromEntries(Object.entries(p.state.coupleLnBar).map(([k, ln]) => [k, Math.exp(ln)])) : null,
    })),
    chargeBasisA: basisA,
    currentA: request.utilization * basisA,
    inletNernstV: inlet.value,
    inlet: inlet.kind,
    inletUtilization: inlet.utilization,
    nernstForm: potentialForm && !model.hasHydrogen ? 'oxygen-potential' : 'quotient',
    outletNernstV: last.value,
    meanNernstV: result.mean,
    maxCarbonActivity: Math.max(...all.map((p) => p.state.carbonActivity)),
    fuelInlet: toRecord(model.fuelGas, first.state.fuel),
    fuelOutlet: toRecord(model.fuelGas, last.state.fuel),
    airInlet: toRecord(model.airGas, first.state.air),
    airOutlet: toRecord(model.airGas, last.state.air),
    elementBalanceError: Math.max(...all.map((p) => p.state.elementError)),
    standardVoltageV: e0,
    waterActivity: model.waterActivity,
    vapourFractionFuel: technology.waterPhase === 'liquid' ? model.vapourFuel : 0,
    vapourFractionAir: technology.waterPhase === 'liquid' ? model.vapourAir : 0,
    solutions: model.solved,
    profile: result.profile,
  };
}

/**
 * The inlet value and the reported points (module comment). The inlet gas's E when it is finite
 * and the fuel gas holds every element of its own (none seeded through the electrolyte). Else,
 * an electrode with no gas at u = 0 takes the gas of the first increment (pure product, the same
 * at every u > 0 near the inlet: the smallest geometric point's), the other its inlet gas; if
 * that E is finite it is the limit u → 0⁺, shown at u = 0. Else E is unbounded at the inlet and
 * the first grid point u_1 stands for it, the reported path starting there.
 */
function inletOf(
  points: Evaluated[],
  all: Evaluated[],
  seeded: boolean,
  nernstOf: (fuel: Evaluated, air: Evaluated) => number,
): { kind: FuelPath['inlet']; value: number; utilization: number; points: Evaluated[] } {
  const first = points[0]!;
  if (Number.isFinite(first.value) && !seeded) return { kind: 'feed', value: first.value, utilization: 0, points };
  const smallest = all.find((p) => p.utilization > 0)!;
  const fuel = sum(first.state.fuel) > 0 ? first : smallest;
  const air = sum(first.state.air) > 0 ? first : smallest;
  const limit = nernstOf(fuel, air);
  if (!seeded && (fuel !== first || air !== first) && Number.isFinite(limit)) {
    const shown: Evaluated = { utilization: 0, value: limit, state: { ...first.state, coupleLnBar: fuel.state.coupleLnBar }, xFuel: fuel.xFuel, xAir: air.xAir };
    return { kind: 'limit', value: limit, utilization: 0, points: [shown, ...points.slice(1)] };
  }
  const increment = points[1]!;
  return { kind: 'first-increment', value: increment.value, utilization: increment.utilization, points: points.slice(1) };
}
