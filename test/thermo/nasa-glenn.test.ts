// The species data file: parsed from NASA's own text format, copied verbatim from the NASA Glenn
// database (McBride, Zehe & Gordon, NASA/TP-2002-211556). Verbatim is shown from the repository
// alone, by the SHA-256 of each record as it stands in the full database, recorded beside the
// excerpt by scripts/extract-species.ts (lib/thermo/data/nasa-glenn-excerpt.sha256); where the
// full file is at hand (../shared/data beside the checkout), against it as well.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseNasaGlenn } from '../../lib/thermo/nasa-glenn.ts';
import { allSpecies, getSpecies, speciesDataPath, findSpecies } from '../../lib/thermo/species-data.ts';
import { UnknownSpeciesError } from '../../lib/thermo/species-data.ts';

const FULL = new URL('../../../shared/data/nasa-glenn-thermo.inp', import.meta.url);
const HASHES = new URL('../../lib/thermo/data/nasa-glenn-excerpt.sha256', import.meta.url);

const sha256 = (bytes: Buffer | string) => createHash('sha256').update(bytes).digest('hex');

/** Each record of the excerpt as its lines, each ended by LF, by NASA name (the record's extent from its interval count). */
function excerptRecords(): Map<string, string> {
  const lines = readFileSync(speciesDataPath(), 'latin1').split('\n').filter((l) => !l.startsWith('!'));
  return new Map(
    allSpecies().map((species) => {
      const start = lines.findIndex((l) => l.slice(0, 18).trim() === species.nasaName);
      expect(start, species.nasaName).toBeGreaterThan(0);
      return [species.nasaName, lines.slice(start, start + 2 + 3 * species.record.intervals.length).map((l) => `${l}\n`).join('')];
    }),
  );
}

/** The recorded hashes: the full file's SHA-256, and per record its SHA-256 and line in the full file. */
function recordedHashes(): { full: string; records: Map<string, { sha256: string; line: number }> } {
  const text = readFileSync(HASHES, 'utf8');
  const full = /^# Full file: .*, SHA-256 ([0-9a-f]{64})\.$/m.exec(text)?.[1];
  expect(full, 'the header names the full file by its SHA-256').toBeDefined();
  const records = new Map<string, { sha256: string; line: number }>();
  for (const row of text.split('\n').filter((l) => l && !l.startsWith('#'))) {
    const match = /^([0-9a-f]{64}) (\d+) (\S+)$/.exec(row);
    expect(match, row).not.toBeNull();
    records.set(match![3]!, { sha256: match![1]!, line: Number(match![2]) });
  }
  return { full: full!, records };
}

describe('NASA Glenn excerpt', () => {
  it('holds every species the issue lists, plus trace species', () => {
    for (const name of ['H2', 'O2', 'N2', 'Ar', 'He', 'H2O', 'H2O(L)', 'CO', 'CO2', 'CH4', 'C2H6', 'C3H8', 'C2H4', 'CH3OH', 'C2H5OH', 'NH3', 'H2S', 'C(gr)', 'OH', 'H']) {
      expect(findSpecies(name), name).toBeDefined();
    }
  });

  it('holds each record byte for byte as the full database has it: its SHA-256 as recorded from the full file (line terminators aside)', () => {
    const records = excerptRecords();
    const { records: recorded } = recordedHashes();
    expect([...recorded.keys()].sort(), 'a hash for every record, and no other').toEqual([...records.keys()].sort());
    for (const [name, block] of records) expect(sha256(Buffer.from(block, 'latin1')), name).toBe(recorded.get(name)!.sha256);
  });

  it('where the full database is at hand: each record is in it at the recorded line, and the recorded hashes are of that file', (context) => {
    if (!existsSync(FULL)) context.skip('../shared/data/nasa-glenn-thermo.inp is not beside this checkout; the recorded hashes stand for it (test above)');
    const bytes = readFileSync(FULL);
    const { full, records: recorded } = recordedHashes();
    expect(sha256(bytes), 'the full file the hashes were recorded from').toBe(full);
    const lines = bytes.toString('latin1').split(/\r?\n/);
    for (const [name, block] of excerptRecords()) {
      const { line } = recorded.get(name)!;
      const count = block.split('\n').length - 1;
      expect(lines.slice(line - 1, line - 1 + count).map((l) => `${l}\n`).join(''), name).toBe(block);
    }
  });

  it('reads formula, phase and molar mass from the header line (H2O: 18.01528 g/mol, IUPAC 1999 atomic weights)', () => {
    const water = getSpecies('H2O');
    expect(water.formula).toEqual({ H: 2, O: 1 });
    expect(water.molarMassKgPerMol).toBeCloseTo(0.01801528, 10);
    expect(water.phase).toBe('gas');
    expect(getSpecies('H2O(L)').phase).toBe('condensed');
    expect(getSpecies('H2O(L)').lowK).toBe(273.15);
    expect(getSpecies('H2O(L)').highK).toBe(600);
    expect(getSpecies('C(gr)').record.intervals).toHaveLength(3);
  });

  it('parses fixed columns even where a record shifts its exponent count (CH3 "1000.000 7")', () => {
    const ch3 = getSpecies('CH3');
    expect(ch3.record.intervals[0]!.highK).toBe(1000);
    expect(ch3.record.intervals[1]!.lowK).toBe(1000);
  });

  it('accepts labels and aliases, and suggests near names for unknown ones', () => {
    expect(getSpecies('C2H2').nasaName).toBe('C2H2,acetylene');
    expect(getSpecies('C2H2,acetylene').label).toBe('C2H2');
    expect(getSpecies('H2O(l)').label).toBe('H2O(L)');
    expect(() => getSpecies('CH5')).toThrow(UnknownSpeciesError);
    try {
      getSpecies('Metane');
    } catch (e) {
      expect((e as Error).message).toMatch(/unknown species "Metane"/);
    }
    try {
      getSpecies('H20');
    } catch (e) {
      expect((e as Error).message).toMatch(/did you mean "H2O"/);
    }
  });

  it('reports a damaged record with file and line', () => {
    const text = ['thermo', '    200.00   1000.00   6000.00  20000.     9/09/04', 'XX                test', ' 1 g 1/01 H   2.00    0.00    0.00    0.00    0.00 0    2.0158800          0.000', '    200.000   1000.0007 -2.0 -1.0  0.0  1.0  2.0  3.0  4.0  0.0         8468.102', ' 4.078323210D+04-8.00918604xD+02'.padEnd(80), ' 0'].join('\n');
    expect(() => parseNasaGlenn(text, 'bad.inp')).toThrow(/bad\.inp:6: expected a number/);
  });
});
