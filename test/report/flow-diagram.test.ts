/**
 * The block flow diagram: every numbered stream of the heat-and-material balance is drawn, once,
 * and no number is drawn that the balance does not have (the diagram and the table must agree).
 */
import { describe, expect, it } from 'vitest';
import { calculate } from '../../lib/plant/calculate.ts';
import { blockFlowDiagram } from '../../lib/report/flow-diagram.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';

function drawnNumbers(svg: string): number[] {
  const labels = [...svg.matchAll(/font-weight="bold">([^<]*)<\/text>/g)].map((m) => m[1]!);
  return labels.flatMap((l) => l.split(', ').map(Number)).sort((a, b) => a - b);
}

const PLANT = {
  'plant.air-blower': { 'isentropic-efficiency': '70 %' },
  'plant.heat-recovery': { 'exhaust-exit-temperature': '40 C' },
};

describe('block flow diagram', () => {
  it.each([
    ['solid oxide, oxidiser on the air exhaust', 'solid-oxide', { ...PLANT, 'plant.off-gas-oxidiser': { oxidant: 'air-electrode-exhaust', 'material-limit': '1100 C' } }],
    ['solid oxide, recycle and fresh-air oxidiser', 'solid-oxide', { ...PLANT, 'plant.anode-recycle': { ratio: 0.5 }, 'plant.off-gas-oxidiser': { oxidant: 'fresh-air', 'air-ratio': 1.5, 'material-limit': '1100 C' } }],
    ['PEM without a plant section', 'pem', {}],
  ] as const)('%s: draws every numbered stream once', (_name, technology, edits) => {
    const results = calculate(basisFrom(technology, 'power', edits));
    const svg = blockFlowDiagram(results)!.html;
    expect(drawnNumbers(svg)).toEqual(results.plant.streams.map((s) => s.number));
    expect(svg.startsWith('<svg class="block-flow"')).toBe(true);
  });

  const COMPRESSION = { 'plant.hydrogen-compression': { 'delivery-pressure': '200 bar', stages: 2, 'isentropic-efficiency': '75 %' } };
  it.each([
    ['solid oxide, steam with hydrogen, sweep air', 'solid-oxide', {}],
    ['solid oxide with compression', 'solid-oxide', COMPRESSION],
    ['PEM water loop', 'pem', {}],
    ['PEM water loop with compression', 'pem', COMPRESSION],
    ['alkaline with compression', 'alkaline', COMPRESSION],
  ] as const)('electrolysis, %s: draws every numbered stream once', (_name, technology, edits) => {
    const results = calculate(basisFrom(technology, 'electrolysis', edits));
    const svg = blockFlowDiagram(results)!.html;
    expect(drawnNumbers(svg)).toEqual(results.plant.streams.map((s) => s.number));
    expect(svg).toContain(Object.keys(edits).length ? '>compressor<' : '>stack<');
  });
});
