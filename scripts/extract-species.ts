/**
 * Regenerates lib/thermo/data/nasa-glenn-excerpt.inp from the full NASA Glenn file, and beside
 * it nasa-glenn-excerpt.sha256, the SHA-256 of each record as it stands in the full file.
 *
 *   npx tsx scripts/extract-species.ts ../shared/data/nasa-glenn-thermo.inp
 *
 * The species list is lib/thermo/data/species-list.txt (one NASA record name per line,
 * '#' starts a comment). Each record is copied line for line, byte for byte, from the full
 * file; only the line terminator is normalised (CRLF to LF). Gas records keep the order of
 * the full file and come first, then condensed records, as in the original.
 *
 * The hashes let test/thermo/nasa-glenn.test.ts show every record of the excerpt verbatim
 * where the full file is not at hand (a fresh clone, CI): each is the SHA-256 of the record's
 * lines in the full file, each line ended by LF, with the record's line number there and the
 * SHA-256 of the whole full file in the header.
 */
import { createHash } from 'node:crypto';
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

const here = dirname(fileURLToPath(import.meta.url));
const dataDir = join(here, '..', 'lib', 'thermo', 'data');
const source = process.argv[2] ?? join(here, '..', '..', 'shared', 'data', 'nasa-glenn-thermo.inp');

const wanted = readFileSync(join(dataDir, 'species-list.txt'), 'utf8')
  .split('\n')
  .map((l) => l.replace(/#.*/, '').trim())
  .filter((l) => l.length > 0);

const fullBytes = readFileSync(source);
const lines = fullBytes.toString('latin1').split(/\r?\n/);

/** A record starts with a name line followed by a line whose first two columns hold the interval count. */
function isRecordStart(i: number): boolean {
  const name = lines[i];
  const next = lines[i + 1];
  if (name === undefined || next === undefined) return false;
  if (name.startsWith('!') || name.trim() === '' || /^(thermo|END )/.test(name)) return false;
  return /^ ?\d /.test(next.slice(0, 3)) && /^\s*\d+\.\d+/.test(next.slice(52, 65));
}

interface Found { name: string; lines: string[]; condensed: boolean; index: number }
const found = new Map<string, Found>();
for (let i = 0; i < lines.length; i++) {
  if (!isRecordStart(i)) continue;
  const name = lines[i]!.slice(0, 18).trim();
  const header = lines[i + 1]!;
  const intervals = Number(header.slice(0, 2));
  const count = 2 + (intervals === 0 ? 1 : intervals * 3);
  if (!wanted.includes(name) || found.has(name)) continue;
  found.set(name, {
    name,
    lines: lines.slice(i, i + count),
    condensed: Number(header.slice(50, 52)) !== 0,
    index: i,
  });
}
const missing = wanted.filter((w) => !found.has(w));
if (missing.length > 0) {
  process.stderr.write(`species not found in ${source}: ${missing.join(', ')}\n`);
  process.exit(1);
}

const ordered = [...found.values()].sort((a, b) => a.index - b.index);
const gas = ordered.filter((r) => !r.condensed);
const condensed = ordered.filter((r) => r.condensed);
const rangeLine = lines[lines.findIndex((l) => l.startsWith('thermo')) + 1]!;

const header = `!
! cellbasis species data: an excerpt of the NASA Glenn thermodynamic database.
!
! Publication: B. J. McBride, M. J. Zehe and S. Gordon, "NASA Glenn Coefficients for
!   Calculating Thermodynamic Properties of Individual Species", NASA/TP-2002-211556,
!   NASA Glenn Research Center, 2002. Record format: S. Gordon and B. J. McBride,
!   NASA RP-1311 (1994/1996), Appendix A. Public-domain data of the U.S. government.
! Copy used: thermo.inp as distributed in the Debian package rocketcea 1.1.18+dfsg-3.
! How this excerpt was made: scripts/extract-species.ts copied the records named in
!   species-list.txt line for line, byte for byte (line terminators CRLF -> LF), keeping
!   the order of the full file; gas records first, then condensed records.
!   ${gas.length} gas and ${condensed.length} condensed records. Do not edit by hand: rerun the script.
! Standard state: ideal gas at 1 bar; h(298.15 K) = heat of formation.
!`;

const out = [
  header,
  'thermo',
  rangeLine,
  ...gas.flatMap((r) => r.lines),
  ...condensed.flatMap((r) => r.lines),
  'END PRODUCTS',
  'END REACTANTS',
  '',
].join('\n');
writeFileSync(join(dataDir, 'nasa-glenn-excerpt.inp'), out);

const sha256 = (bytes: string | Buffer) => createHash('sha256').update(bytes).digest('hex');
const hashes = [
  '# SHA-256 of each record of nasa-glenn-excerpt.inp as it stands in the full NASA Glenn database',
  '# (McBride, Zehe & Gordon, NASA/TP-2002-211556): the record\'s lines in the full file, each',
  '# ended by LF (the full file ends its lines with CRLF), hashed as latin1 bytes. Written with',
  '# the excerpt by scripts/extract-species.ts from the full file; never edit by hand.',
  `# Full file: thermo.inp of the Debian package rocketcea 1.1.18+dfsg-3, ${fullBytes.length} bytes, SHA-256 ${sha256(fullBytes)}.`,
  '# Columns: SHA-256, line of the record\'s name in the full file (from 1), NASA record name.',
  ...[...gas, ...condensed].map((r) => `${sha256(Buffer.from(r.lines.map((l) => `${l}\n`).join(''), 'latin1'))} ${r.index + 1} ${r.name}`),
  '',
].join('\n');
writeFileSync(join(dataDir, 'nasa-glenn-excerpt.sha256'), hashes);
process.stdout.write(`wrote ${ordered.length} records and their SHA-256\n`);
