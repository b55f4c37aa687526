/**
 * Synthetic but valid design bases for the benchmarks: the scaffold of each technology and mode,
 * varied in temperature, utilization, current density and fuel (natural gas, biogas, hydrogen
 * for the high-temperature cells), written as projects/<id>/basis.yaml under a folder.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDocument } from 'yaml';
import { renderScaffold, scaffoldKinds } from '../lib/basis/scaffolds.ts';

/** A small deterministic generator (mulberry32), so every run benchmarks the same projects. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const FUELS: Record<string, unknown>[] = [
  { composition: { CH4: 0.93, C2H6: 0.04, C3H8: 0.01, CO2: 0.01, N2: 0.01 } },
  { composition: { CH4: 0.6, CO2: 0.38, N2: 0.02 } },
  { composition: { H2: 0.97, H2O: 0.03 } },
];

export function writeSyntheticProjects(root: string, count: number, seed = 7): string[] {
  const rand = random(seed);
  const kinds = scaffoldKinds();
  const ids: string[] = [];
  for (let i = 0; i < count; i++) {
    const kind = kinds[i % kinds.length]!;
    const id = `p${String(i + 1).padStart(4, '0')}`;
    const doc = parseDocument(renderScaffold(kind.technology, kind.mode, id, '2026-11-30'));
    const temperature = String(doc.getIn(['conditions', 'operating-temperature', 'value']) ?? doc.getIn(['conditions', 'operating-temperature']));
    const celsius = Number(/^[\d.]+/.exec(temperature)?.[0]);
    doc.setIn(['conditions', 'operating-temperature'], `${(celsius + (rand() - 0.5) * 20).toFixed(1)} C`);
    const density = String(doc.getIn(['operating-point', 'current-density']));
    const j = Number(/^[\d.]+/.exec(density)?.[0]);
    doc.setIn(['operating-point', 'current-density'], `${(j * (0.85 + rand() * 0.2)).toFixed(3)} A/cm2`);
    if (kind.mode === 'power' && (kind.technology === 'solid-oxide' || kind.technology === 'proton-ceramic')) {
      const fuel = FUELS[Math.floor(rand() * FUELS.length)]!;
      doc.setIn(['streams', 'fuel-electrode', 'composition'], fuel.composition);
      const hydrogen = 'H2' in (fuel.composition as object);
      doc.setIn(['streams', 'fuel-electrode', 'pre-reforming'], 'none');
      if (hydrogen) doc.deleteIn(['streams', 'fuel-electrode', 'steam-to-carbon']);
      else doc.setIn(['streams', 'fuel-electrode', 'steam-to-carbon'], 2.5);
    }
    mkdirSync(join(root, 'projects', id), { recursive: true });
    writeFileSync(join(root, 'projects', id, 'basis.yaml'), doc.toString());
    ids.push(id);
  }
  return ids;
}
