/**
 * The block flow diagram of the plant: one box per unit the basis has (power: feed preparation,
 * pre-reformer, fuel preheat, blower, air preheat, stack, off-gas oxidiser, heat recovery;
 * electrolysis: feed preparation or water loop, preheat, stack, recuperator, product cooler and dryer, compressor) and
 * one arrow per numbered stream of the heat-and-material balance, labelled with its number. Where a
 * recuperator takes the electrolysis feeds, they run from the plant's edge into its cold side and
 * out of it to the heaters and the stack, and the products through its hot side. Drawn by the
 * project as plain SVG in the document's style: boxes, lines, numbers, no symbols.
 */
import type { Results } from '../plant/results-schema.ts';
import { escapeHtml, trustedHtml, type TrustedHtml } from './trusted-html.ts';
import { formatCelsius, formatPercent } from './format.ts';

interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
  label: string[];
}

const W = 104;
const H = 46;
const FUEL_Y = 40;
const AIR_Y = 190;
const MID_Y = (FUEL_Y + AIR_Y) / 2;
const COL = [10, 130, 270, 410, 550, 690, 830, 960];

function box(col: number, y: number, label: string[], h = H): Box {
  return { x: COL[col]!, y, w: W, h, label };
}

/** A terminal: where a stream enters or leaves the plant (a label, no box). */
function terminal(col: number, y: number, label: string): Box {
  return { x: COL[col]!, y, w: 0, h: H, label: [label] };
}

const right = (b: Box) => ({ x: b.x + b.w, y: b.y + b.h / 2 });
const left = (b: Box) => ({ x: b.x, y: b.y + b.h / 2 });

/** The path data of a line through the points: "M10.0,63.0 L130.0,63.0". */
function pathData(points: readonly { x: number; y: number }[]): string {
  return points.map((p, i) => `${i ? 'L' : 'M'}${p.x.toFixed(1)},${p.y.toFixed(1)}`).join(' ');
}

/** An arrow from one point to another, horizontal, then vertical, then horizontal, with the stream number on its first leg. */
function arrow(from: { x: number; y: number }, to: { x: number; y: number }, numbers: number[], labelOnLastLeg = false): string {
  const xm = from.y === to.y ? to.x : (from.x + to.x) / 2;
  const points = from.y === to.y ? [from, to] : [from, { x: xm, y: from.y }, { x: xm, y: to.y }, to];
  const d = pathData(points);
  const straight = from.y === to.y;
  const lx = straight ? (from.x + to.x) / 2 : labelOnLastLeg ? (xm + to.x) / 2 : (from.x + xm) / 2;
  const ly = straight || !labelOnLastLeg ? from.y : to.y;
  return `<path d="${d}" fill="none" stroke="currentColor" stroke-width="1.2" marker-end="url(#bfd-arrow)"/><text x="${lx.toFixed(1)}" y="${(ly - 5).toFixed(1)}" text-anchor="middle" font-size="11" font-weight="bold">${numbers.join(', ')}</text>`;
}

/** A vertical arrow, with the stream numbers beside it. */
function downOrUp(x: number, fromY: number, toY: number, numbers: number[]): string {
  return `<path d="M${x},${fromY} L${x},${toY}" fill="none" stroke="currentColor" stroke-width="1.2" marker-end="url(#bfd-arrow)"/><text x="${x + 5}" y="${((fromY + toY) / 2 + 4).toFixed(1)}" font-size="11" font-weight="bold">${numbers.join(', ')}</text>`;
}

function drawBox(b: Box): string {
  const lines = b.label.map((t, i) => `<text x="${(b.x + b.w / 2).toFixed(1)}" y="${(b.y + b.h / 2 + (i - (b.label.length - 1) / 2) * 13 + 4).toFixed(1)}" text-anchor="middle" font-size="11">${escapeHtml(t)}</text>`);
  return `<rect x="${b.x}" y="${b.y}" width="${b.w}" height="${b.h}" fill="none" stroke="currentColor" stroke-width="1.2"/>${lines.join('')}`;
}

function drawTerminal(b: Box, anchor: 'start' | 'end'): string {
  return `<text x="${b.x}" y="${(b.y + b.h / 2 - 8).toFixed(1)}" text-anchor="${anchor}" font-size="10">${escapeHtml(b.label[0]!)}</text>`;
}

/** The name of a stream leaving the plant, just after its arrow's head. */
function exitLabel(x: number, y: number, label: string): string {
  return `<text x="${x}" y="${y + 4}" font-size="10">${escapeHtml(label)}</text>`;
}

/** The SVG around the boxes, arrows and labels (taller where a recuperator's feeds run below the air line). */
function svgOf(boxes: Box[], parts: string[], terminals: string[], height = AIR_Y + H + 62): TrustedHtml {
  const width = COL[7]! + 70;
  return trustedHtml(
    `<svg class="block-flow" viewBox="0 0 ${width} ${height}" width="100%" role="img" aria-label="Block flow diagram of the plant with its numbered streams" xmlns="http://www.w3.org/2000/svg">` +
      `<defs><marker id="bfd-arrow" viewBox="0 0 10 10" refX="10" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse"><path d="M0,0 L10,5 L0,10 z" fill="currentColor"/></marker></defs>` +
      boxes.map(drawBox).join('') +
      parts.join('') +
      terminals.join('') +
      '</svg>',
  );
}

/** A dashed return from a point on the stack's edge (top or bottom) to a box's edge on the same side. */
function loopBack(fromX: number, fromY: number, toX: number, toY: number, y: number, numbers: number[]): string {
  return `<path d="M${fromX},${fromY} L${fromX},${y} L${toX},${y} L${toX},${toY}" fill="none" stroke="currentColor" stroke-width="1.2" stroke-dasharray="4 3" marker-end="url(#bfd-arrow)"/><text x="${((fromX + toX) / 2).toFixed(1)}" y="${y + (y < toY ? -4 : 12)}" text-anchor="middle" font-size="11" font-weight="bold">${numbers.join(', ')}</text>`;
}

/** A diagram being drawn: the stream numbers by id, and the boxes, arrows and labels so far, in drawing order. */
interface Drawing {
  has: (id: string) => boolean;
  num: (...ids: string[]) => number[];
  boxes: Box[];
  parts: string[];
  terminals: string[];
  add: (b: Box) => Box;
}

function drawing(r: Results): Drawing {
  const n = new Map(r.plant.streams.map((s) => [s.id, s.number]));
  const has = (id: string) => n.has(id);
  const boxes: Box[] = [];
  return {
    has,
    num: (...ids: string[]) => ids.filter(has).map((id) => n.get(id)!),
    boxes,
    parts: [],
    terminals: [],
    add: (b: Box) => (boxes.push(b), b),
  };
}

/** The stack box, spanning the fuel line above and the air line below, in a column. */
function stackBox(d: Drawing, col: number): Box {
  return d.add(box(col, FUEL_Y - 10, ['stack', '(fuel electrode', 'above, air', 'electrode below)'], AIR_Y - FUEL_Y + H + 20));
}

type Electrolysis = NonNullable<Results['plant']['electrolysis']>;

/**
 * One electrode's feed preparation (steam raising, a water loop's make-up and cooler, gas preheat) with its inlet to the stack
 * and, unless a recuperator takes them first (recuperatorFeeds), the feeds into it from the plant's edge.
 */
function electrolysisFeedSide(d: Drawing, x: Electrolysis, stack: Box, side: FeedSide, isWaterSide: boolean): Box {
  const { has, num, parts, terminals } = d;
  const loop = isWaterSide && x.waterLoop !== null;
  const recuperated = x.recuperator !== null;
  const label = side.steam ? [recuperated ? 'feed heaters' : 'feed preparation', '(steam, preheat)'] : loop ? ['water loop', '(make-up, cooler)'] : ['preheat'];
  const prep = d.add(box(1, side.y, label));
  parts.push(arrow(right(prep), { x: stack.x, y: side.y + H / 2 }, num(`${side.id}-inlet`)));
  if (recuperated) return prep;
  const gasId = `${side.id}-gas-supply`;
  const withWater = isWaterSide && has('feed-water');
  if (has(gasId)) {
    const t = terminal(0, withWater ? side.y - 14 : side.y, side.gas);
    terminals.push(drawTerminal(t, 'start'));
    parts.push(arrow({ x: COL[0]!, y: t.y + H / 2 }, { x: prep.x, y: prep.y + H / 2 - (withWater ? 8 : 0) }, num(gasId), true));
  }
  if (withWater) {
    const t = terminal(0, has(gasId) ? side.y + 14 : side.y, 'feed water');
    terminals.push(drawTerminal(t, 'start'));
    parts.push(arrow({ x: COL[0]!, y: t.y + H / 2 }, { x: prep.x, y: prep.y + H / 2 + (has(gasId) ? 8 : 0) }, num('feed-water'), true));
  }
  if (loop && has('loop-return')) {
    const top = side.id === 'fuel';
    const edge = top ? stack.y : stack.y + stack.h;
    parts.push(loopBack(stack.x + W / 2, edge, prep.x + W / 2, top ? prep.y : prep.y + H, top ? edge - 14 : edge + 14, num('loop-return')));
  }
  return prep;
}

/**
 * The feed recuperator between the stack and the products' exits: the hot outlets pass through it.
 * Where the hydrogen and the oxygen side leave it (or the stack without it), and the box.
 */
function recuperatorPath(d: Drawing, x: Electrolysis, stack: Box): { fuel: { x: number; y: number; id: string }; air: { x: number; y: number; id: string }; shift: number; rec: Box | null } {
  const { has, num, parts } = d;
  const outFuel = { x: stack.x + W, y: FUEL_Y + H / 2 };
  const outAir = { x: stack.x + W, y: AIR_Y + H / 2 };
  if (x.recuperator === null) return { fuel: { ...outFuel, id: 'fuel-outlet' }, air: { ...outAir, id: 'air-outlet' }, shift: 0, rec: null };
  const rec = d.add(box(4, MID_Y, ['recuperator']));
  if (has('fuel-outlet')) parts.push(arrow(outFuel, { x: rec.x, y: rec.y + 12 }, num('fuel-outlet')));
  if (has('air-outlet')) parts.push(arrow(outAir, { x: rec.x, y: rec.y + H - 12 }, num('air-outlet')));
  return { fuel: { x: rec.x + W, y: rec.y + 12, id: 'fuel-outlet-recuperated' }, air: { x: rec.x + W, y: rec.y + H - 12, id: 'air-outlet-recuperated' }, shift: 1, rec };
}

/** An electrode's feed side of the electrolysis diagram: its row, whether it is fed steam, and the name of the gas fed with it. */
interface FeedSide {
  id: 'fuel' | 'air';
  y: number;
  steam: boolean;
  gas: string;
}

/** A stream along the points (horizontal and vertical legs), its arrow at the last, its numbers at `label`. */
function route(points: { x: number; y: number }[], numbers: number[], label: { x: number; y: number }): string {
  return `<path d="${pathData(points)}" fill="none" stroke="currentColor" stroke-width="1.2" marker-end="url(#bfd-arrow)"/><text x="${label.x.toFixed(1)}" y="${(label.y - 5).toFixed(1)}" text-anchor="middle" font-size="11" font-weight="bold">${numbers.join(', ')}</text>`;
}

/** Below the air line, where the recuperator's feeds run: out of it to each side's heaters, then, a row each, into it from the plant's edge. */
const REC_OUT_Y = { air: AIR_Y + H + 22, fuel: AIR_Y + H + 48 };
const REC_IN_Y = AIR_Y + H + 78;
const REC_ROW = 22;
/** Where the numbers of the lines below the air line stand: between the heaters and the stack. */
const REC_LABEL_X = (COL[1]! + W + COL[3]!) / 2;

/** How the feed water leaves the recuperator, for the note beside its stream: "steam", "water 28.29 % evaporated", "water". */
function feedWaterState(vapourFraction: number): string {
  return vapourFraction === 1 ? 'steam' : vapourFraction === 0 ? 'water' : `water ${formatPercent(vapourFraction)} evaporated`;
}

/**
 * The recuperator's cold side: the feed water and the gases enter it from the plant's edge (below
 * the air line, a row each, named as the heat-and-material balance names them), and leave it for
 * each side's heaters (the fuel side's round the left edge into its heaters, the air side's up into
 * its own), which take them on to the stack. The feed water leaving it is noted with its state and
 * its temperature as the balance writes it. Returns the height the drawing needs.
 */
function recuperatorFeeds(d: Drawing, r: Results, recuperator: NonNullable<Electrolysis['recuperator']>, rec: Box, heaters: Map<FeedSide, Box>): number {
  const { num, parts, terminals } = d;
  for (const [side, heater] of heaters) {
    const numbers = num(`${side.id}-steam-recuperated`, `${side.id}-gas-recuperated`);
    if (!numbers.length) continue;
    // The air side's line leaves nearer the stack and runs higher, so the two never cross.
    const y = REC_OUT_Y[side.id];
    const x0 = rec.x + (side.id === 'air' ? 16 : 34);
    const into = side.id === 'air' ? [{ x: heater.x + W / 2, y }, { x: heater.x + W / 2, y: heater.y + H }] : [{ x: COL[1]! - 20, y }, { x: COL[1]! - 20, y: heater.y + H / 2 }, left(heater)];
    parts.push(route([{ x: x0, y: rec.y + H }, { x: x0, y }, ...into], numbers, { x: REC_LABEL_X, y }));
    const water = r.plant.streams.find((s) => s.id === `${side.id}-steam-recuperated`);
    const fraction = recuperator.feeds.find((f) => f.id === `${side.id}-steam`)?.vapourFraction;
    if (water && fraction != null) terminals.push(`<text x="${COL[3]! + 10}" y="${y + 12}" font-size="10">${water.number}: ${escapeHtml(feedWaterState(fraction))}, ${formatCelsius(water.temperature_K)} °C</text>`);
  }
  const ids = ['feed-water', ...[...heaters.keys()].map((side) => `${side.id}-gas-supply`)];
  const feeds = r.plant.streams.filter((s) => ids.includes(s.id)).sort((a, b) => ids.indexOf(a.id) - ids.indexOf(b.id));
  // Each feed a row lower and a little further right than the one before, so that no two cross.
  feeds.forEach((f, k) => {
    const y = REC_IN_Y + k * REC_ROW;
    const x = rec.x + 58 + k * 16;
    terminals.push(`<text x="${COL[0]}" y="${y - 6}" font-size="10">${escapeHtml(f.name)}</text>`);
    parts.push(route([{ x: COL[0]!, y }, { x, y }, { x, y: rec.y + H }], num(f.id), { x: REC_LABEL_X, y }));
  });
  return REC_IN_Y + (feeds.length - 1) * REC_ROW + 16;
}

/** The hydrogen product: through its cooler and dryer to the compressor where there is one, else straight out. */
function hydrogenProductPath(d: Drawing, x: Electrolysis, from: { x: number; y: number; id: string }, shift: number): void {
  const { num, parts, terminals } = d;
  const outFuel = from;
  if (!x.compression) {
    parts.push(arrow(outFuel, { x: COL[4 + shift]!, y: FUEL_Y + H / 2 }, num(from.id)));
    terminals.push(exitLabel(COL[4 + shift]! + 4, FUEL_Y + H / 2, 'hydrogen product'));
    return;
  }
  const cooler = d.add(box(4 + shift, FUEL_Y, ['product cooler', 'and dryer']));
  const comp = d.add(box(5 + shift, FUEL_Y, ['compressor', `(${x.compression.stages} stage${x.compression.stages === 1 ? '' : 's'})`]));
  parts.push(arrow(outFuel, left(cooler), num(from.id)));
  parts.push(arrow(right(cooler), left(comp), num('product-dried')));
  parts.push(arrow(right(comp), { x: COL[6 + shift]!, y: FUEL_Y + H / 2 }, num('hydrogen-delivered')));
  terminals.push(exitLabel(COL[6 + shift]! + 4, FUEL_Y + H / 2, 'hydrogen'));
  const drops = num('product-condensate', 'dryer-water');
  if (drops.length) {
    parts.push(downOrUp(cooler.x + W / 2, cooler.y + H, cooler.y + H + 36, drops));
    terminals.push(`<text x="${cooler.x + W / 2}" y="${cooler.y + H + 48}" text-anchor="middle" font-size="10">water removed</text>`);
  }
}

/**
 * The electrolysis plant: the preparation of each electrode's feed (steam raising, a water loop's
 * make-up and cooler, gas preheat), the stack, and the hydrogen product through its cooler and
 * dryer to the compressor where there is one; the oxygen-side product leaves the plant.
 */
function electrolysisDiagram(r: Results): TrustedHtml {
  const x = r.plant.electrolysis!;
  const d = drawing(r);
  const { has, num, parts, terminals } = d;
  const stack = stackBox(d, 3);
  const waterOf = (id: string) => r.plant.streams.find((s) => s.id === id && (s.speciesFlows_mol_per_s.H2O ?? 0) + (s.speciesFlows_mol_per_s['H2O(L)'] ?? 0) > 0);
  const sides: FeedSide[] = [
    { id: 'fuel', y: FUEL_Y, steam: x.steam.some((s) => s.electrode === 'fuel'), gas: 'gas with the steam' },
    { id: 'air', y: AIR_Y, steam: x.steam.some((s) => s.electrode === 'air'), gas: 'sweep gas' },
  ];
  const water = sides.find((side) => waterOf(`${side.id}-inlet`));
  const heaters = new Map<FeedSide, Box>();
  for (const side of sides) if (has(`${side.id}-inlet`)) heaters.set(side, electrolysisFeedSide(d, x, stack, side, side === water));
  const out = recuperatorPath(d, x, stack);
  const height = out.rec && x.recuperator ? recuperatorFeeds(d, r, x.recuperator, out.rec, heaters) : undefined;
  hydrogenProductPath(d, x, out.fuel, out.shift);
  if (has(out.air.id)) {
    parts.push(arrow(out.air, { x: COL[4 + out.shift]!, y: AIR_Y + H / 2 }, num(out.air.id)));
    terminals.push(exitLabel(COL[4 + out.shift]! + 4, AIR_Y + H / 2, 'oxygen side'));
  }
  if (has('stack-drain')) {
    const drain = { x: stack.x + W / 2 + 20, y: stack.y + stack.h };
    parts.push(downOrUp(drain.x, drain.y, drain.y + 30, num('stack-drain')));
    terminals.push(`<text x="${drain.x}" y="${drain.y + 42}" text-anchor="middle" font-size="10">drain</text>`);
  }
  return svgOf(d.boxes, parts, terminals, height);
}

/** The boxes of a power plant, in drawing order; those of absent units null. */
function powerBoxes(d: Drawing) {
  const prep = d.add(box(1, FUEL_Y, ['feed preparation', '(steam, preheat)']));
  const pre = d.has('pre-reformer-feed') ? d.add(box(2, FUEL_Y, ['pre-reformer'])) : null;
  const fuelHeat = pre ? d.add(box(3, FUEL_Y, ['fuel preheat'])) : null;
  const blower = d.has('blower-outlet') ? d.add(box(1, AIR_Y, ['air blower'])) : null;
  const loop = d.has('burner-outlet');
  const airHeat = d.add(box(2, AIR_Y, loop ? ['cathode-gas mixer', 'and cooler'] : ['air preheat']));
  const stack = stackBox(d, 4);
  const ox = loop ? d.add(box(3, MID_Y, ['catalytic', 'burner'])) : d.has('oxidiser-outlet') ? d.add(box(5, MID_Y, ['off-gas', 'oxidiser'])) : null;
  const hr = d.has('exhaust') ? d.add(box(6, MID_Y, ['heat recovery'])) : null;
  return { prep, pre, fuelHeat, blower, airHeat, stack, ox, hr, loop };
}

type PowerBoxes = ReturnType<typeof powerBoxes>;

/** The feeds into the power plant and the fuel and air lines up to the stack, with the recycle above. */
function powerFeedLines(d: Drawing, b: PowerBoxes): void {
  const { has, num, parts, terminals } = d;
  const { prep, pre, fuelHeat, blower, airHeat, stack } = b;
  const fuelIn = terminal(0, FUEL_Y - 14, 'fuel');
  const waterIn = terminal(0, FUEL_Y + 14, 'feed water');
  const airIn = terminal(0, AIR_Y, 'air');
  terminals.push(drawTerminal(fuelIn, 'start'), drawTerminal(airIn, 'start'));
  if (has('feed-water')) terminals.push(drawTerminal(waterIn, 'start'));
  parts.push(arrow({ x: COL[0]!, y: fuelIn.y + H / 2 }, { x: prep.x, y: prep.y + H / 2 - 8 }, num('fuel-supply'), true));
  if (has('feed-water')) parts.push(arrow({ x: COL[0]!, y: waterIn.y + H / 2 }, { x: prep.x, y: prep.y + H / 2 + 8 }, num('feed-water'), true));
  const stackFuel = { x: stack.x, y: FUEL_Y + H / 2 };
  const stackAir = { x: stack.x, y: AIR_Y + H / 2 };
  if (pre && fuelHeat) {
    parts.push(arrow(right(prep), left(pre), num('pre-reformer-feed')));
    parts.push(arrow(right(pre), left(fuelHeat), num('pre-reformer-outlet')));
    parts.push(arrow(right(fuelHeat), stackFuel, num('fuel-inlet')));
  } else {
    parts.push(arrow(right(prep), stackFuel, num('fuel-inlet')));
  }
  if (b.loop) {
    // A cathode-gas loop's air goes to its burner (cathodeLoopLines).
    if (blower) parts.push(arrow({ x: COL[0]!, y: AIR_Y + H / 2 }, left(blower), num('air-supply')));
  } else if (blower) {
    parts.push(arrow({ x: COL[0]!, y: AIR_Y + H / 2 }, left(blower), num('air-supply')));
    parts.push(arrow(right(blower), left(airHeat), num('blower-outlet')));
  } else {
    parts.push(arrow({ x: COL[0]!, y: AIR_Y + H / 2 }, left(airHeat), num('air-supply')));
  }
  if (!b.loop) parts.push(arrow(right(airHeat), stackAir, num('air-inlet')));
  if (has('recycle')) {
    // The recycle leaves the stack's top and returns to the feed preparation above the fuel line.
    const top = stack.y - 14;
    parts.push(
      `<path d="M${stack.x + W / 2},${stack.y} L${stack.x + W / 2},${top} L${prep.x + W / 2},${top} L${prep.x + W / 2},${prep.y}" fill="none" stroke="currentColor" stroke-width="1.2" stroke-dasharray="4 3" marker-end="url(#bfd-arrow)"/><text x="${((stack.x + prep.x + W) / 2).toFixed(1)}" y="${top - 4}" text-anchor="middle" font-size="11" font-weight="bold">${num('recycle').join(', ')}</text>`,
    );
  }
}

/** The stack's outlets: into the off-gas oxidiser and the heat recovery where there are, else out of the plant. */
function powerOutletLines(d: Drawing, b: PowerBoxes): void {
  const { has, num, parts, terminals } = d;
  const { stack, ox, hr } = b;
  const stackOutFuel = { x: stack.x + W, y: FUEL_Y + H / 2 };
  const stackOutAir = { x: stack.x + W, y: AIR_Y + H / 2 };
  if (!ox) {
    terminals.push(exitLabel(COL[5]! + 4, stackOutFuel.y, 'off-gas'), exitLabel(COL[5]! + 4, stackOutAir.y, 'air exhaust'));
    parts.push(arrow(stackOutFuel, { x: COL[5]!, y: stackOutFuel.y }, num('fuel-outlet')));
    parts.push(arrow(stackOutAir, { x: COL[5]!, y: stackOutAir.y }, num('air-outlet')));
    return;
  }
  parts.push(arrow(stackOutFuel, { x: ox.x, y: ox.y + 12 }, num('fuel-outlet')));
  parts.push(arrow(stackOutAir, { x: ox.x, y: ox.y + H - 12 }, num('air-outlet')));
  if (has('oxidiser-air')) {
    parts.push(downOrUp(ox.x + W / 2, AIR_Y + H + 20, ox.y + H, num('oxidiser-air')));
    terminals.push(`<text x="${ox.x + W / 2}" y="${AIR_Y + H + 32}" text-anchor="middle" font-size="10">air from the blower</text>`);
  }
  if (!hr) {
    terminals.push(exitLabel(COL[6]! + 4, ox.y + H / 2, 'exhaust'));
    parts.push(arrow(right(ox), { x: COL[6]!, y: ox.y + H / 2 }, num('oxidiser-outlet', 'exhaust-mixed')));
    return;
  }
  parts.push(arrow(right(ox), left(hr), num('oxidiser-outlet', 'exhaust-mixed')));
  terminals.push(exitLabel(COL[7]! + 4, hr.y + 12, 'exhaust'));
  parts.push(arrow({ x: hr.x + W, y: hr.y + 12 }, { x: COL[7]!, y: hr.y + 12 }, num('exhaust')));
  if (has('condensate')) {
    terminals.push(exitLabel(COL[7]! + 4, hr.y + H - 10, 'condensate'));
    parts.push(arrow({ x: hr.x + W, y: hr.y + H - 10 }, { x: COL[7]!, y: hr.y + H - 10 }, num('condensate')));
  }
}

/** A line through the points, arrowed at its end, with the stream numbers on the leg from `points[leg]` (dashed for a recycle). */
function polyline(points: readonly { x: number; y: number }[], numbers: number[], leg: number, dashed = false): string {
  const a = points[leg]!;
  const b = points[leg + 1]!;
  const label = a.y === b.y ? `<text x="${((a.x + b.x) / 2).toFixed(1)}" y="${(a.y - 5).toFixed(1)}" text-anchor="middle"` : `<text x="${(a.x + 5).toFixed(1)}" y="${((a.y + b.y) / 2 + 4).toFixed(1)}"`;
  return `<path d="${pathData(points)}" fill="none" stroke="currentColor" stroke-width="1.2"${dashed ? ' stroke-dasharray="4 3"' : ''} marker-end="url(#bfd-arrow)"/>${label} font-size="11" font-weight="bold">${numbers.join(', ')}</text>`;
}

/**
 * A carbonate cell's cathode-gas loop: the burner air and the off-gas (round the stack's top) into
 * the catalytic burner, its products and the recycled exhaust (round the bottom) into the mixer and
 * its cooler or heater, the mixture into the stack, the exhaust not recycled out of the plant or
 * into the heat recovery.
 */
function cathodeLoopLines(d: Drawing, b: PowerBoxes): void {
  const { num, parts, terminals } = d;
  const { blower, airHeat: mixer, stack, hr } = b;
  const burner = b.ox!;
  const from = blower ? right(blower) : { x: COL[0]!, y: AIR_Y + H / 2 };
  const turn = COL[2]! - 18;
  parts.push(polyline([from, { x: turn, y: from.y }, { x: turn, y: burner.y + H / 2 }, left(burner)], num(blower ? 'blower-outlet' : 'air-supply'), blower ? 2 : 0));
  const fuelOut = { x: stack.x + W, y: FUEL_Y + H / 2 };
  const top = 8;
  // Down the gap between the burner's column and the stack, into the burner's right side: a fuel preheat may stand above the burner.
  const gap = (burner.x + W + stack.x) / 2;
  parts.push(polyline([fuelOut, { x: fuelOut.x + 16, y: fuelOut.y }, { x: fuelOut.x + 16, y: top }, { x: gap, y: top }, { x: gap, y: burner.y + 12 }, { x: burner.x + W, y: burner.y + 12 }], num('fuel-outlet'), 1));
  const mixerX = mixer.x + W / 2;
  parts.push(polyline([{ x: burner.x + W / 2, y: burner.y + burner.h }, { x: burner.x + W / 2, y: burner.y + burner.h + 14 }, { x: mixerX, y: burner.y + burner.h + 14 }, { x: mixerX, y: mixer.y }], num('burner-outlet'), 1));
  parts.push(arrow(right(mixer), { x: stack.x, y: AIR_Y + H / 2 }, num('cathode-gas-mixed', 'air-inlet')));
  const airOut = { x: stack.x + W, y: AIR_Y + H / 2 };
  parts.push(loopBack(airOut.x + 20, airOut.y, mixerX, mixer.y + mixer.h, AIR_Y + H + 24, num('cathode-recycle')));
  if (hr) {
    parts.push(arrow(airOut, left(hr), num('air-outlet', 'cathode-vent')));
    terminals.push(exitLabel(COL[7]! + 4, hr.y + 12, 'exhaust'));
    parts.push(arrow({ x: hr.x + W, y: hr.y + 12 }, { x: COL[7]!, y: hr.y + 12 }, num('exhaust')));
    if (d.has('condensate')) {
      terminals.push(exitLabel(COL[7]! + 4, hr.y + H - 10, 'condensate'));
      parts.push(arrow({ x: hr.x + W, y: hr.y + H - 10 }, { x: COL[7]!, y: hr.y + H - 10 }, num('condensate')));
    }
    return;
  }
  terminals.push(exitLabel(COL[6]! + 4, airOut.y, 'exhaust'));
  parts.push(arrow(airOut, { x: COL[6]!, y: airOut.y }, num('air-outlet', 'cathode-vent')));
}

/** The power plant: feed preparation, pre-reformer, fuel preheat, blower, air preheat, stack, off-gas oxidiser, heat recovery. */
function powerDiagram(r: Results): TrustedHtml {
  const d = drawing(r);
  const b = powerBoxes(d);
  powerFeedLines(d, b);
  if (b.loop) cathodeLoopLines(d, b);
  else powerOutletLines(d, b);
  if (d.has('fuel-electrode-water') || d.has('air-electrode-water')) {
    const water = { x: b.stack.x + W / 2, y: b.stack.y + b.stack.h };
    d.terminals.push(`<text x="${water.x}" y="${water.y + 42}" text-anchor="middle" font-size="10">liquid water</text>`);
    d.parts.push(downOrUp(water.x, water.y, water.y + 30, d.num('fuel-electrode-water', 'air-electrode-water')));
  }
  return svgOf(d.boxes, d.parts, d.terminals);
}

/** The diagram of the results' plant, or null where there is no plant balance. */
export function blockFlowDiagram(r: Results): TrustedHtml | null {
  if (r.plant.electrolysis) return electrolysisDiagram(r);
  if (!r.plant.power) return null;
  return powerDiagram(r);
}
