/**
 * Parser for the NASA Glenn thermodynamic data format.
 *
 * Format: S. Gordon and B. J. McBride, "Computer Program for Calculation of Complex Chemical
 * Equilibrium Compositions and Applications", NASA RP-1311 (1994/1996), Appendix A; data of
 * B. J. McBride, M. J. Zehe and S. Gordon, NASA/TP-2002-211556 (2002). Fixed columns:
 *
 *   name line      cols 1-18 name, then comments
 *   header line    cols 1-2 interval count, 4-9 reference-date code, 11-50 five
 *                  (element A2, count F6.2) pairs, 51-52 phase (0 gas), 53-65 molar mass
 *                  g/mol, 66-80 heat of formation at 298.15 K, J/mol
 *   per interval   a) cols 1-11 T low, 12-22 T high (K), 23 exponent count, 24-63 exponents,
 *                     66-80 H(298.15)-H(0) J/mol
 *                  b) a1..a5, five fields of 16 columns (Fortran D exponents)
 *                  c) a6, a7, 16 blank columns, b1, b2
 */
import { UserError } from '../core/errors.ts';

export interface NasaInterval {
  lowK: number;
  highK: number;
  /** a1..a7 of cp/R = a1 t^-2 + a2 t^-1 + a3 + a4 t + a5 t^2 + a6 t^3 + a7 t^4. */
  a: readonly [number, number, number, number, number, number, number];
  /** Integration constant of h/RT. */
  b1: number;
  /** Integration constant of s/R. */
  b2: number;
}

export interface NasaRecord {
  name: string;
  comment: string;
  dateCode: string;
  /** Element symbol (proper case, e.g. "Ar") to atom count. */
  formula: Readonly<Record<string, number>>;
  condensed: boolean;
  molarMassGPerMol: number;
  heatOfFormationJPerMol: number;
  intervals: readonly NasaInterval[];
  /** 1-based line of the record's name line in the parsed text. */
  line: number;
}

function fortranNumber(field: string, where: string): number {
  const value = Number(field.trim().replace(/[dD]/, 'E'));
  if (field.trim() === '' || !Number.isFinite(value)) {
    throw new UserError(`${where}: expected a number, found "${field.trim()}"`);
  }
  return value;
}

function properCase(symbol: string): string {
  return symbol.charAt(0).toUpperCase() + symbol.slice(1).toLowerCase();
}

/** Lines that are not records: comments, blank lines, the "thermo" keyword and the ranges line, end markers. */
function isSkippable(line: string, previous: string | undefined): boolean {
  return (
    line.startsWith('!') ||
    line.trim() === '' ||
    line.startsWith('thermo') ||
    line.startsWith('END ') ||
    (previous !== undefined && previous.startsWith('thermo'))
  );
}

/**
 * Parses every record of a NASA Glenn file. Reactant-only records (zero intervals) are skipped:
 * they carry no polynomials.
 */
export function parseNasaGlenn(text: string, sourceName: string): NasaRecord[] {
  const lines = text.split(/\r?\n/);
  const records: NasaRecord[] = [];
  let i = 0;
  while (i < lines.length) {
    const line = lines[i]!;
    if (isSkippable(line, lines[i - 1])) {
      i++;
      continue;
    }
    const where = `${sourceName}:${i + 2}`;
    const header = lines[i + 1];
    if (header === undefined) throw new UserError(`${sourceName}:${i + 1}: record "${line.trim()}" has no header line`);
    const intervalCount = fortranNumber(header.slice(0, 2), where);
    const formula: Record<string, number> = {};
    for (let k = 0; k < 5; k++) {
      const symbol = header.slice(10 + 8 * k, 12 + 8 * k).trim();
      const count = fortranNumber(header.slice(12 + 8 * k, 18 + 8 * k), where);
      if (symbol !== '' && count !== 0) formula[properCase(symbol)] = count;
    }
    const record = {
      name: line.slice(0, 18).trim(),
      comment: line.slice(18).trim(),
      dateCode: header.slice(3, 9).trim(),
      formula,
      condensed: fortranNumber(header.slice(50, 52), where) !== 0,
      molarMassGPerMol: fortranNumber(header.slice(52, 65), where),
      heatOfFormationJPerMol: fortranNumber(header.slice(65, 80), where),
      intervals: [] as NasaInterval[],
      line: i + 1,
    };
    if (intervalCount === 0) {
      i += 3;
      continue;
    }
    for (let k = 0; k < intervalCount; k++) {
      const base = i + 2 + 3 * k;
      const [ranges, first, second] = [lines[base], lines[base + 1], lines[base + 2]];
      if (ranges === undefined || first === undefined || second === undefined) {
        throw new UserError(`${sourceName}:${base + 1}: record ${record.name} ends before interval ${k + 1}`);
      }
      const at = (n: number) => `${sourceName}:${base + n + 1}`;
      const field = (s: string, idx: number, n: number) => fortranNumber(s.slice(16 * idx, 16 * idx + 16), at(n));
      record.intervals.push({
        lowK: fortranNumber(ranges.slice(0, 11), at(0)),
        highK: fortranNumber(ranges.slice(11, 22), at(0)),
        a: [field(first, 0, 1), field(first, 1, 1), field(first, 2, 1), field(first, 3, 1), field(first, 4, 1), field(second, 0, 2), field(second, 1, 2)],
        b1: field(second, 3, 2),
        b2: field(second, 4, 2),
      });
    }
    records.push(record);
    i += 2 + 3 * intervalCount;
  }
  return records;
}
