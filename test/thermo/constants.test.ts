// The physical constants of lib/thermo/constants.ts against their definitions: since the 2019 SI
// redefinition N_A, e and k_B are exact (CODATA 2018, E. Tiesinga et al., Rev. Mod. Phys. 93,
// 025010 (2021); the defining values from memory), so F = N_A·e and R = N_A·k_B are exact too.
import { describe, expect, it } from 'vitest';
import { FARADAY_C_PER_MOL, GAS_CONSTANT_J_PER_MOL_K, NORMAL_MOLAR_VOLUME_M3_PER_MOL } from '../../lib/thermo/constants.ts';

const AVOGADRO_PER_MOL = 6.02214076e23;
const ELEMENTARY_CHARGE_C = 1.602176634e-19;
const BOLTZMANN_J_PER_K = 1.380649e-23;

describe('CODATA 2018 constants', () => {
  it('F = N_A·e and R = N_A·k_B, exact products (to the last bit of a double)', () => {
    // Both sides are the same product of exact decimals; 1e-15 relative allows only the
    // rounding of one multiplication, so a retyped or older (CODATA 2014) value fails:
    // F(2014) = 96485.33289 differs by 7e-9 relative.
    expect(Math.abs(FARADAY_C_PER_MOL / (AVOGADRO_PER_MOL * ELEMENTARY_CHARGE_C) - 1)).toBeLessThan(1e-15);
    expect(Math.abs(GAS_CONSTANT_J_PER_MOL_K / (AVOGADRO_PER_MOL * BOLTZMANN_J_PER_K) - 1)).toBeLessThan(1e-15);
  });

  it('the published rounded values: F = 96 485.332 12 C/mol, R = 8.314 462 618 J/(mol K)', () => {
    expect(FARADAY_C_PER_MOL).toBeCloseTo(96485.33212, 5);
    expect(GAS_CONSTANT_J_PER_MOL_K).toBeCloseTo(8.314462618, 9);
  });

  it('molar volume of an ideal gas at 0 °C and 1 atm: 22.413 969 54 L/mol (CODATA 2018)', () => {
    // CODATA prints it to 10 significant digits; 1e-8 L/mol is one unit of the last one (the
    // exact value, 22.413 969 545 0... L/mol, sits right at the rounding boundary).
    expect(Math.abs(NORMAL_MOLAR_VOLUME_M3_PER_MOL * 1000 - 22.41396954)).toBeLessThan(1e-8);
  });
});
