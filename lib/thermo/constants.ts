/**
 * Physical constants and reference conditions used everywhere in cellbasis.
 *
 * Source: CODATA 2018 (E. Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)). Since the 2019
 * SI redefinition F = N_A·e and R = N_A·k_B are exact:
 *   N_A = 6.02214076e23 /mol, e = 1.602176634e-19 C, k_B = 1.380649e-23 J/K.
 */
import { ZERO_CELSIUS_K } from '../core/units.ts';

/** Faraday constant F = N_A·e, C/mol (exact). */
export const FARADAY_C_PER_MOL = 96485.33212331001;

/** Molar gas constant R = N_A·k_B, J/(mol K) (exact). */
export const GAS_CONSTANT_J_PER_MOL_K = 8.31446261815324;

/** Pascals per bar (definition). */
export const PA_PER_BAR = 1e5;

/** Standard reference temperature of heats of formation, K. */
export const REFERENCE_TEMPERATURE_K = 298.15;

/** One standard atmosphere, Pa (definition). */
export const STANDARD_ATMOSPHERE_PA = 101325;

/**
 * Normal conditions for gas volumes in this tool: 0 °C and 1 atm (DIN 1343 "Normzustand").
 * Molar volume of an ideal gas there: R·T/p = 0.022413969... m³/mol (CODATA 2018 lists
 * 22.413 969 54 L/mol at 273.15 K and 101.325 kPa).
 */
const NORMAL_TEMPERATURE_K: number = ZERO_CELSIUS_K;
const NORMAL_PRESSURE_PA = STANDARD_ATMOSPHERE_PA;
export const NORMAL_MOLAR_VOLUME_M3_PER_MOL =
  (GAS_CONSTANT_J_PER_MOL_K * NORMAL_TEMPERATURE_K) / NORMAL_PRESSURE_PA;
