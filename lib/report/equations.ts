/**
 * The equation table: every numbered equation of a document, once. An entry is what the method
 * section displays (`display`) and, for the equations the results work through, its relations:
 * a left-hand side and a right-hand side written once over named quantities. The method shows a
 * relation with its symbols; a worked line of section 6 shows the same relation with the symbols
 * of the line, then with this design's numbers put in (the same function, given numbers and a
 * multiplication sign where the symbols stand side by side), and the result. So the definition,
 * the substitution and the result of a line can never disagree with the method.
 *
 * The entries depend on the design only where its equations do: the electrolyte (the electrode
 * reactions and the Nernst quotient of lib/electrochem/electrolytes.ts), the mode (the signs of
 * the voltage and heat equations) and what sets the cell count.
 */
import { activeQuotient, potentialCouple, type QuotientTerm } from '../electrochem/electrolytes.ts';
import type { Results } from '../plant/results-schema.ts';
import { electrodeReactions } from './electrode-reactions.ts';
import { quotientTex } from './nernst-tex.ts';
import { texPressure } from './tex.ts';

/** How the quantities of a right-hand side are joined: the method's symbols, or a worked line's numbers. */
export interface Ops {
  /** Between two factors: a thin space between symbols, × between numbers. */
  times: string;
  /** Parentheses around a factor: sized to their content between symbols, plain between numbers. */
  open: string;
  close: string;
}

const SYMBOLS: Ops = { times: '\\,', open: '\\left(', close: '\\right)' };
export const NUMBERS: Ops = { times: '\\times', open: '(', close: ')' };

/** A symbol: its LaTeX; `ofT` where the method writes it as a function of temperature (ΔH°(T)); `listed` where a worked line names the number by a shorter symbol than the equation writes out. */
export interface Symbol {
  tex: string;
  ofT?: boolean;
  listed?: string;
}

export interface Relation {
  lhs: Symbol;
  /** The quantities the right-hand side names, by name. */
  symbols: Record<string, Symbol>;
  rhs: (q: Record<string, string>, op: Ops) => string;
  /**
   * A left-hand side written over the same quantities, where the relation equates two
   * expressions (an integral and what it must equal): the method shows it in symbols, a worked
   * line with this design's numbers too; `lhs` then only names the value.
   */
  lhsOf?: (q: Record<string, string>, op: Ops) => string;
}

export interface EquationEntry {
  key: string;
  relations: Record<string, Relation>;
  /** The equation as the method displays it (its relations in their method form, and any text around them). */
  display: () => string;
}

/** Writes a relation of an entry in its method form: `lhs = rhs`, or the right-hand side alone. */
type Show = (name: string, part?: 'relation' | 'rhs') => string;

/** A symbol as the method writes it, or as a worked line does (at this design's temperature: ΔH°, not ΔH°(T)). */
export function symbolTex(s: Symbol, form: 'method' | 'line'): string {
  return form === 'method' && s.ofT ? `${s.tex}(T)` : s.tex;
}

const symbolsOf = (relation: Relation, form: 'method' | 'line') => Object.fromEntries(Object.entries(relation.symbols).map(([name, s]) => [name, symbolTex(s, form)]));

/** The right-hand side of a relation in symbols. */
export function symbolicRhs(relation: Relation, form: 'method' | 'line'): string {
  return relation.rhs(symbolsOf(relation, form), SYMBOLS);
}

/** The left-hand side of a relation in symbols: its expression (`lhsOf`), else its symbol. */
export function symbolicLhs(relation: Relation, form: 'method' | 'line'): string {
  return relation.lhsOf ? relation.lhsOf(symbolsOf(relation, form), SYMBOLS) : symbolTex(relation.lhs, form);
}

/** `lhs = rhs` as the method writes it. */
function methodForm(relation: Relation): string {
  return `${symbolicLhs(relation, 'method')} = ${symbolicRhs(relation, 'method')}`;
}

const sym = (tex: string, more: Omit<Symbol, 'tex'> = {}): Symbol => ({ tex, ...more });
const F = sym('F');
const T = sym('T');

/** An entry the results do not work through: a fixed display. */
const shown = (key: string, tex: string): EquationEntry => ({ key, relations: {}, display: () => tex });

/** An entry whose display is its relations in the method's form: as `display` writes them, else side by side, separated by \qquad. */
function entry(key: string, relations: Record<string, Relation>, display?: (show: Show) => string): EquationEntry {
  const show: Show = (name, part = 'relation') => (part === 'rhs' ? symbolicRhs(relations[name]!, 'method') : methodForm(relations[name]!));
  return { key, relations, display: () => (display ? display(show) : Object.keys(relations).map((name) => show(name)).join(', \\qquad ')) };
}

/** The equilibrium at the electrodes: the potential balances of the electrolyte's reactions, their sum, ΔG = −2FE. */
function electrodeEquations(r: Results): EquationEntry[] {
  const reactions = electrodeReactions(r.technology.ion);
  return [
    shown('fuel-balance', reactions.fuelBalance),
    shown('air-balance', reactions.airBalance),
    shown('balance-sum', reactions.sum),
    shown('gibbs-voltage', '\\Delta G = -2\\,F\\,E \\qquad\\Longleftrightarrow\\qquad E = -\\frac{\\Delta G}{2\\,F}'),
    shown('chemical-potential', '\\mu_i = \\mu_i^\\circ(T) + R\\,T\\,\\ln\\frac{p_i}{p^\\circ}'),
  ];
}

/** The name of the partial pressure a quotient term substitutes: p_H2_f. */
export const pressureName = (t: QuotientTerm) => `p_${t.species}_${t.electrode}`;

/** The name of the vapour pressure of a liquid-water cell's water, a_w p_s(T), in the Nernst equation. */
export const WATER_SATURATION = 'p_wsat';

/**
 * The water vapour term of a liquid-water cell's Nernst equation: the water's activity
 * p_H2O,w/(a_w p_s) at the electrode whose reaction forms or consumes it (1 where the gas is
 * saturated), lib/equilibrium/fuel-path.ts; null for a gas-phase cell.
 */
export function liquidWaterTerm(r: Results): QuotientTerm | null {
  if (r.technology.waterPhase !== 'liquid') return null;
  return { species: 'H2O', electrode: electrodeReactions(r.technology.ion).waterElectrode, power: -1, water: true };
}

/** The Nernst equation of this cell: its quotient from the electrolyte's reactions; with liquid water, the water's activity p_H2O/p_w^sat in place of its pressure. */
function nernstEquation(r: Results): EquationEntry {
  const terms = activeQuotient(r.technology.ion, r.technology.waterPhase);
  const water = liquidWaterTerm(r);
  const pressures = Object.fromEntries([...terms, ...(water ? [water] : [])].map((t) => [pressureName(t), sym(texPressure(t.species, t.electrode))]));
  const saturation: Record<string, Symbol> = water ? { [WATER_SATURATION]: sym('p_\\mathrm{w}^\\mathrm{sat}', { ofT: true }) } : {};
  const E0 = sym('E^\\circ', { ofT: true });
  return entry(
    'nernst',
    {
      voltage: {
        lhs: sym('E'),
        symbols: { E0, R: sym('R'), T, F, ...pressures, ...saturation },
        rhs: (q, op) => {
          const quotient = quotientTex(terms, (t) => q[pressureName(t)]!, op.times);
          const activity = water ? `${op.times}\\frac{${q[WATER_SATURATION]}}{${q[pressureName(water)]}}` : '';
          return `${q.E0} + \\frac{${q.R}${op.times}${q.T}}{2${op.times}${q.F}}\\,\\ln ${water ? `\\left(${quotient}${activity}\\right)` : quotient}`;
        },
      },
      standard: { lhs: E0, symbols: { dG: sym('\\Delta G^\\circ', { ofT: true }), F }, rhs: (q, op) => `-\\frac{${q.dG}}{2${op.times}${q.F}}` },
    },
  );
}

/**
 * The couple's terms of the oxygen-potential form as a quotient: each gas of the couple at the
 * air electrode over the same gas at the fuel electrode, to its coefficient (oxide: p_O2,a^½ over
 * p_O2,f^½; carbonate with p_CO2,a over p_CO2,f too).
 */
export function coupleQuotient(r: Results): QuotientTerm[] {
  const couple = potentialCouple(r.technology.ion) ?? [];
  return [
    ...couple.map((t): QuotientTerm => ({ species: t.species, electrode: 'a', power: t.coefficient, water: false })),
    ...couple.map((t): QuotientTerm => ({ species: t.species, electrode: 'f', power: -t.coefficient, water: false })),
  ];
}

/**
 * The Nernst voltage from the ion's couple across the electrolyte (the oxygen-potential form),
 * where the fuel gas holds no hydrogen to write the quotient of Eq. nernst with: the air-electrode
 * reaction balanced at the fuel electrode too, the difference of the two balances, and E.
 */
function oxygenPotentialEquations(r: Results): EquationEntry[] {
  const couple = electrodeReactions(r.technology.ion).couple;
  if (r.fuelPath.nernstForm !== 'oxygen-potential' || !couple) return [];
  const terms = coupleQuotient(r);
  const pressures = Object.fromEntries(terms.map((t) => [pressureName(t), sym(texPressure(t.species, t.electrode))]));
  return [
    shown('couple-balance', couple.fuelBalance),
    entry(
      'nernst-oxygen',
      {
        voltage: {
          lhs: sym('E'),
          symbols: { R: sym('R'), T, F, ...pressures },
          rhs: (q, op) => `\\frac{${q.R}${op.times}${q.T}}{2${op.times}${q.F}}\\,\\ln ${quotientTex(terms, (t) => q[pressureName(t)]!, op.times)}`,
        },
      },
      (show) => `${couple.difference} = -2\\,F\\,E \\quad\\Longrightarrow\\quad ${show('voltage')}`,
    ),
  ];
}

/** Properties of the species and of the hydrogen reaction from the NASA polynomials. */
function temperatureEquations(): EquationEntry[] {
  const dH = sym('\\Delta H^\\circ', { ofT: true });
  return [
    shown('nasa-h', '\\frac{h_i^\\circ(T)}{R\\,T} = -\\frac{a_1}{T^2} + \\frac{a_2\\ln T}{T} + a_3 + \\frac{a_4 T}{2} + \\frac{a_5 T^2}{3} + \\frac{a_6 T^3}{4} + \\frac{a_7 T^4}{5} + \\frac{b_1}{T}'),
    shown('nasa-s', '\\frac{s_i^\\circ(T)}{R} = -\\frac{a_1}{2\\,T^2} - \\frac{a_2}{T} + a_3\\ln T + a_4 T + \\frac{a_5 T^2}{2} + \\frac{a_6 T^3}{3} + \\frac{a_7 T^4}{4} + b_2'),
    shown('reaction-properties', '\\Delta H^\\circ(T) = \\sum_i \\nu_i\\, h_i^\\circ(T), \\qquad \\Delta S^\\circ(T) = \\sum_i \\nu_i\\, s_i^\\circ(T), \\qquad \\Delta G^\\circ(T) = \\Delta H^\\circ(T) - T\\,\\Delta S^\\circ(T)'),
    entry('standard-voltages', {
      reversible: { lhs: sym('E^\\circ', { ofT: true }), symbols: { dH, T, dS: sym('\\Delta S^\\circ', { ofT: true }), F }, rhs: (q, op) => `-\\frac{${q.dH} - ${q.T}${op.times}${q.dS}}{2${op.times}${q.F}}` },
      thermoneutral: { lhs: sym('V_\\mathrm{tn}', { ofT: true }), symbols: { dH, F }, rhs: (q, op) => `-\\frac{${q.dH}}{2${op.times}${q.F}}` },
    }),
  ];
}

/** Whether the electrolyte leaks electrons (t_ion < 1): the equations then tell the ionic current from the current at the terminals. */
export function mixedConductor(r: Results): boolean {
  return r.electrochemistry.ionicTransferenceNumber < 1;
}

/** The charge-mean Nernst voltage (an indicator) and, in power mode, the open-circuit voltage. */
function openCircuitEquations(power: boolean, U: Symbol): EquationEntry[] {
  const mean = entry('mean-nernst', { mean: { lhs: sym('\\bar{E}'), symbols: { U }, rhs: (q) => `\\frac{1}{${q.U}}\\int_0^{${q.U}} E(u)\\,\\mathrm{d}u` } });
  if (!power) return [mean];
  const open = { lhs: sym('E_\\mathrm{oc}'), symbols: { t: sym('t_\\mathrm{ion}'), Ein: sym('E_\\mathrm{in}'), dV: sym('\\Delta V_x') }, rhs: (q: Record<string, string>, op: Ops) => `${q.t}${op.times}${q.Ein} - ${q.dV}` };
  return [mean, entry('open-circuit', { open })];
}

/**
 * The charge-mean Nernst voltage (an indicator), the open-circuit voltage, and the cell at one
 * voltage: the local current density, the area it takes, the condition the voltage meets (the
 * harmonic mean) and the same law with the area-mean Nernst voltage. A pure ionic conductor
 * (t_ion = 1) is written without the leakage terms, which vanish.
 */
function voltageEquations(r: Results): EquationEntry[] {
  if (r.electrochemistry.activationLoss) return kineticVoltageEquations(r);
  const power = r.technology.mode === 'power';
  const mixed = mixedConductor(r);
  const U = sym(power ? 'U_\\mathrm{f}' : 'X');
  const [t, dV, j, ASR, V, E] = [sym('t_\\mathrm{ion}'), sym('\\Delta V_x'), sym('j'), sym('\\mathrm{ASR}'), sym('V'), sym('E(u)')];
  const EA = sym('\\bar{E}_A');
  const tOf: Record<string, Symbol> = mixed ? { t } : {};
  const dVOf: Record<string, Symbol> = power ? { dV } : {};
  /** t_ion and a multiplication before a factor, or nothing for a pure ionic conductor. */
  const tx = (q: Record<string, string>, op: Ops) => (mixed ? `${q.t}${op.times}` : '');
  const i = mixed ? 'i_\\mathrm{ion}(u)' : 'i(u)';
  const jIon = mixed ? 'j_\\mathrm{ion}' : 'j';
  // The ionic driving voltage y(u): i_ion(u) = y(u)/ASR.
  const drive = (q: Record<string, string>, op: Ops, e: string) => (power ? `${tx(q, op)}${e} - ${q.dV} - ${tx(q, op)}${q.V}` : `${tx(q, op)}${q.V} - ${tx(q, op)}${e}`);
  const local: Record<string, Relation> = {
    terminal: {
      lhs: sym('i(u)'),
      symbols: { ...tOf, E, ...dVOf, V, ASR },
      rhs: (q, op) => (power ? `\\frac{${tx(q, op)}${q.E} - ${q.dV} - ${q.V}}{${q.ASR}}` : `\\frac{${q.V} - ${tx(q, op)}${q.E}}{${q.ASR}}`),
    },
  };
  if (mixed) {
    local.ionic = { lhs: sym(i), symbols: { t, E, ...dVOf, V, ASR }, rhs: (q, op) => `\\frac{${drive(q, op, q.E!)}}{${q.ASR}}` };
    local.leakage = { lhs: sym('i_e'), symbols: { t, V, ASR }, rhs: (q, op) => `\\frac{${op.open}1 - ${q.t}${op.close}${op.times}${q.V}}{${q.ASR}}` };
  }
  const leakageTerm = (q: Record<string, string>, op: Ops) => (mixed ? ` ${power ? '+' : '-'} ${op.open}1 - ${q.t}${op.close}${op.times}${q.V}` : '');
  const cell: Record<string, Relation> = power
    ? {
        voltage: { lhs: V, symbols: { ...tOf, EA, dV, j, ASR }, rhs: (q, op) => `${tx(q, op)}${q.EA} - ${q.dV} - ${q.j}${op.times}${q.ASR}` },
        resistance: { lhs: ASR, symbols: { ...tOf, EA, dV, V, j }, rhs: (q, op) => `\\frac{${tx(q, op)}${q.EA} - ${q.dV} - ${q.V}}{${q.j}}` },
      }
    : {
        voltage: { lhs: V, symbols: { ...tOf, EA, j, ASR }, rhs: (q, op) => `${tx(q, op)}${q.EA} + ${q.j}${op.times}${q.ASR}` },
        resistance: { lhs: ASR, symbols: { V, ...tOf, EA, j }, rhs: (q, op) => `\\frac{${q.V} - ${tx(q, op)}${q.EA}}{${q.j}}` },
      };
  const u = symbolTex(U, 'method');
  return [
    ...openCircuitEquations(power, U),
    entry('local-current', local, (show) =>
      mixed ? `${show('ionic')}, \\qquad ${show('leakage')}, \\qquad i(u) = ${i} ${power ? '-' : '+'} i_e = ${show('terminal', 'rhs')}` : show('terminal'),
    ),
    shown(
      'area-element',
      `\\mathrm{d}A = \\frac{Q_1\\,\\mathrm{d}u}{${i}} \\quad\\Longrightarrow\\quad N A = Q_1 \\int_0^{${u}} \\frac{\\mathrm{d}u}{${i}}, \\qquad ${jIon} = \\frac{${u}\\,Q_1}{N A} = \\frac{${u}}{\\int_0^{${u}} \\mathrm{d}u / ${i}}`,
    ),
    entry('uniform-voltage', {
      balance: {
        lhs: sym('\\mathcal{I}'),
        symbols: { U, ...tOf, ...dVOf, V, j, ASR },
        lhsOf: (q, op) => `\\int_0^{${q.U}} \\frac{\\mathrm{d}u}{${drive(q, op, '{E(u)}')}}`,
        rhs: (q, op) => `\\frac{${q.U}}{${q.j}${op.times}${q.ASR}${leakageTerm(q, op)}}`,
      },
    }),
    entry('cell-voltage', cell, (show) => `${symbolTex(EA, 'method')} = \\frac{1}{N A}\\int E\\,\\mathrm{d}A = \\frac{\\int_0^{${u}} E(u)\\,\\mathrm{d}u / ${i}}{\\int_0^{${u}} \\mathrm{d}u / ${i}}, \\qquad ${show('voltage')}`),
  ];
}

/** η_act(i) = (b/ln 10) arsinh(i/(2 i₀)) over the symbols of a relation, `i` the name of the current density. */
const activationTex = (q: Record<string, string>, op: Ops, i: string) => `\\frac{${q.b}}{\\ln 10}${op.times}\\operatorname{arsinh}${op.open}\\frac{${q[i]}}{2${op.times}${q.i0}}${op.close}`;

/**
 * The cell at one voltage with the activation loss of the basis (lib/plant/activation.ts; a pure
 * ionic conductor, t_ion = 1): the loss, the local current density as the root of the local
 * balance, the area it takes, the condition the voltage meets, written over the local ohmic loss
 * i(u) ASR so that its right-hand side is that of the ohmic cell, and the area-mean form with the
 * area-mean activation loss.
 */
function kineticVoltageEquations(r: Results): EquationEntry[] {
  const power = r.technology.mode === 'power';
  const U = sym(power ? 'U_\\mathrm{f}' : 'X');
  const [dV, j, ASR, V, b, i0] = [sym('\\Delta V_x'), sym('j'), sym('\\mathrm{ASR}'), sym('V'), sym('b'), sym('i_0')];
  const [EA, eta] = [sym('\\bar{E}_A'), sym('\\bar{\\eta}_A')];
  const dVOf: Record<string, Symbol> = power ? { dV } : {};
  const u = symbolTex(U, 'method');
  const cell: Record<string, Relation> = power
    ? {
        voltage: { lhs: V, symbols: { EA, dV, eta, j, ASR }, rhs: (q, op) => `${q.EA} - ${q.dV} - ${q.eta} - ${q.j}${op.times}${q.ASR}` },
        resistance: { lhs: ASR, symbols: { EA, dV, eta, V, j }, rhs: (q) => `\\frac{${q.EA} - ${q.dV} - ${q.eta} - ${q.V}}{${q.j}}` },
      }
    : {
        voltage: { lhs: V, symbols: { EA, eta, j, ASR }, rhs: (q, op) => `${q.EA} + ${q.eta} + ${q.j}${op.times}${q.ASR}` },
        resistance: { lhs: ASR, symbols: { V, EA, eta, j }, rhs: (q) => `\\frac{${q.V} - ${q.EA} - ${q.eta}}{${q.j}}` },
      };
  return [
    ...openCircuitEquations(power, U),
    entry('activation-loss', { loss: { lhs: sym('\\eta_\\mathrm{act}'), symbols: { b, i0, i: sym('i') }, rhs: (q, op) => activationTex(q, op, 'i') } }, (show) =>
      `${show('loss')} \\;\\longrightarrow\\; b\\,\\log_{10}\\frac{i}{i_0} \\quad (i \\gg i_0)`,
    ),
    entry('local-current', {
      terminal: {
        lhs: V,
        symbols: { E: sym('E(u)'), ...dVOf, b, i0, i: sym('i(u)'), ASR },
        rhs: (q, op) => (power ? `${q.E} - ${q.dV} - ${activationTex(q, op, 'i')} - ${q.i}${op.times}${q.ASR}` : `${q.E} + ${activationTex(q, op, 'i')} + ${q.i}${op.times}${q.ASR}`),
      },
    }),
    shown(
      'area-element',
      `\\mathrm{d}A = \\frac{Q_1\\,\\mathrm{d}u}{i(u)} \\quad\\Longrightarrow\\quad N A = Q_1 \\int_0^{${u}} \\frac{\\mathrm{d}u}{i(u)}, \\qquad j = \\frac{${u}\\,Q_1}{N A} = \\frac{${u}}{\\int_0^{${u}} \\mathrm{d}u / i(u)}`,
    ),
    entry('uniform-voltage', {
      balance: {
        lhs: sym('\\mathcal{I}'),
        symbols: { U, j, ASR },
        lhsOf: (q, op) => `\\int_0^{${q.U}} \\frac{\\mathrm{d}u}{${q.ASR}${op.times} i(u)}`,
        rhs: (q, op) => `\\frac{${q.U}}{${q.j}${op.times}${q.ASR}}`,
      },
    }),
    entry(
      'cell-voltage',
      cell,
      (show) =>
        `${symbolTex(EA, 'method')} = \\frac{\\int_0^{${u}} E(u)\\,\\mathrm{d}u / i(u)}{\\int_0^{${u}} \\mathrm{d}u / i(u)}, \\qquad ${symbolTex(eta, 'method')} = \\frac{\\int_0^{${u}} \\eta_\\mathrm{act}(i(u))\\,\\mathrm{d}u / i(u)}{\\int_0^{${u}} \\mathrm{d}u / i(u)}, \\qquad ${show('voltage')}`,
    ),
  ];
}

/** The current the flows follow: I_ion for a mixed conductor (electronic leakage carries no ions), else the stack current I. */
const ionicCurrent = (r: Results): Symbol => (mixedConductor(r) ? sym('I_\\mathrm{ion}') : sym('I'));

/** Oxygen by Faraday's law: four charges per O2. */
const oxygenFlow = (Iion: Symbol): Relation => ({ lhs: sym('\\dot n_\\mathrm{O_2}'), symbols: { I: Iion, F }, rhs: (q, op) => `\\frac{${q.I}}{4${op.times}${q.F}}` });

/**
 * Current, cell count, and the flows by Faraday's law. The flows follow the ionic current: for a
 * mixed conductor I_ion = N A (j ± i_e), the electronic leakage i_e carrying no ions; for a pure
 * ionic conductor it is the stack current I.
 */
function faradayEquations(r: Results): EquationEntry[] {
  const flows = r.technology.mode === 'power' ? fuelCellFlowEquations(r) : electrolysisFlowEquations(r);
  return [currentEquation(r), ...cellCountEquation(r), ...flows];
}

/** The cell and stack current, the stack power P = N V I_cell and, for a mixed conductor, the ionic current. */
function currentEquation(r: Results): EquationEntry {
  const power = r.technology.mode === 'power';
  const mixed = mixedConductor(r);
  const [j, A, N, V, I, Icell] = ['j', 'A', 'N', 'V', 'I', 'I_\\mathrm{cell}'].map((s) => sym(s)) as Symbol[];
  const current: Record<string, Relation> = {
    cell: { lhs: Icell!, symbols: { j: j!, A: A! }, rhs: (q, op) => `${q.j}${op.times}${q.A}` },
    stack: { lhs: I!, symbols: { N: N!, Icell: Icell! }, rhs: (q, op) => `${q.N}${op.times}${q.Icell}` },
    power: { lhs: sym('P'), symbols: { V: V!, I: I! }, rhs: (q, op) => `${q.V}${op.times}${q.I}` },
  };
  if (mixed) {
    current.ionic = {
      lhs: ionicCurrent(r),
      symbols: { N: N!, A: A!, j: j!, t: sym('t_\\mathrm{ion}'), V: V!, ASR: sym('\\mathrm{ASR}') },
      rhs: (q, op) => `${q.N}${op.times}${q.A}${op.times}\\left(${q.j} ${power ? '+' : '-'} \\frac{${op.open}1 - ${q.t}${op.close}${op.times}${q.V}}{${q.ASR}}\\right)`,
    };
  }
  return entry('current', current, (show) => `${show('cell')}, \\qquad ${show('stack')}, \\qquad P = N\\,V\\,I_\\mathrm{cell} = ${show('power', 'rhs')}${mixed ? `, \\qquad I_\\mathrm{ion} = N A\\,(j ${power ? '+' : '-'} i_e) = ${show('ionic', 'rhs')}` : ''}`);
}

/** The cell count where a target sets it: from the target power (delivered η − f, or drawn 1/η + f, per unit of stack power) or hydrogen; none where the basis gives it. */
function cellCountEquation(r: Results): EquationEntry[] {
  const [N, V, Icell, f, eta] = ['N', 'V', 'I_\\mathrm{cell}', 'f_\\mathrm{par}', '\\eta_\\mathrm{conv}'].map((s) => sym(s)) as Symbol[];
  const target = sym('P_\\mathrm{target}');
  if (r.operatingPoint.cellsFrom === 'power') {
    return [
      entry('cells', {
        count: r.technology.mode === 'power'
          ? { lhs: N!, symbols: { P: target, V: V!, Icell: Icell!, eta: eta!, f: f! }, rhs: (q, op) => `\\left\\lceil \\frac{${q.P}}{${q.V}${op.times}${q.Icell}${op.times}(${q.eta} - ${q.f})} \\right\\rceil` }
          : { lhs: N!, symbols: { P: target, V: V!, Icell: Icell!, eta: eta!, f: f! }, rhs: (q, op) => `\\left\\lceil \\frac{${q.P}}{${q.V}${op.times}${q.Icell}${op.times}(1/${q.eta} + ${q.f})} \\right\\rceil` },
      }),
    ];
  }
  if (r.operatingPoint.cellsFrom === 'hydrogen') {
    return [entry('cells', { count: { lhs: N!, symbols: { m: sym('\\dot m_\\mathrm{target}'), mc: sym('\\dot m_\\mathrm{cell}') }, rhs: (q) => `\\left\\lceil \\frac{${q.m}}{${q.mc}} \\right\\rceil` } })];
  }
  return [];
}

/** A fuel cell's fuel by its charge of complete oxidation at the utilization, its oxygen and air, and its net power. */
function fuelCellFlowEquations(r: Results): EquationEntry[] {
  const Iion = ionicCurrent(r);
  const [Q1, Uf, Fz, f] = ['Q_1', 'U_\\mathrm{f}', '\\bar{z}', 'f_\\mathrm{par}'].map((s) => sym(s)) as Symbol[];
  const nFuel = sym('\\dot n_\\mathrm{fuel}');
  return [
    entry(
      'charge-basis',
      {
        charge: { lhs: Q1!, symbols: { I: Iion, U: Uf! }, rhs: (q) => `\\frac{${q.I}}{${q.U}}` },
        utilization: { lhs: Uf!, symbols: { I: Iion, Q: Q1! }, rhs: (q) => `\\frac{${q.I}}{${q.Q}}` },
        fuel: { lhs: nFuel, symbols: { I: Iion, U: Uf!, F, z: Fz! }, rhs: (q, op) => `\\frac{${q.I}}{${q.U}${op.times}${q.F}${op.times}${q.z}}` },
      },
      (show) => `Q_1 = F \\sum_i \\dot n_i\\, z_i = F\\,\\dot n_\\mathrm{fuel}\\,\\bar{z}, \\qquad ${show('utilization')} \\quad\\Longrightarrow\\quad ${show('fuel')}`,
    ),
    entry('oxygen', {
      oxygen: oxygenFlow(Iion),
      air: { lhs: sym('\\dot n_\\mathrm{air}'), symbols: { nO2: sym('\\dot n_\\mathrm{O_2}'), x: sym('x_\\mathrm{O_2}'), U: sym('U_\\mathrm{air}') }, rhs: (q, op) => `\\frac{${q.nO2}}{${q.x}${op.times}${q.U}}` },
    }),
    entry('net-power', { net: { lhs: sym('P_\\mathrm{net}'), symbols: { P: sym('P'), eta: sym('\\eta_\\mathrm{conv}'), f: f! }, rhs: (q, op) => `${q.P}${op.times}(${q.eta} - ${q.f})` } }),
  ];
}

/** The forms of humidity the air-electrode feeds of these results state, the sizing case's and every case's, in the order of the relations. */
export function humidityForms(r: Results): ('dew-point' | 'relative-humidity')[] {
  const stated = [r.conditions.airHumidity, ...r.cases.map((c) => c.conditions?.airHumidity)];
  return (['relative-humidity', 'dew-point'] as const).filter((form) => stated.some((h) => h?.form === form));
}

/** The relation of the air's water fraction for a form of humidity (a key of the entry air-humidity). */
export const HUMIDITY_RELATION = { 'relative-humidity': 'relative', 'dew-point': 'dewPoint' } as const;

/**
 * The water mole fraction of an air-electrode feed of humid air (lib/basis/humid-air.ts): its
 * vapour pressure over the total pressure p, x_H2O = p_H2O/p (Dalton's law for an ideal gas), the
 * vapour pressure φ p_s(T) for a relative humidity φ at T and p_s(T_d) at a dew point T_d, p_s on
 * the IAPWS-IF97 saturation line (region 4, eq. 30; IAPWS R7-97). Both relations are in the
 * entry (a case may state the other form); the method displays the forms the design states.
 */
function humidityEquations(r: Results): EquationEntry[] {
  const forms = humidityForms(r);
  if (!forms.length) return [];
  const [x, p] = [sym('x_\\mathrm{H_2O}'), sym('p')];
  const relations: Record<(typeof HUMIDITY_RELATION)[keyof typeof HUMIDITY_RELATION], Relation> = {
    relative: { lhs: x, symbols: { phi: sym('\\varphi'), ps: sym('p_\\mathrm{s}(T)'), p }, rhs: (q, op) => `\\frac{${q.phi}${op.times}${q.ps}}{${q.p}}` },
    dewPoint: { lhs: x, symbols: { ps: sym('p_\\mathrm{s}(T_\\mathrm{d})'), p }, rhs: (q) => `\\frac{${q.ps}}{${q.p}}` },
  };
  return [entry('air-humidity', relations, (show) => `x_\\mathrm{H_2O} = \\frac{p_\\mathrm{H_2O}}{p} = ${forms.map((f) => show(HUMIDITY_RELATION[f], 'rhs')).join(' \\quad\\text{or}\\quad ')}`)];
}

/** An electrolyser's hydrogen (and CO) and oxygen by Faraday's law, and its conversion against the feed's charge. */
function electrolysisFlowEquations(r: Results): EquationEntry[] {
  const Iion = ionicCurrent(r);
  return [
    entry(
      'production',
      { hydrogen: { lhs: sym('\\dot n_\\mathrm{H_2} + \\dot n_\\mathrm{CO}'), symbols: { I: Iion, F }, rhs: (q, op) => `\\frac{${q.I}}{2${op.times}${q.F}}` }, oxygen: oxygenFlow(Iion) },
      (show) => `${show('hydrogen')}, \\qquad ${show('oxygen')}, \\qquad X = \\frac{${Iion.tex}}{Q_1}, \\quad Q_1 = 2\\,F\\,(\\dot n_\\mathrm{H_2O} + \\dot n_\\mathrm{CO_2})`,
    ),
  ];
}

/** Efficiencies of a fuel cell, or of an electrolyser. */
function efficiencyEquations(r: Results): EquationEntry[] {
  const [V, E, P] = [sym('V'), sym('\\bar{E}'), sym('P')];
  if (r.technology.mode === 'power') {
    return [
      entry('eff-electrical', { electrical: { lhs: sym('\\eta_\\mathrm{el}'), symbols: { P: sym('P_\\mathrm{net}'), L: sym('\\dot n_\\mathrm{fuel}\\,\\mathrm{LHV}') }, rhs: (q) => `\\frac{${q.P}}{${q.L}}` } }),
      entry('eff-limit', {
        limit: { lhs: sym('\\eta_\\mathrm{max}'), symbols: { G: sym('\\Delta G_\\mathrm{fuel}', { ofT: true }), L: sym('\\mathrm{LHV}') }, rhs: (q) => `\\frac{-${q.G}}{${q.L}}` },
        voltage: { lhs: sym('\\eta_V'), symbols: { V, E }, rhs: (q) => `\\frac{${q.V}}{${q.E}}` },
      }),
      entry('eff-carnot', { carnot: { lhs: sym('\\eta_\\mathrm{C}'), symbols: { T0: sym('T_0'), T }, rhs: (q) => `1 - \\frac{${q.T0}}{${q.T}}` } }),
    ];
  }
  const n = sym('\\dot n_\\mathrm{H_2}');
  return [
    entry('specific-energy', {
      specific: { lhs: sym('w'), symbols: { P, n, M: sym('M_\\mathrm{H_2}') }, rhs: (q, op) => `\\frac{${q.P}}{${q.n}${op.times}${q.M}}` },
      // Over electricity alone, charged to every combustible made net of the feed (co-electrolysis: H2, CO and CH4).
      efficiency: { lhs: sym('\\eta_\\mathrm{LHV}'), symbols: { Lp: sym('\\textstyle\\sum_i \\Delta\\dot n_i\\,\\mathrm{LHV}_i', { listed: 'L_\\mathrm{p}' }), P }, rhs: (q) => `\\frac{${q.Lp}}{${q.P}}` },
    }),
    entry('eff-voltage', { voltage: { lhs: sym('\\eta_V'), symbols: { E, V }, rhs: (q) => `\\frac{${q.E}}{${q.V}}` } }),
  ];
}

/** The stack's heat: the energy balance, the same through the effective thermoneutral voltage, and the cooling air. */
function heatEquations(r: Results): EquationEntry[] {
  const power = r.technology.mode === 'power';
  const Hin = sym('\\sum_\\mathrm{in} \\dot n_i\\, h_i(T)', { listed: 'H_\\mathrm{in}' });
  const Hout = sym('\\sum_\\mathrm{out} \\dot n_i\\, h_i(T)', { listed: 'H_\\mathrm{out}' });
  const mixed = mixedConductor(r);
  const [I, Vtn, V] = [sym('I'), sym('V_\\mathrm{tn,eff}'), sym('V')];
  const Iion = ionicCurrent(r);
  // The reactions release V_tn,eff per ionic charge; the terminals carry the electric work I V.
  const heat: Relation = mixed
    ? power
      ? { lhs: sym('Q'), symbols: { Iion, Vtn, I, V }, rhs: (q, op) => `${q.Iion}${op.times}${q.Vtn} - ${q.I}${op.times}${q.V}` }
      : { lhs: sym('Q'), symbols: { I, V, Iion, Vtn }, rhs: (q, op) => `${q.I}${op.times}${q.V} - ${q.Iion}${op.times}${q.Vtn}` }
    : power
      ? { lhs: sym('Q'), symbols: { I, Vtn, V }, rhs: (q, op) => `${q.I}${op.times}${op.open}${q.Vtn} - ${q.V}${op.close}` }
      : { lhs: sym('Q'), symbols: { I, V, Vtn }, rhs: (q, op) => `${q.I}${op.times}${op.open}${q.V} - ${q.Vtn}${op.close}` };
  const out = [
    entry('heat-balance', { balance: { lhs: sym('Q'), symbols: { Hin, Hout, W: sym('W_\\mathrm{in}') }, rhs: (q) => `${q.Hin} - ${q.Hout} + ${q.W}` } }, (show) => `${show('balance')}, \\qquad W_\\mathrm{in} = ${power ? '-P' : '+P'}`),
    entry(
      'heat-voltage',
      {
        thermoneutral: { lhs: Vtn, symbols: { a: sym(power ? 'H_\\mathrm{in}' : 'H_\\mathrm{out}'), b: sym(power ? 'H_\\mathrm{out}' : 'H_\\mathrm{in}'), I: Iion }, rhs: (q) => `\\frac{${q.a} - ${q.b}}{${q.I}}` },
        heat,
      },
    ),
  ];
  if (r.heat.stackBalance) {
    const [Q, dHf, dHa] = [sym('Q'), sym('\\Delta H_\\mathrm{fuel}'), sym('\\Delta H_\\mathrm{air}')];
    const dha = sym('h_\\mathrm{air}(T) - h_\\mathrm{air}(T_\\mathrm{a})', { listed: '\\Delta h_\\mathrm{air}' });
    out.push(
      entry('heat-as-fed', { fed: { lhs: sym('Q_\\mathrm{fed}'), symbols: { Q, dHf, dHa }, rhs: (q) => `${q.Q} - ${q.dHf} - ${q.dHa}` } }, (show) => `${show('fed')}, \\qquad \\Delta H_\\mathrm{fuel} = \\sum_\\mathrm{fuel\\,in} \\dot n_i \\left[h_i(T) - h_i(T_\\mathrm{f})\\right], \\quad \\Delta H_\\mathrm{air} = \\dot n_\\mathrm{air} \\left[h_\\mathrm{air}(T) - h_\\mathrm{air}(T_\\mathrm{a})\\right]`),
      entry('cooling-air', { air: { lhs: sym('\\dot n_\\mathrm{air,close}'), symbols: { Q, dHf, dha }, rhs: (q) => `\\frac{${q.Q} - ${q.dHf}}{${q.dha}}` } }),
    );
  }
  return out;
}

/** Carbon activity and the margin of the steam-to-carbon ratio. */
function carbonEquations(): EquationEntry[] {
  const [sc, st, pr] = [sym('(S/C)_\\mathrm{design}'), sym('(S/C)_\\mathrm{min,stack}'), sym('(S/C)_\\mathrm{min,pre}')];
  const margin = sym('\\Delta(S/C)');
  return [
    shown('carbon-activity', 'a_\\mathrm{C} = K_\\mathrm{B}\\,\\frac{p_\\mathrm{CO}^2}{p_\\mathrm{CO_2}} = K_\\mathrm{M}\\,\\frac{p_\\mathrm{CH_4}}{p_\\mathrm{H_2}^2}, \\qquad K = \\exp\\left(-\\frac{\\Delta G^\\circ}{R\\,T}\\right)'),
    entry(
      'carbon-margin',
      {
        margin: { lhs: margin, symbols: { sc, st, pr }, rhs: (q) => `${q.sc} - \\max\\left[${q.st},\\ ${q.pr}\\right]` },
        stackOnly: { lhs: margin, symbols: { sc, st }, rhs: (q) => `${q.sc} - ${q.st}` },
      },
      (show) => show('margin'),
    ),
  ];
}

/** The plant around the stack: the electrical layout, and in power mode the steam raising, the oxidiser's energy balance, the heat delivered and the CHP efficiency. */
function plantEquations(r: Results): EquationEntry[] {
  const steamRaised = r.plant.power || r.plant.electrolysis?.steam.length;
  return [
    layoutEquation(r.technology.mode === 'power'),
    ...(steamRaised ? [steamRaisingEquation(r)] : []),
    ...(r.plant.electrolysis ? [electrolysisPlantEquation()] : []),
    ...(r.plant.electrolysis?.recuperator ? [recuperatorEquation()] : []),
    ...(r.plant.power ? powerPlantEquations() : []),
    ...(r.plant.power?.cathodeLoop ? [cathodeLoopEquation()] : []),
  ];
}

/**
 * The electrical layout: the cells installed in whole stacks, the cell current at the current
 * density the bus carries, the stack and bus voltage of cells and stacks in series, the bus
 * current of the strings in parallel, the DC power and the converter's AC power.
 */
function layoutEquation(power: boolean): EquationEntry {
  const Vs = sym('V_\\mathrm{stack}');
  const [m, k, n, Icell, Vbus, Ibus, Pdc, eta] = ['n_\\mathrm{series}', 'n_\\mathrm{strings}', 'n_\\mathrm{cells}', 'I_\\mathrm{cell}', 'V_\\mathrm{bus}', 'I_\\mathrm{bus}', 'P_\\mathrm{DC}', '\\eta_\\mathrm{conv}'].map((x) => sym(x)) as Symbol[];
  return entry(
    'plant-layout',
    {
      installed: { lhs: sym('N_\\mathrm{inst}'), symbols: { m: m!, k: k!, n: n! }, rhs: (q, op) => `${q.m}${op.times}${q.k}${op.times}${q.n}` },
      cell: { lhs: Icell!, symbols: { j: sym('j'), A: sym('A') }, rhs: (q, op) => `${q.j}${op.times}${q.A}` },
      stack: { lhs: Vs, symbols: { n: n!, V: sym('V') }, rhs: (q, op) => `${q.n}${op.times}${q.V}` },
      bus: { lhs: Vbus!, symbols: { m: m!, Vs }, rhs: (q, op) => `${q.m}${op.times}${q.Vs}` },
      current: { lhs: Ibus!, symbols: { k: k!, Icell: Icell! }, rhs: (q, op) => `${q.k}${op.times}${q.Icell}` },
      dc: { lhs: Pdc!, symbols: { Vbus: Vbus!, Ibus: Ibus! }, rhs: (q, op) => `${q.Vbus}${op.times}${q.Ibus}` },
      ac: power
        ? { lhs: sym('P_\\mathrm{AC}'), symbols: { P: Pdc!, eta: eta! }, rhs: (q, op) => `${q.eta}${op.times}${q.P}` }
        : { lhs: sym('P_\\mathrm{AC}'), symbols: { P: Pdc!, eta: eta! }, rhs: (q) => `\\frac{${q.P}}{${q.eta}}` },
    },
    // Lines of two relations each: on one line they were wider than the A4 text column.
    (show) =>
      `\\begin{gathered} ${show('installed')}, \\qquad ${show('cell')}, \\\\ ${show('stack')}, \\qquad ${show('bus')}, \\\\ ${show('current')}, \\qquad I_\\mathrm{stack} = I_\\mathrm{string} = I_\\mathrm{cell}, \\\\ ${show('dc')}, \\qquad ${show('ac')} \\end{gathered}`,
  );
}

/** Steam raised from water: the liquid heated to saturation, the latent heat, the vapour heated on (to the fuel's mixing point in power mode, the stack inlet in electrolysis). */
function steamRaisingEquation(r: Results): EquationEntry {
  const steamTo = r.plant.power ? 'T_\\mathrm{mix}' : 'T_\\mathrm{in}';
  return entry(
    'steam-raising',
    {
      steam: {
        lhs: sym('Q_\\mathrm{steam}'),
        symbols: { n: sym('\\dot n_\\mathrm{w}'), hl: sym('\\Delta h_\\mathrm{liq}'), L: sym('L(T_\\mathrm{s})'), hg: sym('\\Delta h_\\mathrm{vap}') },
        rhs: (q, op) => `${q.n}${op.times}${op.open}${q.hl} + ${q.L} + ${q.hg}${op.close}`,
      },
    },
    (show) =>
      // One relation a line: on one line the four were 848 px wide, more than the A4 text column (673 px), and Chromium would shrink every printed page to fit.
      `\\begin{gathered} ${show('steam')}, \\\\ \\Delta h_\\mathrm{liq} = h^\\circ_\\mathrm{H_2O(l)}(T_\\mathrm{s}) - h^\\circ_\\mathrm{H_2O(l)}(T_\\mathrm{w}), \\\\ L = h^\\circ_\\mathrm{H_2O}(T_\\mathrm{s}) - h^\\circ_\\mathrm{H_2O(l)}(T_\\mathrm{s}), \\\\ \\Delta h_\\mathrm{vap} = h^\\circ_\\mathrm{H_2O}(${steamTo}) - h^\\circ_\\mathrm{H_2O}(T_\\mathrm{s}) \\end{gathered}`,
  );
}

/** An electrolysis plant's specific energy per kilogram of hydrogen, with the staged compressor's isentropic work per stage. */
function electrolysisPlantEquation(): EquationEntry {
  const Pc = sym('P_\\mathrm{comp}');
  return entry(
    'electrolysis-plant-energy',
    {
      system: {
        lhs: sym('w_\\mathrm{sys}'),
        symbols: { P: sym('P_\\mathrm{AC}'), Qe: sym('Q_\\mathrm{el}'), Pc, m: sym('\\dot m_\\mathrm{H_2}') },
        rhs: (q) => `\\frac{${q.P} + ${q.Qe} + ${q.Pc}}{${q.m}}`,
      },
      compressor: { lhs: Pc, symbols: { n: sym('\\dot n_\\mathrm{c}'), w: sym('\\textstyle\\sum_k w_k', { listed: 'w_\\mathrm{c}' }) }, rhs: (q, op) => `${q.n}${op.times}${q.w}` },
    },
    (show) =>
      `\\begin{gathered} ${show('system')}, \\\\ ${show('compressor')}, \\qquad w_k = \\frac{h(T_{\\mathrm{s},k}) - h(T_k)}{\\eta_\\mathrm{s}}, \\quad s^\\circ(T_{\\mathrm{s},k}) = s^\\circ(T_k) + R \\ln r, \\quad r = \\left(\\frac{p_\\mathrm{out}}{p_\\mathrm{in}}\\right)^{1/N} \\end{gathered}`,
  );
}

/** The feed recuperator (lib/plant/recuperator.ts): its duty from the hot outlets, bounded by the least approach over the composite curves. */
function recuperatorEquation(): EquationEntry {
  return entry(
    'recuperator-duty',
    { duty: { lhs: sym('Q_\\mathrm{rec}'), symbols: { Hs: sym('H_\\mathrm{hot}(T_\\mathrm{stack})'), Hr: sym('H_\\mathrm{hot}(T_\\mathrm{ho})') }, rhs: (q) => `${q.Hs} - ${q.Hr}` } },
    (show) => `\\begin{gathered} ${show('duty')}, \\\\ T_\\mathrm{h}(c) - T_\\mathrm{c}(c) \\ge \\Delta T_\\mathrm{min} \\text{ for every } c \\in [0, Q_\\mathrm{rec}] \\end{gathered}`,
  );
}

/**
 * A carbonate cell's cathode-gas loop (lib/plant/cathode-loop.ts): its mole balance, the two
 * conditions that fix the burner air A and the recycled share r, the two rows of the balance they
 * are solved from (O2, and the total), and the adiabatic mixing of the burner's products with the
 * recycle (lib/plant/power-cathode-loop.ts).
 */
function cathodeLoopEquation(): EquationEntry {
  const A = sym('A');
  const r = sym('r');
  const D = sym('D');
  return entry(
    'cathode-loop',
    {
      air: {
        lhs: A,
        symbols: { Q: sym('Q'), D, r, c: sym('c_\\mathrm{O_2}'), y: sym('y_\\mathrm{O_2}') },
        rhs: (q, op) => `\\frac{${q.Q} + ${q.D} - ${q.r}${op.times}${op.open}${q.Q} - ${q.c}${op.close}}{${q.y}}`,
      },
      recycle: {
        lhs: r,
        symbols: { N: sym('N'), NB: sym('N_B'), D, A, ct: sym('c_t') },
        rhs: (q) => `\\frac{${q.N} - ${q.NB} + ${q.D} - ${q.A}}{${q.N} - ${q.ct}}`,
      },
      mixing: {
        lhs: sym('H_\\mathrm{in}(T_\\mathrm{mix})'),
        symbols: { HB: sym('H_B(T_\\mathrm{b})'), Hr: sym('H_\\mathrm{rec}(T_\\mathrm{exh})') },
        rhs: (q) => `${q.HB} + ${q.Hr}`,
      },
    },
    (show) =>
      `\\begin{gathered} \\dot n_\\mathrm{in} = B + A\\,y + r\\,(\\dot n_\\mathrm{in} - c) \\;\\Longrightarrow\\; \\dot n_\\mathrm{in} = \\frac{B + A\\,y - r\\,c}{1 - r}, \\\\ \\dot n_\\mathrm{in,O_2} = \\frac{c_\\mathrm{O_2}}{U_\\mathrm{air}} \\equiv Q, \\quad \\sum_i \\dot n_{\\mathrm{in},i} = \\frac{Q}{x_\\mathrm{O_2}} \\equiv N, \\\\ ${show('air')}, \\qquad ${show('recycle')}, \\\\ ${show('mixing')} \\end{gathered}`,
  );
}

/** A power plant's duties and blower, the off-gas oxidiser's adiabatic balance, the heat delivered and the CHP efficiency. */
function powerPlantEquations(): EquationEntry[] {
  const Q = sym('Q_\\mathrm{del}');
  return [
    entry('plant-duty', {
      duty: { lhs: sym('Q'), symbols: { Hout: sym('H(T_\\mathrm{out})'), Hin: sym('H(T_\\mathrm{in})') }, rhs: (q) => `${q.Hout} - ${q.Hin}` },
      blower: { lhs: sym('P_\\mathrm{bl}'), symbols: { n: sym('\\dot n_\\mathrm{air}'), hs: sym('\\Delta h_\\mathrm{s}'), eta: sym('\\eta_\\mathrm{s}') }, rhs: (q) => `\\frac{${q.n}\\,${q.hs}}{${q.eta}}` },
    }),
    entry(
      'oxidiser-balance',
      {
        enthalpy: { lhs: sym('H_\\mathrm{prod}(T_\\mathrm{ad})'), symbols: { Hog: sym('H_\\mathrm{off\\text{-}gas}(T)'), Hox: sym('H_\\mathrm{oxidant}(T_\\mathrm{ox})') }, rhs: (q) => `${q.Hog} + ${q.Hox}` },
      },
      () =>
        '\\sum_j \\dot n_j\\, h^\\circ_j(T_\\mathrm{ad}) = \\sum_{\\mathrm{off\\text{-}gas}} \\dot n_i\\, h^\\circ_i(T) + \\sum_{\\mathrm{oxidant}} \\dot n_k\\, h^\\circ_k(T_\\mathrm{ox}), \\qquad \\min G \\text{ at fixed } H, p',
    ),
    entry('delivered-heat', {
      heat: { lhs: Q, symbols: { R: sym('Q_\\mathrm{rec}'), D: sym('D'), L: sym('Q_\\mathrm{loss}') }, rhs: (q) => `${q.R} - ${q.D} - ${q.L}` },
    }),
    entry('chp-efficiency', {
      chp: { lhs: sym('\\eta_\\mathrm{CHP}'), symbols: { P: sym('P_\\mathrm{net}'), Q, L: sym('\\dot n_\\mathrm{fuel}\\,\\mathrm{LHV}') }, rhs: (q) => `\\frac{${q.P} + ${q.Q}}{${q.L}}` },
    }),
  ];
}

/**
 * The operating cases, where the basis has them: the load a case meets on the sizing case's N
 * cells of area A (the current density j its solve finds), and the linear degradation law at
 * the end of life (common practice, no source), V = V₀ (1 ∓ r t) or ASR = ASR₀ (1 + r t).
 */
function caseEquations(r: Results): EquationEntry[] {
  const power = r.technology.mode === 'power';
  return [...caseLoadEquations(r, power), ...(r.cases.length ? [...caseDutyEquations(r, power), ...caseMassEquations(r, power)] : []), ...degradationEquations(r, power)];
}

/** The load a case meets: P = N j A V (η − f) in power mode, P = N j A V (1/η + f) and ṁ_H2 = N j A M/(2F) in electrolysis. */
function caseLoadEquations(r: Results, power: boolean): EquationEntry[] {
  // A target case, or the sizing case run on more cells than it required (its target met at a current density of its own).
  if (!r.cases.some((c) => c.load === 'target-power' || c.load === 'target-hydrogen' || (c.sizing && c.ran && c.headline!.cells !== r.headline.cells && r.operatingPoint.cellsFrom !== 'cells'))) return [];
  const [N, j, A, V, f, M, eta] = ['N', 'j', 'A', 'V', 'f_\\mathrm{par}', 'M_\\mathrm{H_2}', '\\eta_\\mathrm{conv}'].map((s) => sym(s)) as Symbol[];
  // The plant's AC power per unit of stack DC power (design-point.ts plantPowerShare): η − f delivered, 1/η + f drawn.
  const relations: Record<string, Relation> = power
    ? { power: { lhs: sym('P_\\mathrm{net}'), symbols: { N: N!, j: j!, A: A!, V: V!, eta: eta!, f: f! }, rhs: (q, op) => `${q.N}${op.times}${q.j}${op.times}${q.A}${op.times}${q.V}${op.times}${op.open}${q.eta} - ${q.f}${op.close}` } }
    : {
        power: { lhs: sym('P_\\mathrm{in}'), symbols: { N: N!, j: j!, A: A!, V: V!, eta: eta!, f: f! }, rhs: (q, op) => `${q.N}${op.times}${q.j}${op.times}${q.A}${op.times}${q.V}${op.times}${op.open}\\frac{1}{${q.eta}} + ${q.f}${op.close}` },
        hydrogen: { lhs: sym('\\dot m_\\mathrm{H_2}'), symbols: { N: N!, j: j!, A: A!, M: M!, F }, rhs: (q, op) => `\\frac{${q.N}${op.times}${q.j}${op.times}${q.A}${op.times}${q.M}}{2${op.times}${q.F}}` },
      };
  return [entry('case-load', relations)];
}

/** The governing DC power (P = V_bus I_bus), water or steam and coolant flows of a case, where a case governs them. */
function caseDutyEquations(r: Results, power: boolean): EquationEntry[] {
  const out: EquationEntry[] = [];
  const governed = (id: string) => r.envelope.some((e) => e.id === id);
  if (governed('dc-power')) {
    out.push(entry('case-bus-power', { power: { lhs: sym('P_\\mathrm{DC}'), symbols: { Vbus: sym('V_\\mathrm{bus}'), Ibus: sym('I_\\mathrm{bus}') }, rhs: (q, op) => `${q.Vbus}${op.times}${q.Ibus}` } }));
  }
  if (governed('water-flow')) {
    const Mw = sym('M_\\mathrm{H_2O}');
    out.push(
      entry(
        'case-water',
        power
          ? { steam: { lhs: sym('\\dot m_\\mathrm{w}'), symbols: { n: sym('\\dot n_\\mathrm{feed}'), x: sym('x_\\mathrm{H_2O}'), xd: sym('x_\\mathrm{d}'), M: Mw }, rhs: (q, op) => `${q.n}${op.times}\\frac{${q.x} - ${q.xd}}{1 - ${q.xd}}${op.times}${q.M}` } }
          : { water: { lhs: sym('\\dot m_\\mathrm{w}'), symbols: { n: sym('\\dot n_\\mathrm{w}'), M: Mw }, rhs: (q, op) => `${q.n}${op.times}${q.M}` } },
      ),
    );
  }
  if (governed('cooling-air') || governed('cooling-water')) {
    out.push(
      entry(
        'case-coolant',
        { mass: { lhs: sym('\\dot m_\\mathrm{c}'), symbols: { Q: sym('Q'), M: sym('M_\\mathrm{c}'), dh: sym('\\Delta h_\\mathrm{c}') }, rhs: (q, op) => `\\frac{${q.Q}${op.times}${q.M}}{${q.dh}}` } },
        (show) => `${show('mass')}, \\qquad \\Delta h_\\mathrm{c} = \\sum_i x_i \\left[h^\\circ_i(T) - h^\\circ_i(T_\\mathrm{c})\\right]`,
      ),
    );
  }
  return out;
}

/** The mass flows the envelope sizes by (ṅ M from the case's stream table), the heat recovered and the heat demand, where a case governs them. */
function caseMassEquations(r: Results, power: boolean): EquationEntry[] {
  const out: EquationEntry[] = [];
  const M = sym('M_\\mathrm{H_2}');
  // The mass flows the envelope sizes by, from the molar flows of the case's stream table (species data's molar masses).
  const governed = (...ids: string[]) => r.envelope.some((e) => ids.includes(e.id));
  const mass: Record<string, Relation> = {};
  if (governed('air-flow')) mass.air = { lhs: sym('\\dot m_\\mathrm{air}'), symbols: { n: sym('\\dot n_\\mathrm{air}'), M: sym('M_\\mathrm{air}') }, rhs: (q, op) => `${q.n}${op.times}${q.M}` };
  if (power && governed('fuel-flow', 'fuel-flow-least')) {
    mass.fuel = { lhs: sym('\\dot m_\\mathrm{fuel}'), symbols: { n: sym('\\dot n_\\mathrm{feed}'), x: sym('x_\\mathrm{H_2O}'), xd: sym('x_\\mathrm{d}'), M: sym('M_\\mathrm{d}') }, rhs: (q, op) => `${q.n}${op.times}\\frac{1 - ${q.x}}{1 - ${q.xd}}${op.times}${q.M}` };
  }
  if (!power && governed('hydrogen-most', 'hydrogen-least')) mass.hydrogen = { lhs: sym('\\dot m_\\mathrm{H_2}'), symbols: { n: sym('\\dot n_\\mathrm{H_2}'), M: M! }, rhs: (q, op) => `${q.n}${op.times}${q.M}` };
  if (!power && governed('water-split')) {
    mass.split = { lhs: sym('\\dot m_\\mathrm{split}'), symbols: { nin: sym('\\dot n_\\mathrm{w,in}'), nout: sym('\\dot n_\\mathrm{w,out}'), M: sym('M_\\mathrm{H_2O}') }, rhs: (q, op) => `${op.open}${q.nin} - ${q.nout}${op.close}${op.times}${q.M}` };
  }
  if (Object.keys(mass).length) out.push(entry('case-mass', mass));
  if (governed('heat-recovered')) {
    out.push(
      entry('case-heat-recovered', {
        heat: { lhs: sym('Q_\\mathrm{rec}'), symbols: { Hex: sym('H_\\mathrm{ex}(T_\\mathrm{in})'), Hg: sym('H_\\mathrm{gas}(T_\\mathrm{exit})'), Hc: sym('H_\\mathrm{cond}(T_\\mathrm{exit})') }, rhs: (q) => `${q.Hex} - ${q.Hg} - ${q.Hc}` },
      }),
    );
  }
  if (!power && governed('heat-supplied', 'coolers')) {
    out.push(
      entry('case-plant-heat', {
        supplied: { lhs: sym('Q_\\mathrm{sup}'), symbols: { Qf: sym('Q_\\mathrm{feeds}'), Qs: sym('Q_\\mathrm{stack}') }, rhs: (q) => `${q.Qf} + ${q.Qs}` },
        removed: { lhs: sym('Q_\\mathrm{cool}'), symbols: { Ql: sym('Q_\\mathrm{loop}'), Qo: sym('Q_\\mathrm{other}') }, rhs: (q) => `${q.Ql} + ${q.Qo}` },
      }),
    );
  }
  if (!power && governed('heat-demand')) {
    out.push(
      entry('case-heat-demand', {
        demand: { lhs: sym('Q_\\mathrm{dem}'), symbols: { Hout: sym('H_\\mathrm{out}'), Hin: sym('H_\\mathrm{in}'), W: sym('W_\\mathrm{in}') }, rhs: (q) => `${q.Hout} - ${q.Hin} - ${q.W}` },
      }),
    );
  }
  return out;
}

/** The linear degradation law at the end of life (common practice, no source): V = V₀ (1 ∓ r t) or ASR = ASR₀ (1 + r t). */
function degradationEquations(r: Results, power: boolean): EquationEntry[] {
  const out: EquationEntry[] = [];
  const V = sym('V');
  if (r.degradation || r.cases.some((c) => c.degradation)) {
    const [V0, rate, t, R0] = [sym('V_0'), sym('r'), sym('t'), sym('\\mathrm{ASR}_0')];
    out.push(
      entry('degradation', {
        voltage: { lhs: V!, symbols: { V0, r: rate, t }, rhs: (q, op) => `${q.V0}${op.times}${op.open}1 ${power ? '-' : '+'} ${q.r}${op.times}${q.t}${op.close}` },
        resistance: { lhs: sym('\\mathrm{ASR}'), symbols: { R0, r: rate, t }, rhs: (q, op) => `${q.R0}${op.times}${op.open}1 + ${q.r}${op.times}${q.t}${op.close}` },
      }),
    );
  }
  return out;
}

/**
 * The water of a liquid-water cell at a point u of the path (lib/equilibrium/liquid-water.ts): the
 * water fed and formed (split) against the vapour that saturates both dry gases, and the vapour
 * fraction each gas then carries.
 */
function liquidWaterEquations(r: Results): EquationEntry[] {
  if (r.technology.waterPhase !== 'liquid') return [];
  const sign = r.technology.mode === 'power' ? '+' : '-';
  return [
    shown(
      'water-balance',
      `\\begin{gathered} \\dot n_\\mathrm{w}(u) = \\dot n_\\mathrm{w,fed} ${sign} \\frac{u\\,Q_1}{2\\,F}, \\qquad \\dot n_{\\mathrm{sat},k}(u) = \\dot n_{\\mathrm{dry},k}(u)\\,\\frac{x_{\\mathrm{s},k}}{1 - x_{\\mathrm{s},k}}, \\quad x_{\\mathrm{s},k} = \\frac{p_\\mathrm{w}^\\mathrm{sat}(T)}{P_k}, \\quad p_\\mathrm{w}^\\mathrm{sat}(T) = a_\\mathrm{w}\\,p_\\mathrm{s}(T) \\\\ ` +
        `x_{\\mathrm{H_2O},k}(u) = \\begin{cases} x_{\\mathrm{s},k} & \\text{if } \\dot n_\\mathrm{w} \\ge \\sum_k \\dot n_{\\mathrm{sat},k} \\text{ (saturated, the rest liquid)} \\\\ \\dfrac{\\phi\\,\\dot n_{\\mathrm{sat},k}}{\\dot n_{\\mathrm{dry},k} + \\phi\\,\\dot n_{\\mathrm{sat},k}}, \\quad \\phi = \\dfrac{\\dot n_\\mathrm{w}}{\\sum_k \\dot n_{\\mathrm{sat},k}} & \\text{otherwise (all vapour, no liquid)} \\end{cases} \\end{gathered}`,
    ),
  ];
}

/** Every equation a document of these results can number, by key. */
export function equationTable(r: Results): Map<string, EquationEntry> {
  const all = [
    ...electrodeEquations(r),
    nernstEquation(r),
    ...liquidWaterEquations(r),
    ...oxygenPotentialEquations(r),
    ...temperatureEquations(),
    ...voltageEquations(r),
    ...faradayEquations(r),
    ...humidityEquations(r),
    ...efficiencyEquations(r),
    ...heatEquations(r),
    ...carbonEquations(),
    ...caseEquations(r),
    ...plantEquations(r),
  ];
  return new Map(all.map((e) => [e.key, e]));
}
