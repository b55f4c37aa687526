/**
 * Section 5, the method: the derivation of this cell's Nernst equation from the equality of
 * electrochemical potentials at each electrode, its temperature dependence from the species
 * data, and the definitions of the voltage, size, flows, efficiency, heat and carbon figures the
 * results use. Every displayed equation is numbered through the document's EquationBook; the
 * text is chosen for the project's electrolyte, water phase and mode, so the derivation shown is
 * the one its numbers come from.
 */
import type { Results } from '../plant/results-schema.ts';
import { EquationBook, type Equation } from './equation-book.ts';
import { electrodeReactions } from './electrode-reactions.ts';
import { electrolyte } from '../electrochem/electrolytes.ts';
import { equationTable, humidityForms, mixedConductor, type EquationEntry } from './equations.ts';
import { sectionNumber } from './outline.ts';
import { hotSpot } from './local-current.ts';
import { paragraphHtml, prose, type Paragraph } from './prose.ts';
import type { TrustedHtml } from './trusted-html.ts';
import { formatNumber } from './format.ts';
import { EXHAUST_TOLERANCE_K } from '../plant/stack-heat-balance.ts';

/** A paragraph (its segments, and its HTML once its citations are resolved, which the page shows) or a numbered equation. */
export type MethodBlock = { kind: 'paragraph'; paragraph: Paragraph; html?: TrustedHtml } | { kind: 'equation'; equation: Equation };

export interface MethodStep {
  id: string;
  number: string;
  title: string;
  blocks: MethodBlock[];
}

/** Collects the blocks of one step: text and numbered equations (from the equation table) in reading order. */
class Step {
  readonly blocks: MethodBlock[] = [];
  constructor(
    private readonly book: EquationBook,
    private readonly table: ReadonlyMap<string, EquationEntry>,
  ) {}

  text(source: string): this {
    this.blocks.push({ kind: 'paragraph', paragraph: prose(source) });
    return this;
  }

  eq(key: string): this {
    const entry = this.table.get(key);
    if (!entry) throw new Error(`the equation table has no equation "${key}" for these results`);
    this.blocks.push({ kind: 'equation', equation: this.book.define(entry) });
    return this;
  }
}

function equilibrium(step: Step, r: Results): void {
  const reactions = electrodeReactions(r.technology.ion);
  const power = r.technology.mode === 'power';
  step
    .text(
      `In this ${r.technology.name} cell the electrolyte carries the ${reactions.ionName} $${reactions.ionTex}$. Written in the power direction, the fuel electrode (subscript f) and the air electrode (subscript a) react as`,
    )
    .text(`fuel electrode: $${reactions.fuelReaction}$; air electrode: $${reactions.airReaction}$.`)
    .text(
      'At equilibrium (no net current) each reaction balances the electrochemical potentials $\\tilde{\\mu} = \\mu + zF\\phi$ of what it consumes and what it forms; a neutral gas has $\\tilde{\\mu} = \\mu$. The ion is free to move through the electrolyte, so with no net driving force its electrochemical potential is the same at both interfaces:',
    )
    .eq('fuel-balance')
    .eq('air-balance')
    .text('Adding the two balances eliminates the ion:')
    .eq('balance-sum')
    .text(
      `The right-hand side is the Gibbs energy change $\\Delta G$ of $${reactions.overall}$ at the actual gas states. Both electrodes are joined to the external circuit through the same metal, so the chemical potential of the electrons cancels and $\\tilde{\\mu}_{e^-,\\mathrm{a}} - \\tilde{\\mu}_{e^-,\\mathrm{f}} = -F(\\phi_\\mathrm{a} - \\phi_\\mathrm{f}) = -FE$, with $E$ the potential of the air electrode against the fuel electrode. Hence`,
    )
    .eq('gibbs-voltage')
    .text(
      power
        ? 'Two electrons pass per molecule of hydrogen. A positive $E$ drives current from the fuel electrode through the load to the air electrode.'
        : 'Two electrons pass per molecule of water split. In electrolysis the same equilibrium holds: $E$ is the least voltage the cell must be driven above for the reactions to run backwards, splitting water at the fuel electrode side and releasing oxygen at the air electrode.',
    );
}

function nernst(step: Step, r: Results): void {
  const reactions = electrodeReactions(r.technology.ion);
  const liquid = r.technology.waterPhase === 'liquid';
  step
    .text(
      'For ideal gases the chemical potential of each species is its standard value at the cell temperature plus a pressure term, with $p^\\circ = 1\\,\\mathrm{bar}$ the standard pressure of the species data:',
    )
    .eq('chemical-potential')
    .text(
      liquid && r.fuelPath.waterActivity === 1
        ? 'The cell runs with liquid water. Where liquid water is present the gas over it is saturated, its vapour pressure $p_\\mathrm{w}^\\mathrm{sat}(T) = p_\\mathrm{s}(T)$ of IAPWS-IF97, and the water has the standard chemical potential of liquid water, so $E^\\circ$ is that of liquid water. Where the water balance of the cell (Eq. {{water-balance}}) leaves no liquid, the water is vapour below that pressure; liquid and vapour being in equilibrium at $p_\\mathrm{w}^\\mathrm{sat}$, its chemical potential is that of the liquid plus $RT \\ln(p_\\mathrm{H_2O}/p_\\mathrm{w}^\\mathrm{sat})$, the activity of a solvent by its vapour pressure. Putting the chemical potentials into Eq. {{gibbs-voltage}} gives the Nernst equation of this cell, each pressure in bar; its last factor is 1 wherever the gas is saturated:'
        : liquid
          ? `The cell runs with the water of its potassium hydroxide electrolyte, whose activity is $a_\\mathrm{w} = ${formatNumber(r.fuelPath.waterActivity)}$ at the cell temperature (Balej's correlation, 1985): its chemical potential is the standard one of liquid water plus $RT \\ln a_\\mathrm{w}$, and $E^\\circ$ below is that of liquid water less $\\tfrac{RT}{2F} \\ln a_\\mathrm{w}$, $${formatNumber(r.fuelPath.standardVoltage_V, 5)}\\,\\mathrm{V}$ here. The gas over the electrolyte is saturated at $p_\\mathrm{w}^\\mathrm{sat}(T) = a_\\mathrm{w}\\,p_\\mathrm{s}(T)$ where the water balance of the cell (Eq. {{water-balance}}) leaves liquid; where it does not, the water is vapour below that pressure and its chemical potential is lower by $RT \\ln(p_\\mathrm{H_2O}/p_\\mathrm{w}^\\mathrm{sat})$. Putting the chemical potentials into Eq. {{gibbs-voltage}} gives the Nernst equation of this cell, each pressure in bar; its last factor is 1 wherever the gas is saturated:`
        : `Putting the chemical potentials into Eq. {{gibbs-voltage}} gives the Nernst equation of this cell, each pressure in bar (water ${reactions.waterElectrode === 'f' ? 'at the fuel electrode' : 'at the air electrode'}, where the ${reactions.ionName} reaction forms it):`,
    )
    .eq('nernst');
  if (r.technology.ion === 'carbonate') {
    step.text(
      'Carbon dioxide appears on both sides: the air electrode consumes it and the fuel electrode releases it, so a molten carbonate plant returns fuel-side $\\mathrm{CO_2}$ to the air electrode, and both partial pressures count.',
    );
  }
  if (r.technology.ion === 'hydroxide') {
    step.text(
      r.technology.mode === 'power'
        ? 'The water consumed at the air electrode and formed at the fuel electrode belongs to the aqueous electrolyte; one molecule of water joins it for every hydrogen molecule oxidised.'
        : 'In electrolysis the electrode reactions run backwards: the fuel (hydrogen) electrode consumes water from the aqueous electrolyte, $2\\mathrm{H_2O} + 2e^- \\to \\mathrm{H_2} + 2\\mathrm{OH^-}$, and the oxygen electrode forms some back, $2\\mathrm{OH^-} \\to \\tfrac{1}{2}\\mathrm{O_2} + \\mathrm{H_2O} + 2e^-$; the electrolyte loses one molecule of water for every hydrogen molecule made.',
    );
  }
  if (r.fuelPath.nernstForm === 'oxygen-potential') oxygenPotential(step, r);
}

/** The electrolysis plant's method: steam raising or the water loop, the recuperator, the feed and stack heat, compression and the specific energy. */
function electrolysisPlant(step: Step, x: NonNullable<Results['plant']['electrolysis']>): void {
  if (x.steam.length) {
    step
      .text(
        'Every duty is the change of the absolute enthalpy flow $\\sum_i \\dot n_i h^\\circ_i(T)$ of its stream (heats of formation included, species data). The water fed as steam is heated from the feed-water temperature $T_\\mathrm{w}$ to its saturation temperature $T_\\mathrm{s}$ at the electrode pressure (IAPWS-IF97 region 4), evaporated with the latent heat of the species data, and superheated to the electrode inlet temperature $T_\\mathrm{in}$:',
      )
      .eq('steam-raising');
  } else {
    step.text(
      'Every duty is the change of the absolute enthalpy flow $\\sum_i \\dot n_i h^\\circ_i(T)$ of its stream (heats of formation included, species data). The liquid water the stack does not split returns to its inlet through the loop cooler; the make-up (the water split and the vapour the gases carry off) is heated from the feed-water temperature to the inlet temperature.',
    );
  }
  if (x.recuperator) {
    step
      .text(
        "A counter-flow recuperator lets the stack's hot outlets (the hydrogen product and the oxygen side, leaving it at one temperature $T_\\mathrm{ho}$) heat the feeds towards the inlet temperature: the feed water from its supply temperature $T_\\mathrm{w}$ (heated as liquid to $T_\\mathrm{s}$, evaporated at $T_\\mathrm{s}$, superheated) and the gases fed from outside from theirs. The water heater, evaporator, superheater and gas heaters then supply only what it leaves, each from where it leaves the feed. Its duty is the largest that keeps the hot side at least the minimum approach $\\Delta T_\\mathrm{min}$ above the cold side everywhere along the composite curves of the two sides (absolute enthalpies of the species data, the water liquid below $T_\\mathrm{s}$ and vapour above; Linnhoff et al., A User Guide on Process Integration for the Efficient Use of Energy, IChemE 1982). The evaporation is a flat segment of the cold curve at $T_\\mathrm{s}$, where it takes $\\dot n_\\mathrm{w} L(T_\\mathrm{s})$ at one temperature; the approach is checked at both its ends, with the cold side's heat before and after the evaporation, at the feeds' inlet and target temperatures and between. The duty is capped where every feed reaches its inlet temperature, where the hot side reaches its dew point (no water condenses in it) and at the cold end (the hot side leaves at least $\\Delta T_\\mathrm{min}$ above the coldest feed):",
      )
      .eq('recuperator-duty');
  }
  step
    .text(
      `Gases fed with the steam and the sweep gas are heated from their supply temperature to the inlet temperature${x.recuperator ? ' (through the recuperator)' : '; no heat is recovered from the products to the feeds'}. The heat the stack needs below thermoneutral and the losses to ambient are supplied, like the feed heat, by electric heaters or from outside, as the basis says. Where hydrogen is compressed, the product is cooled and dried and compressed in $N$ intercooled stages of equal pressure ratio, each adiabatic with the stated isentropic efficiency, the gas ideal with the species data's $c_p(T)$ (Çengel and Boles, Thermodynamics, ch. 7); $N$ is given, or the fewest whose ratio stays within the stated maximum stage ratio and whose hottest stage discharges within the stated maximum discharge temperature, and every stage's discharge is checked against that maximum or, where the basis states none, against the limit API 618 (5th edition, 2007) sets for reciprocating compressors in the service of the gas (from memory; the limit and whose it is stand in the table below). The system's specific energy counts every electricity the plant takes: the rectifier's AC input with the balance of plant $P_\\mathrm{AC}$, electric heat $Q_\\mathrm{el}$ and the compressor:`,
    )
    .eq('electrolysis-plant-energy');
}

/** The Nernst equation of a fuel gas without hydrogen, from the ion's couple across the electrolyte. */
function oxygenPotential(step: Step, r: Results): void {
  const reactions = electrodeReactions(r.technology.ion);
  const carbonate = r.technology.ion === 'carbonate';
  step
    .text(
      `This fuel gas holds no hydrogen, so Eq. {{nernst}} has no $\\mathrm{H_2}$ or $\\mathrm{H_2O}$ pressure to be evaluated with. The ${reactions.ionName} is formed at the air electrode from ${carbonate ? 'oxygen and carbon dioxide' : 'oxygen'} alone, $${reactions.airReaction}$, and the fuel-electrode gas, being at chemical equilibrium, has a definite ${carbonate ? 'oxygen and carbon dioxide potential' : 'oxygen potential'} as well. The same reaction therefore balances at the fuel electrode:`,
    )
    .eq('couple-balance')
    .text(
      `Subtracting it from Eq. {{air-balance}}, the ion's electrochemical potential cancels, and with Eq. {{gibbs-voltage}} the cell is ${carbonate ? 'an oxygen and carbon dioxide' : 'an oxygen'} concentration cell (the relation of the zirconia oxygen sensor), each pressure in bar:`,
    )
    .eq('nernst-oxygen')
    .text(
      'The oxygen partial pressure of the fuel gas, far below anything measurable (of the order of $10^{-20}\\,\\mathrm{bar}$), follows exactly from the element potentials $\\pi_e$ of its equilibrium: $\\ln(p_{\\mathrm{O_2},\\mathrm{f}}/p^\\circ) = 2\\pi_\\mathrm{O} - \\mu^\\circ_{\\mathrm{O_2}}(T)/RT$. Where the gas holds carbon monoxide and dioxide this is the same voltage as $E = E^\\circ_\\mathrm{CO} + \\frac{RT}{2F}\\ln\\frac{p_\\mathrm{CO}\\,p_{\\mathrm{O_2},\\mathrm{a}}^{1/2}}{p_\\mathrm{CO_2}}$, and where it holds hydrogen and water the same as Eq. {{nernst}}.',
    );
}

function temperature(step: Step, r: Results): void {
  const water = r.technology.waterPhase === 'liquid' ? '\\mathrm{H_2O(l)}' : '\\mathrm{H_2O(g)}';
  step
    .text(
      'The standard enthalpy and entropy of each species at temperature $T$ come from its NASA 9-coefficient polynomials (McBride, Zehe and Gordon, NASA/TP-2002-211556), with the coefficients $a_1 \\ldots a_7$, $b_1$, $b_2$ of the temperature interval that contains $T$:',
    )
    .eq('nasa-h')
    .eq('nasa-s')
    .text(`The enthalpies include the heat of formation at 298.15 K. For $\\mathrm{H_2} + \\tfrac{1}{2}\\mathrm{O_2} \\rightarrow ${water}$ with stoichiometric numbers $\\nu_i$:`)
    .eq('reaction-properties')
    .text('The standard reversible voltage and the thermoneutral voltage, at which the electric work equals the whole enthalpy of reaction and the cell neither releases nor absorbs heat, follow as')
    .eq('standard-voltages');
}

function fuelPath(step: Step, r: Results): void {
  const power = r.technology.mode === 'power';
  step.text(
    power
      ? 'Along the cell the fuel is used up: where the utilization has reached $u$ ($0 \\le u \\le U_\\mathrm{f}$, the outlet at $u = U_\\mathrm{f}$) the electrolyte has carried the charge $u\\,Q_1$, the share $u$ of the charge of the whole feed, moving what its ion carries from one gas to the other, and the local Nernst voltage of Eq. {{nernst}} falls from inlet to outlet.'
      : 'Along the cell the feed is converted: where the conversion has reached $u$ ($0 \\le u \\le X$, the outlet at $u = X$) the electrolyte has carried the charge $u\\,Q_1$, the share $u$ of the charge of the whole feed, and the local Nernst voltage of Eq. {{nernst}} rises from inlet to outlet as the product builds up.',
  );
  if (r.technology.fuelGasEquilibrium) {
    step.text(
      'The fuel electrode catalyses reforming and shift at cell temperature, so at every point the fuel-electrode gas is brought to chemical equilibrium (minimum Gibbs energy by element potentials) before its partial pressures enter the Nernst equation; written with $\\mathrm{CO}$ or $\\mathrm{CH_4}$ instead of $\\mathrm{H_2}$, the electrode reaction gives the same $E$ for an equilibrated gas.',
    );
  } else {
    step.text('Only hydrogen reacts at the fuel electrode; the other species pass through unchanged.');
  }
  if (r.technology.waterPhase === 'liquid') {
    const water = electrodeReactions(r.technology.ion).waterElectrode === 'f' ? 'fuel' : 'air';
    const pooled = electrolyte(r.technology.ion).electrolyteWater;
    step
      .text(
        `${pooled ? 'The water belongs to the circulating electrolyte, which every point of the cell stands over, so the water of the whole cell is balanced, at the outlet $u = U$' : 'The water is balanced at every point $u$ of the cell, not at the outlet alone (the membrane carries water across the cell, not along it)'}: the water fed to both electrodes ${power ? 'plus the water the charge $u\\,Q_1$ has formed' : 'less the water the charge $u\\,Q_1$ has split'}, $\\dot n_\\mathrm{w}$, against the vapour $\\dot n_{\\mathrm{sat},k}$ that saturates each dry gas $k$ at the cell temperature, with $p_\\mathrm{s}$ by IAPWS-IF97 (region 4) and $a_\\mathrm{w}$ the activity of the water the gases stand over (1 for pure water). Where water is left over both gases are saturated and the rest is liquid; where it is not, all of it is vapour, shared in proportion to what saturates each gas (the ${pooled ? 'electrolyte' : 'membrane'} passing water freely between them)${pooled ? ', and every point takes the vapour fractions of the outlet' : ''}:`,
      )
      .eq('water-balance')
      .text(
        `The document uses these gases, saturated or not as the balance gives them, at every point: their partial pressures enter Eq. {{nernst}}, the water's with its vapour at the ${water} electrode, where the reaction ${power ? 'forms' : 'consumes'} it. A gas drier than saturated has the higher Nernst voltage of its own composition; a gas with no vapour at all (dry feeds at the inlet) makes it unbounded there, as for a dry gas-phase inlet. The outlet point is the water of the heat and water table, vapour and liquid as it leaves.`,
      );
  }
  if (r.fuelPath.inlet === 'limit') {
    step.text(
      `One electrode is fed nothing, so at $u = 0$ it holds no gas; the first charge fills it with pure product, and the Nernst voltage of the inlet is the limit $u \\to 0^+$, finite, which the results give at $u = 0$.`,
    );
  } else if (r.fuelPath.inlet === 'first-increment') {
    step.text(
      'The inlet gas holds none of the product of the electrode reaction, so the Nernst voltage rises without bound as $u \\to 0^+$ (like $-\\tfrac{RT}{2F}\\ln u$), while its integrals stay finite. The inlet value the results give is that of the first equilibrated increment of the path, $u_1$, where the table of the path starts.',
    );
  }
  step
    .text(
      'The charge average of the local Nernst voltage is the Gibbs energy the reaction gives up per unit charge, the reference of the voltage efficiency. It is reported as an indicator; it is not the voltage the cell runs at, which the next step derives:',
    )
    .eq('mean-nernst')
    .text('The integral is evaluated numerically on the fuel-path grid: the trapezoidal rule on intervals refined until E changes by less than 1 mV across each, and the logarithmic form of E near an inlet that carries no product.');
}

function voltage(step: Step, r: Results): void {
  const power = r.technology.mode === 'power';
  const mixed = mixedConductor(r);
  const given = r.electrochemistry.voltageSource === 'given';
  if (power) {
    step
      .text(
        'A mixed conductor leaks electrons, lowering the open-circuit voltage by its ionic transference number $t_\\mathrm{ion}$, and gas crossover lowers it further by the allowance $\\Delta V_x$ of the basis:',
      )
      .eq('open-circuit');
  }
  if (r.electrochemistry.activationLoss) {
    kineticVoltage(step, r);
    return;
  }
  step.text(
    mixed
      ? `The interconnects hold the whole cell at one voltage $V$, while the Nernst voltage changes along it. The losses are lumped into one area-specific resistance ASR at the terminals; the electrolyte is a mixed conductor, an ionic path of resistance $\\mathrm{ASR}/t_\\mathrm{ion}$ with the local Nernst voltage as its source beside an electronic path of $\\mathrm{ASR}/(1 - t_\\mathrm{ion})$. At the point $u$ the ions carry $i_\\mathrm{ion}(u)$, the electrons leak $i_e$, the same everywhere since $V$ is, and the terminals carry $i(u)$:`
      : `The interconnects hold the whole cell at one voltage $V$, while the Nernst voltage changes along it. With the losses lumped into one area-specific resistance ASR, the local current density at the point $u$ is driven by the local ${power ? 'excess of the Nernst voltage over the cell voltage' : 'excess of the cell voltage over the Nernst voltage'}:`,
  );
  step.eq('local-current');
  step
    .text(
      `${power ? 'Where E is high, near the inlet, the cell draws the most current; toward the outlet, where E is low, the least' : 'Where E is low, near the inlet, the cell draws the most current; toward the outlet, where E is high, the least'}. The ions carry the charge $Q_1\\,\\mathrm{d}u$ of each step of the path over the area $\\mathrm{d}A$ that their local current density needs, so the active area and the mean current density are`,
    )
    .eq('area-element')
    .text(
      `The mean ${mixed ? 'ionic ' : ''}current density is the harmonic mean of the local one, not its charge average. With ${mixed ? `$j_\\mathrm{ion} = j ${power ? '+' : '-'} i_e$ and ` : ''}the current density $j$ of the basis this is the condition the cell voltage meets:`,
    )
    .eq('uniform-voltage')
    .text(
      `Weighting the local Nernst voltage by the area instead of the charge gives the same law in the familiar form, with the area-mean Nernst voltage $\\bar{E}_A$ where a uniform cell would have its one Nernst voltage (for E the same all along, $V = ${mixed ? 't_\\mathrm{ion} ' : ''}E ${power ? '-' : '+'} ${power ? '\\Delta V_x - ' : ''}j\\,\\mathrm{ASR}$):`,
    )
    .eq('cell-voltage')
    .text(
      power
        ? 'The part of the cell near the outlet draws less current and takes more area than the charge it carries would suggest, so $\\bar{E}_A$ lies below the charge mean $\\bar{E}$ of Eq. {{mean-nernst}}: the charge-mean form $V = \\bar{E} - j\\,\\mathrm{ASR}$ overstates the voltage, the efficiency and the power of each cell.'
        : 'The part of the cell near the outlet draws less current and takes more area than the charge it carries would suggest, so $\\bar{E}_A$ lies above the charge mean $\\bar{E}$ of Eq. {{mean-nernst}}: the charge-mean form $V = \\bar{E} + j\\,\\mathrm{ASR}$ understates the voltage the cell needs.',
    )
    .text(
      given
        ? `The basis gives the cell voltage, so Eq. {{uniform-voltage}} yields the resistance the design implies, for comparison with cell data, and Eq. {{cell-voltage}} states it with $\\bar{E}_A$. A given voltage ${power ? 'at or above the lowest' : 'at or below the highest'} local Nernst voltage${power && mixed ? ' available, $E - \\Delta V_x/t_\\mathrm{ion}$,' : ''} cannot be reached: the local current would reverse before the ${power ? 'utilization' : 'conversion'} is reached, and such a basis is refused.`
        : `The basis gives the area-specific resistance, so the cell voltage is the root of Eq. {{uniform-voltage}}. Its left-hand side grows without bound as $V$ approaches the ${power ? 'lowest local Nernst voltage (the outlet\'s)' : 'highest local Nernst voltage (the outlet\'s)'} and ${power ? 'falls' : 'rises'} steadily away from it, so the root is unique; it is found by Newton's method kept inside that bracket, with the integral evaluated on the fuel path's own model of $E(u)$ (linear between its points, logarithmic near an inlet without product).`,
    )
    .text(
      `The highest local current density, ${hotSpot(r).index === 0 ? 'at the inlet (the hot spot of the cell), follows from Eq. {{local-current}} with the inlet Nernst voltage' : `the hot spot of the cell, follows from Eq. {{local-current}} where the Nernst voltage is ${power ? 'highest' : 'lowest'}`}; a figure of section ${sectionNumber('charts')} shows the local current density and the Nernst voltage along the cell.`,
    );
}

/**
 * The method's step of the cell voltage where the basis gives an activation loss
 * (lib/plant/activation.ts): the loss, the local balance, the area, the condition and the
 * area-mean form with the loss breakdown.
 */
function kineticVoltage(step: Step, r: Results): void {
  const power = r.technology.mode === 'power';
  const given = r.electrochemistry.voltageSource === 'given';
  step
    .text(
      `The interconnects hold the whole cell at one voltage $V$, while the Nernst voltage changes along it. The basis gives the activation (kinetic) loss of the electrodes, one symmetric Butler–Volmer term with the Tafel slope $b$ and the exchange current density $i_0$ on the geometric area (O'Hayre, Cha, Colella and Prinz, Fuel Cell Fundamentals, ch. 3), held at every temperature; the other losses are lumped into one area-specific resistance ASR:`,
    )
    .eq('activation-loss')
    .text(
      `At the point $u$ the local current density is the root of the local balance, ${power ? 'the Nernst voltage less the losses' : 'the Nernst voltage plus the losses'} (both rise steadily with $i$, so the root is unique):`,
    )
    .eq('local-current')
    .text('The ions carry the charge $Q_1\\,\\mathrm{d}u$ of each step of the path over the area $\\mathrm{d}A$ that their local current density needs, so the active area and the mean current density are')
    .eq('area-element')
    .text('The mean current density is the harmonic mean of the local one. Written over the local ohmic loss $i(u)\\,\\mathrm{ASR}$, this is the condition the cell voltage meets:')
    .eq('uniform-voltage')
    .text(
      `Averaging the local balance over the area gives the cell voltage from the area-mean Nernst voltage $\\bar{E}_A$ and the area-mean activation loss $\\bar{\\eta}_A$: the loss breakdown of the design point (a table of section ${sectionNumber('results')} lists its terms):`,
    )
    .eq('cell-voltage')
    .text(
      given
        ? 'The basis gives the cell voltage, so the resistance the design implies is the root of Eq. {{uniform-voltage}} between zero and the resistance the voltage would imply without the activation loss: what is left of the loss at the design point once the activation loss is taken out. It holds the other cases of the basis, with the activation loss at their own current density.'
        : `The basis gives the area-specific resistance, so the cell voltage is the root of Eq. {{uniform-voltage}}, found by Newton's method kept inside its bracket, with the integral evaluated on the fuel path's own model of $E(u)$.`,
    )
    .text(
      `The highest local current density, the hot spot of the cell, is the root of Eq. {{local-current}} where the Nernst voltage is ${power ? 'highest' : 'lowest'}; a figure of section ${sectionNumber('charts')} shows the local current density and the Nernst voltage along the cell.`,
    );
}

/** What the method says of each form of humidity: the water's partial pressure, and the pressure p it is converted at. */
const HUMIDITY_TEXT = {
  'relative-humidity': {
    vapour: 'for a relative humidity $\\varphi$ stated at the temperature $T$ it is $\\varphi\\,p_\\mathrm{s}(T)$',
    pressure: 'A relative humidity is that of the ambient air, so $p$ is the ambient pressure (conditions.ambient-pressure; the standard atmosphere, 1.01325 bar, where the basis gives none).',
  },
  'dew-point': {
    vapour: 'at a dew point $T_\\mathrm{d}$, where the air is saturated, it is $p_\\mathrm{s}(T_\\mathrm{d})$',
    pressure: "A dew point is that of the air fed to the electrode (a humidifier's outlet), so $p$ is the air-electrode pressure.",
  },
} as const;

/** Whether the operating cases are fed the sizing case's air: none, or the ids of those fed air of another water fraction. */
function humidityOfCases(r: Results): string {
  if (!r.cases.length) return '';
  const x = r.conditions.airHumidity?.waterFraction ?? null;
  const own = r.cases.filter((c) => c.ran && (c.conditions?.airHumidity?.waterFraction ?? null) !== x).map((c) => c.id);
  if (!own.length) return ' Every operating case is fed air of this water fraction: none changes the humidity or the pressure it is stated at.';
  const many = own.length > 1;
  return ` The operating case${many ? 's' : ''} ${own.join(', ')} ${many ? 'are' : 'is'} fed air of another water fraction (${many ? 'they change' : 'it changes'} the air fed, its humidity or the pressure the humidity is stated at); the worked lines of section ${sectionNumber('cases')} give the water of ${many ? 'each one' : 'it'} fed humid air.`;
}

/**
 * The water of a humid-air feed (Eq. air-humidity): Dalton's law with the IAPWS-IF97 saturation
 * pressure, at the pressure where the humidity is stated, and whether the operating cases are
 * fed the same air (each case is read as a basis of its own, so a case that changes that
 * pressure or the humidity has its own fraction, worked among its lines).
 */
function airHumidity(step: Step, r: Results): void {
  const forms = humidityForms(r);
  if (!forms.length) return;
  const loop = Boolean(r.plant?.power?.cathodeLoop);
  const kept = loop
    ? ' Compressing and heating the air keep its mole fractions, so $x_\\mathrm{H_2O}$ is that of the burner air as it reaches the burner; the water of the cathode gas is then the loop\'s mole balance.'
    : ' Compressing and heating the air keep its mole fractions, so $x_\\mathrm{H_2O}$ is that of the air at the electrode.';
  step
    .text(
      `${loop ? "The cathode-gas loop's burner air is humid air" : 'The air-electrode feed is humid air'}: dry air, its mole fractions scaled by $1 - x_\\mathrm{H_2O}$, and the water vapour of the humidity the basis states. By Dalton's law for an ideal gas the water's mole fraction is its partial pressure over the total pressure $p$; ${forms.map((f) => HUMIDITY_TEXT[f].vapour).join(', and ')}, with $p_\\mathrm{s}$ the saturation pressure of water on the IAPWS-IF97 saturation line (region 4, eq. 30 of the IAPWS R7-97 release):`,
    )
    .eq('air-humidity')
    .text(`${forms.map((f) => HUMIDITY_TEXT[f].pressure).join(' ')}${kept}${humidityOfCases(r)}`);
}

function faraday(step: Step, r: Results): void {
  const power = r.technology.mode === 'power';
  step
    .text(
      mixedConductor(r)
        ? 'The current of one cell of active area $A$ and of the stack of $N$ cells, each carrying the same current, the stack power, and the ionic current, the part of the current the ions carry through the electrolyte (the electronic leakage $i_e$ of Eq. {{local-current}} carries none), are'
        : 'The current of one cell of active area $A$ and of the stack of $N$ cells, each carrying the same current, and the stack power are',
    )
    .eq('current');
  if (r.operatingPoint.cellsFrom === 'power') {
    step
      .text(power
          ? 'The cell count is the least whole number that delivers the target net power after the power conversion (inverter efficiency $\\eta_\\mathrm{conv}$) and the balance-of-plant share $f_\\mathrm{par}$ of the stack DC power:'
          : 'The cell count is the least whole number that takes the target power input, drawn through the rectifier (efficiency $\\eta_\\mathrm{conv}$) with the balance-of-plant share $f_\\mathrm{par}$ of the stack DC power:')
      .eq('cells');
  } else if (r.operatingPoint.cellsFrom === 'hydrogen') {
    step.text('The cell count is the least whole number that produces the target hydrogen flow, $\\dot m_\\mathrm{cell}$ being the hydrogen one cell makes:').eq('cells');
  }
  if (power) {
    step
      .text(
        "By Faraday's law the current consumes fuel in proportion to the charge its complete oxidation gives up: $z_i = 4n_\\mathrm{C} + n_\\mathrm{H} - 2n_\\mathrm{O}$ electrons per molecule (8 for $\\mathrm{CH_4}$, 2 for $\\mathrm{H_2}$ and $\\mathrm{CO}$). The charge $Q_1$ of the whole fuel feed and the fuel utilization are",
      )
      .eq('charge-basis')
      .text('with $\\bar{z} = \\sum_i x_i z_i$ over the dry fuel. Oxygen is consumed at four electrons per molecule, and the air follows from its oxygen fraction and the air utilization:')
      .eq('oxygen')
      .eq('net-power');
  } else {
    step
      .text("By Faraday's law every two electrons split one molecule of water (or of carbon dioxide, in co-electrolysis), so the products and the conversion of the feed are")
      .eq('production');
  }
  airHumidity(step, r);
}

function efficiency(step: Step, r: Results): void {
  if (r.technology.mode === 'power') {
    step
      .text('The electrical efficiency relates the net power to the fuel fed, on its lower (LHV) and higher (HHV) heating value at 25 °C:')
      .eq('eff-electrical')
      .text('No cell can turn more than the Gibbs energy of the fuel into work. The thermodynamic limit at the cell temperature, with $\\Delta G_\\mathrm{fuel}(T)$ of the complete oxidation of the actual fuel, and the voltage efficiency are')
      .eq('eff-limit')
      .text('For comparison only (a fuel cell is not a heat engine), the Carnot efficiency between the cell temperature and the ambient temperature $T_0$ is')
      .eq('eff-carnot');
  } else {
    step
      .text('The specific electric energy and the efficiency on the heating value of the hydrogen made, with $M_\\mathrm{H_2}$ its molar mass, are')
      .eq('specific-energy')
      .text('and the voltage efficiency, the share of the electric work that the reversible process would need, is')
      .eq('eff-voltage');
  }
}

function heat(step: Step, r: Results): void {
  const power = r.technology.mode === 'power';
  step
    .text(
      'The heat the stack releases follows from an energy balance over it, with every stream at the stack temperature (the isothermal boundary) and the enthalpies of the species data, heats of formation included, so that reforming and shift inside the stack are accounted for:',
    )
    .eq('heat-balance')
    .text(
      mixedConductor(r)
        ? power
          ? 'The reactions run at the rate of the ionic current: dividing the enthalpy they release by $I_\\mathrm{ion}$ gives the effective thermoneutral voltage of the actual gases, and the heat is what they release less the electric work at the terminals:'
          : 'The reactions run at the rate of the ionic current: dividing the enthalpy they absorb by $I_\\mathrm{ion}$ gives the effective thermoneutral voltage of the actual gases, and the heat is the electric work at the terminals less what they absorb:'
        : `Dividing the enthalpy the reactions ${power ? 'release' : 'absorb'} by the current gives the effective thermoneutral voltage of the actual gases, and the heat in terms of voltages:`,
    )
    .eq('heat-voltage')
    .text(power ? 'A positive $Q$ must be removed from the stack.' : 'A positive $Q$ must be removed; a negative one (operation below the thermoneutral voltage) must be supplied to hold the stack temperature.');
  if (r.heat.stackBalance) {
    step
      .text(
        `Air cools this stack: its feeds enter at their stated inlet temperatures $T_\\mathrm{f}$ and $T_\\mathrm{a}$, and an isothermal stack holds its temperature only where the heat it releases is exactly what brings them to it, $Q_\\mathrm{fed} = 0$ (the heat with the inlets as fed, the as-fed boundary). The air-electrode exhaust carries any rest, leaving above the stack temperature where the air cannot carry the heat and below it where the stack cannot heat its feeds; a finding is raised where it leaves more than ${EXHAUST_TOLERANCE_K} K off:`,
      )
      .eq('heat-as-fed');
    if (r.heat.coolingAir_mol_per_s !== null) step.text('The air of the feed composition that closes the balance, entering at $T_\\mathrm{a}$ and leaving at the stack temperature, is the cooling air; the allowed air temperature rise bounds $T - T_\\mathrm{a}$:').eq('cooling-air');
  }
}

function plant(step: Step, r: Results): void {
  step
    .text(
      'The cells are connected in series in a stack, the stacks in series in a string and the strings in parallel on the DC bus. Series elements carry one current and add their voltages; parallel strings share one voltage and add their currents:',
    )
    .eq('plant-layout');
  const e = r.plant.electrical;
  if (e.stacksInSeriesFrom === 'bus-voltage-window') {
    // The cell voltages the layout holds on the bus: the sizing point's and every case's that ran.
    const volts = [r.headline.cellVoltage_V, ...r.cases.flatMap((c) => (c.ran && c.headline ? [c.headline.cellVoltage_V] : []))];
    const low = Math.min(...volts);
    const high = Math.max(...volts);
    const over = r.cases.length ? ` of every operating case (${formatNumber(low)} V to ${formatNumber(high)} V)` : ` (${formatNumber(low)} V)`;
    step.text(
      `The stacks in series come from the DC bus window: the fewest that keep the bus at or above the window's minimum at the lowest cell voltage${over}, $N_\\mathrm{series} = \\lceil V_\\mathrm{bus,min} / (N_\\mathrm{cells/stack}\\, V_\\mathrm{cell,min}) \\rceil = ${formatNumber(e.stacksInSeries)}$, the bus then reaching ${formatNumber(e.stacksInSeries * e.cellsPerStack * high)} V at the highest, within the window (matching a string to the DC input range of its inverter or rectifier: common practice, no source).`,
    );
  }
  const x = r.plant.electrolysis;
  if (x) {
    electrolysisPlant(step, x);
    return;
  }
  if (!r.plant.power) return;
  step
    .text(
      'Every duty is the change of the absolute enthalpy flow $\\sum_i \\dot n_i h^\\circ_i(T)$ of its stream (heats of formation included, species data). The feed water is heated to its saturation temperature $T_\\mathrm{s}$ at the fuel-electrode pressure (IAPWS-IF97 region 4), evaporated with the latent heat of the species data, and superheated to the mixing temperature $T_\\mathrm{mix}$ of the pre-reformer inlet (else the fuel-electrode inlet):',
    )
    .eq('steam-raising')
    .text(
      'The fuel and air are heated from their supply (or blower outlet) temperature to the temperature the next unit takes them at, each duty the enthalpy flow out less the enthalpy flow in; the air blower is one adiabatic stage whose isentropic enthalpy rise $\\Delta h_\\mathrm{s}$ follows from $s^\\circ(T_\\mathrm{s}) = s^\\circ(T_1) + R \\ln(p_2/p_1)$ (Çengel and Boles, Thermodynamics, ch. 7):',
    )
    .eq('plant-duty');
  if (r.plant.power.cathodeLoop) cathodeLoop(step);
  else {
    step
      .text(
        'The fuel-electrode off-gas is burnt with its oxidant; the products leave at chemical equilibrium at the adiabatic temperature, found by minimising the Gibbs energy at fixed enthalpy and pressure:',
      )
      .eq('oxidiser-balance');
  }
  step
    .text(
      "The exhaust is cooled to the stated exit temperature, its water condensed to saturation there where it would be supersaturated; the plant's heaters take their net duty $D$ first and the heat lost to ambient $Q_\\mathrm{loss}$ is subtracted. The heat delivered and the total efficiency of combined heat and power are",
    )
    .eq('delivered-heat')
    .eq('chp-efficiency');
}

/** A carbonate cell's cathode-gas loop, which burns the off-gas in place of the oxidiser (lib/plant/cathode-loop.ts, power-cathode-loop.ts). */
function cathodeLoop(step: Step): void {
  step
    .text(
      "The cathode gas is made by the plant: the catalytic burner burns the fuel-electrode off-gas completely (C to CO2, H to H2O, N to N2) with the burner air $A$ of composition $y$, taking the oxygen demand $D = \\sum_i \\dot n_i z_i / 4$ from it, and its products $B$ mix with the share $r$ of the air-electrode exhaust that is recycled. The cells take $c$: $I/4F$ of O2 and $I/2F$ of CO2 (the carbonate cell's air-electrode reaction, CO2 + ½ O2 + 2e⁻ → CO3²⁻). Species by species the loop conserves mass (the mole balance below); the air utilization and the O2 fraction $x_\\mathrm{O_2}$ at the inlet fix the O2 entering, $Q$, and the gas entering, $N$, and the O2 row and the sum over species of the balance ($N_B$ the moles of $B$ besides its O2, $c_t$ the cells' whole take) are two linear equations in $A$ and $r$, solved by Cramer's rule. The loop exists where $0 \\le r < 1$; an O2 fraction above what the burner's products alone carry (r < 0) is refused at the basis field. The burner's products leave at the adiabatic temperature $T_\\mathrm{b}$ of complete combustion, $H_B(T_\\mathrm{b}) = H_\\mathrm{off\\text{-}gas}(T) + H_\\mathrm{air}$, and mix adiabatically with the recycle at the air-electrode exhaust temperature (the steady-flow energy balance, Çengel and Boles, Thermodynamics, ch. 5); the loop's heater or cooler, a duty above, brings the mixture to the stated air-electrode inlet temperature. The exhaust not recycled leaves the loop:",
    )
    .eq('cathode-loop');
}

function carbon(step: Step): void {
  step
    .text('Carbon can deposit where the fuel-electrode gas has a carbon activity above 1 relative to graphite. For a gas at equilibrium the Boudouard and cracking equilibria give the same activity:')
    .eq('carbon-activity')
    .text('The least steam-to-carbon ratio that keeps the equilibrated feed below $a_\\mathrm{C} = 1$ is found by root finding at the stack temperature and, with a pre-reformer, at its temperature; the margin of the design is')
    .eq('carbon-margin');
}

function cases(step: Step, r: Results, table: ReadonlyMap<string, EquationEntry>): void {
  step.text(
    'The sizing case fixes the hardware: it finds the cells $N_\\mathrm{req}$ its design point needs (its results, in the sections above, are those of $N_\\mathrm{req}$ cells), and the electrical layout installs them as whole stacks, $N = N_\\mathrm{inst} \\ge N_\\mathrm{req}$; with the active area $A$ of a cell and the area-specific resistance of new cells at the sizing case\'s temperature (a resistance law scales it from there) that is the hardware. Every other case runs on the $N$ cells installed, so that its stack, its flows and its DC bus count the same cells, its fuel path, voltage, flows and heat following from the equations above with its own values. The string is sized over the cases\' cell voltages, which depend on the cells they run on: the cases and the layout are found together, the cases on $N_\\mathrm{req}$ first and then on the cells that layout installs, until the layout installs the cells the cases ran on, each layout holding the bus over the cell voltages of every round so far. The sizing case itself runs on them too, at its own load: where it sizes its cells from a target, the $N_\\mathrm{inst}$ cells meet that target at a current density below the design one (the relation below); where its cells are given, at its current density. That installed point, not the $N_\\mathrm{req}$ cells of the sizing calculation, is the sizing case among the cases, in the envelope and on the DC bus, so that no number counts the required cells against the installed ones; where the stacks install exactly the cells required it is the sizing calculation itself.',
  );
  if (table.has('case-load')) {
    step
      .text(
        r.technology.mode === 'power'
          ? 'A case that states a target power finds the current density $j$ at which the $N$ cells deliver it, on the rising branch of the power curve (the first crossing from below; a target above the greatest power cannot be met and is a finding of the case):'
          : 'A case that states a target hydrogen production or power input finds the current density $j$ at which the $N$ cells meet it:',
      )
      .eq('case-load');
  }
  if (table.has('case-bus-power')) {
    step.text('The DC power at the bus of a case is that of the sizing case\'s layout carrying the case\'s cell voltage and current:').eq('case-bus-power');
  }
  if (table.has('case-water')) {
    step
      .text(
        r.technology.mode === 'power'
          ? 'The water a case raises to steam is the steam added to its dry fuel: with $x_\\mathrm{H_2O}$ the steam\'s mole fraction in the fuel feed of $\\dot n_\\mathrm{feed}$ and $x_\\mathrm{d}$ the water\'s mole fraction in the dry fuel,'
          : 'The water a case feeds is the water, vapour and liquid, of the water electrode\'s inlet:',
      )
      .eq('case-water');
  }
  if (table.has('case-coolant')) {
    step
      .text('The coolant of a case takes up the heat $Q$ warming from $T_\\mathrm{c}$ to the stack temperature $T$: the air of an air-cooled stack the stack heat less what brings the fuel feed to $T$, from its stated inlet temperature $T_\\mathrm{c} = T_\\mathrm{a}$ (the air that closes the stack heat balance); the water loop the stack heat, by the allowed rise, $T_\\mathrm{c} = T - \\Delta T$. With $M_\\mathrm{c}$ its molar mass and $x_i$ its mole fractions,')
      .eq('case-coolant');
  }
  if (table.has('case-mass')) {
    step
      .text(
        r.technology.mode === 'power'
          ? 'The mass flows the envelope takes are those of the case\'s stream table: the air at the air-electrode inlet, $\\dot n_\\mathrm{air}$ of mean molar mass $M_\\mathrm{air}$, and the dry fuel in the fuel feed of $\\dot n_\\mathrm{feed}$ (its steam, beyond the dry fuel\'s own water, taken off), $M_\\mathrm{d}$ the dry fuel\'s mean molar mass:'
          : 'The mass flows the envelope takes are those of the case\'s stream table: the hydrogen made, and the water split, the water of the stack\'s inlets less that of its outlets:',
      )
      .eq('case-mass');
  }
  if (table.has('case-heat-recovered')) {
    step
      .text('The heat recovered from the exhaust of a case is the enthalpy the exhaust brings in less that of the gas and the condensate leaving at the exit temperature (enthalpy is a state function, so where the water condenses does not matter):')
      .eq('case-heat-recovered');
  }
  if (table.has('case-heat-demand')) {
    step.text('Below the thermoneutral voltage an electrolysis stack takes heat: the heat to supply is the enthalpy balance of the stack with its sign reversed,').eq('case-heat-demand');
  }
  if (table.has('case-plant-heat')) {
    step
      .text("The heat a case supplies is what its feeds' heaters give (the positive duties of its duty table) and, below the thermoneutral voltage, what its stack takes with its losses; the heat its coolers remove is the sum of its negative duties, the water-loop cooler and the others (product cooler, compressor inter- and after-coolers):")
      .eq('case-plant-heat');
  }
  if (table.has('degradation')) {
    step
      .text('At the end of life the cell voltage (at the same current density) or the area-specific resistance has changed in proportion to the operating time $t$ at the stated rate $r$, a linear law (common practice, no source):')
      .eq('degradation');
  }
  step.text('The envelope takes, for each quantity that sizes equipment, the largest or the smallest value over the cases that ran and names the case that sets it.');
}

/** Replaces {{key}} in a step's text with the equation number (our own markers in our own text), then makes each paragraph's HTML. */
function resolveCitations(steps: MethodStep[], book: EquationBook): void {
  for (const step of steps) {
    for (const block of step.blocks) {
      if (block.kind !== 'paragraph') continue;
      for (const segment of block.paragraph) {
        if (segment.text !== undefined) segment.text = segment.text.replace(/\{\{([a-z-]+)\}\}/g, (_, key: string) => String(book.get(key).number));
      }
      block.html = paragraphHtml(block.paragraph);
    }
  }
}

/** Whether the carbon equations apply: a fuel with carbon on the fuel path. */
function hasCarbon(r: Results): boolean {
  return r.carbon.maxCarbonActivity !== null || r.carbon.minimumSteamToCarbonStack !== null;
}

export function methodSection(r: Results, book: EquationBook, sectionNumber: number): MethodStep[] {
  const parts: [string, string, (s: Step) => void][] = [
    ['method-equilibrium', 'Equilibrium at the electrodes', (s) => equilibrium(s, r)],
    ['method-nernst', 'The Nernst equation of this cell', (s) => nernst(s, r)],
    ['method-temperature', 'Temperature dependence from the species data', (s) => temperature(s, r)],
    ['method-path', 'Along the fuel path', (s) => fuelPath(s, r)],
    ['method-voltage', 'Cell voltage', (s) => voltage(s, r)],
    ['method-faraday', "Current, size and flows by Faraday's law", (s) => faraday(s, r)],
    ['method-efficiency', 'Efficiency', (s) => efficiency(s, r)],
    ['method-heat', 'Heat', (s) => heat(s, r)],
  ];
  if (hasCarbon(r)) parts.push(['method-carbon', 'Carbon deposition', (s) => carbon(s)]);
  parts.push(['method-plant', 'The plant around the stack', (s) => plant(s, r)]);
  const table = equationTable(r);
  if (r.cases.length) parts.push(['method-cases', 'Operating cases on the sizing hardware', (s) => cases(s, r, table)]);
  const steps = parts.map(([id, title, fill], i) => {
    const step = new Step(book, table);
    fill(step);
    return { id, number: `${sectionNumber}.${i + 1}`, title, blocks: step.blocks };
  });
  resolveCitations(steps, book);
  return steps;
}
