/**
 * The block flow diagram: every numbered stream of the heat-and-material balance is drawn, once,
 * and no number is drawn that the balance does not have (the diagram and the table must agree).
 */
import { describe, expect, it } from 'vitest';
import { calculate } from '../../lib/plant/calculate.ts';
import { blockFlowDiagram } from '../../lib/report/flow-diagram.ts';
import { heatAndMaterialBalanceParts } from '../../lib/report/sections/results-tables.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';

function drawnNumbers(svg: string): number[] {
  const labels = [...svg.matchAll(/font-weight="bold">([^<]*)<\/text>/g)].map((m) => m[1]!);
  return labels.flatMap((l) => l.split(', ').map(Number)).sort((a, b) => a - b);
}

const PLANT = {
  'plant.air-blower': { 'isentropic-efficiency': '70 %' },
  'plant.heat-recovery': { 'exhaust-exit-temperature': '40 C' },
};

/** The molten carbonate scaffold's cathode gas made by a cathode-gas loop (lib/plant/cathode-loop.ts). */
const LOOP = {
  'streams.air-electrode': { 'cathode-loop': { 'burner-air': { composition: 'dry-air' }, 'inlet-oxygen': '9.4 %' } },
  'mixtures.cathode-gas': undefined,
};

const COMPRESSION = { 'plant.hydrogen-compression': { 'delivery-pressure': '200 bar', stages: 2, 'isentropic-efficiency': '75 %' } };

describe('block flow diagram', () => {
  it.each([
    ['solid oxide, oxidiser on the air exhaust', 'solid-oxide', { ...PLANT, 'plant.off-gas-oxidiser': { oxidant: 'air-electrode-exhaust', 'material-limit': '1100 C' } }],
    ['solid oxide, recycle and fresh-air oxidiser', 'solid-oxide', { ...PLANT, 'plant.anode-recycle': { ratio: 0.5 }, 'plant.off-gas-oxidiser': { oxidant: 'fresh-air', 'air-ratio': 1.5, 'material-limit': '1100 C' } }],
    ['PEM without a plant section', 'pem', {}],
    ['molten carbonate, cathode-gas loop', 'molten-carbonate', LOOP],
    ['molten carbonate, cathode-gas loop with blower and heat recovery', 'molten-carbonate', { ...LOOP, ...PLANT }],
  ] as const)('%s: draws every numbered stream once', (_name, technology, edits) => {
    const results = calculate(basisFrom(technology, 'power', edits));
    const svg = blockFlowDiagram(results)!.html;
    expect(drawnNumbers(svg)).toEqual(results.plant.streams.map((s) => s.number));
    expect(svg.startsWith('<svg class="block-flow"')).toBe(true);
  });

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

// The diagram of a plant whose recuperator takes the feed water (lib/plant/recuperator.ts): the
// feeds must enter its cold side and leave it for the heaters, and the feed water's state and
// temperature written beside it must be the heat-and-material balance's (the same document).

interface Rect { x: number; y: number; w: number; h: number; label: string }
interface Line { points: { x: number; y: number }[]; numbers: number[] }

/** The boxes of the SVG with their labels (the plain text lines drawn after each rectangle). */
function rectsOf(svg: string): Rect[] {
  return [...svg.matchAll(/<rect x="([\d.]+)" y="([\d.]+)" width="([\d.]+)" height="([\d.]+)"[^>]*\/>((?:<text[^>]*font-size="11">[^<]*<\/text>)*)/g)].map((m) => ({
    x: Number(m[1]), y: Number(m[2]), w: Number(m[3]), h: Number(m[4]),
    label: [...m[5]!.matchAll(/>([^<]*)</g)].map((t) => t[1]).join(' '),
  }));
}

/** The streams drawn: each path's points and the numbers written on it. */
function linesOf(svg: string): Line[] {
  return [...svg.matchAll(/<path d="([^"]*)"[^>]*\/><text[^>]*font-weight="bold">([^<]*)<\/text>/g)].map((m) => ({
    points: [...m[1]!.matchAll(/[ML]([\d.]+),([\d.]+)/g)].map((p) => ({ x: Number(p[1]), y: Number(p[2]) })),
    numbers: m[2]!.split(', ').map(Number),
  }));
}

/** Whether a point lies on a box's outline (0.05 px: the coordinates are written to 0.1 px). */
function onEdge(p: { x: number; y: number }, b: Rect): boolean {
  const near = (a: number, c: number) => Math.abs(a - c) <= 0.05;
  const within = (a: number, lo: number, hi: number) => a >= lo - 0.05 && a <= hi + 0.05;
  return ((near(p.y, b.y) || near(p.y, b.y + b.h)) && within(p.x, b.x, b.x + b.w)) || ((near(p.x, b.x) || near(p.x, b.x + b.w)) && within(p.y, b.y, b.y + b.h));
}

const FEEDS = { fuel: '15 C', air: '15 C', water: '12 C' };

describe('block flow diagram of an electrolysis plant with a recuperator', () => {
  it.each([
    ['solid oxide, 25 K (the water leaves it as steam)', 'solid-oxide', 'fuel', 'steam', {}],
    ['solid oxide, 25 K, with compression', 'solid-oxide', 'fuel', 'steam', COMPRESSION],
    ['proton ceramic, 25 K (steam on the air electrode; the water leaves it part evaporated)', 'proton-ceramic', 'air', 'part', {}],
  ] as const)('%s: the feeds enter its cold side and leave it for the heaters, the stack after them', (_name, technology, side, state, edits) => {
    const results = calculate(basisFrom(technology, 'electrolysis', { 'plant.feed-temperatures': FEEDS, 'plant.recuperator': { 'minimum-approach': '25 K' }, ...edits }));
    const svg = blockFlowDiagram(results)!.html;
    expect(drawnNumbers(svg)).toEqual(results.plant.streams.map((s) => s.number));
    const stream = (id: string) => results.plant.streams.find((s) => s.id === id)!;
    const rects = rectsOf(svg);
    const rect = (label: string) => rects.find((b) => b.label.startsWith(label))!;
    const [rec, heaters, stack] = [rect('recuperator'), rect('feed heaters'), rect('stack')];
    const lines = linesOf(svg);
    const lineOf = (id: string) => lines.find((l) => l.numbers.includes(stream(id).number))!;
    const first = (l: Line) => l.points[0]!;
    const last = (l: Line) => l.points[l.points.length - 1]!;
    // Feed water: from the plant's edge (x = 10) into the recuperator, out of it into the heaters, and on to the stack.
    const water = lineOf('feed-water');
    expect(first(water).x).toBe(10);
    expect(onEdge(last(water), rec)).toBe(true);
    const raised = lineOf(`${side}-steam-recuperated`);
    expect(onEdge(first(raised), rec)).toBe(true);
    expect(onEdge(last(raised), heaters)).toBe(true);
    const inlet = lineOf(`${side}-inlet`);
    expect(onEdge(first(inlet), heaters) && onEdge(last(inlet), stack)).toBe(true);
    // The hot side: the stack's outlets into the recuperator, out of it to the products.
    for (const hot of ['fuel-outlet', 'air-outlet']) {
      expect(onEdge(first(lineOf(hot)), stack) && onEdge(last(lineOf(hot)), rec)).toBe(true);
      expect(onEdge(first(lineOf(`${hot}-recuperated`)), rec)).toBe(true);
    }
    // No feed reaches a heater or the stack straight from the plant's edge.
    for (const l of lines.filter((x) => first(x).x === 10)) expect(onEdge(last(l), rec)).toBe(true);
    // The feeds' names at the plant's edge are the balance's names of those streams.
    const edgeNames = [...svg.matchAll(/<text x="10" [^>]*>([^<]*)<\/text>/g)].map((m) => m[1]);
    const feedNames = results.plant.streams.filter((s) => s.id === 'feed-water' || s.id.endsWith('-gas-supply')).map((s) => s.name);
    expect(edgeNames).toEqual(feedNames);
    // The note on the feed water leaving it: its number, its state and its temperature, as the
    // balance table gives them (the temperature cell of its column; the state from its flows of
    // liquid and vapour, the percentage to 4 significant digits as the document writes percentages).
    const note = /<text [^>]*>(\d+): ([^<]*), ([^<]*) °C<\/text>/.exec(svg)!;
    const left = stream(`${side}-steam-recuperated`);
    expect(Number(note[1])).toBe(left.number);
    const table = heatAndMaterialBalanceParts(results).find((t) => t.head.includes(`${left.number}. ${left.name}`))!;
    const cell = table.rows.find((r) => r.cells[0] === 'Temperature, °C')!.cells[table.head.indexOf(`${left.number}. ${left.name}`)];
    expect(note[3]).toBe(cell);
    // t/°C = T/K − 273.15 (the definition of the Celsius scale); the cell is rounded to 0.1 °C.
    expect(Math.abs(Number(cell) - (left.temperature_K - 273.15))).toBeLessThanOrEqual(0.05);
    const liquid = left.speciesFlows_mol_per_s['H2O(L)'] ?? 0;
    const vapour = left.speciesFlows_mol_per_s.H2O ?? 0;
    const expected = liquid === 0 ? 'steam' : vapour === 0 ? 'water' : `water ${((100 * vapour) / (vapour + liquid)).toPrecision(4)} % evaporated`;
    expect(note[2]).toBe(expected);
    expect(state === 'steam' ? expected === 'steam' : liquid > 0 && vapour > 0).toBe(true);
  });
});

describe('block flow diagram of an electrolysis plant without a recuperator', () => {
  it.each([
    ['solid oxide', 'solid-oxide'],
    ['proton ceramic', 'proton-ceramic'],
  ] as const)('%s: the feeds go from the plant\'s edge straight into the feed preparation, and no recuperator is drawn', (_name, technology) => {
    const results = calculate(basisFrom(technology, 'electrolysis', { 'plant.feed-temperatures': FEEDS }));
    const svg = blockFlowDiagram(results)!.html;
    const rects = rectsOf(svg);
    expect(rects.some((b) => b.label.startsWith('recuperator'))).toBe(false);
    const preparation = rects.filter((b) => b.label.startsWith('feed preparation') || b.label === 'preheat');
    const fromEdge = linesOf(svg).filter((l) => l.points[0]!.x === 10);
    expect(fromEdge.flatMap((l) => l.numbers).sort()).toEqual(results.plant.streams.filter((s) => s.id === 'feed-water' || s.id.endsWith('-gas-supply')).map((s) => s.number));
    for (const l of fromEdge) expect(preparation.some((b) => onEdge(l.points[l.points.length - 1]!, b))).toBe(true);
  });
});
