// Worked lines that differ only in their numbers share one KaTeX render: the structure's output
// is learnt once and each line's digits are placed in it (lib/report/katex-structure.ts). The
// reference is KaTeX itself: katex.renderToString with the options the documents use
// (katexOptions). Every expression of the document of every demo (projects/*) and every scaffold
// (`cellbasis new`) must come out byte for byte as KaTeX writes it, and each one with digits must
// have been made from a structure (else the fast path would be tested on nothing).
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import katex from 'katex';
import { describe, expect, it, vi } from 'vitest';
import { scaffoldKinds } from '../../lib/basis/scaffolds.ts';
import { loadBasisText } from '../../lib/basis/load.ts';
import type { DesignBasis } from '../../lib/basis/types.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { documentView } from '../../lib/report/document.ts';
import { fillStructure, learnStructure, splitNumbers } from '../../lib/report/katex-structure.ts';
import { katexOptions, renderTex } from '../../lib/report/katex-render.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';

/** Every expression the documents hand to renderTex, with its display mode. */
const expressions = vi.hoisted(() => new Map<string, { tex: string; display: boolean }>());

vi.mock('../../lib/report/katex-render.ts', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../lib/report/katex-render.ts')>();
  return {
    ...real,
    renderTex: (tex: string, display = false) => {
      expressions.set(`${display ? 'D' : 'I'}${tex}`, { tex, display });
      return real.renderTex(tex, display);
    },
  };
});

const reference = (tex: string, display: boolean) => katex.renderToString(tex, katexOptions(display));

function documentOf(basis: DesignBasis): void {
  documentView({ basis, results: calculate(basis), revision: { kind: 'draft', revision: 'A', lastIssued: null, date: null }, history: [] }, { assetBase: '../../assets/' });
}

/** Expressions whose HTML is not KaTeX's own, and expressions with digits not made from a structure. */
function differences(list: { tex: string; display: boolean }[]): { wrong: string[]; unstructured: string[] } {
  const wrong: string[] = [];
  const unstructured: string[] = [];
  const learnt = new Map<string, ReturnType<typeof learnStructure>>();
  for (const { tex, display } of list) {
    const expected = reference(tex, display);
    if (renderTex(tex, display).html !== expected) wrong.push(tex);
    const split = splitNumbers(tex);
    if (split === null) continue;
    const mapKey = `${display}${split.key}`;
    if (!learnt.has(mapKey)) learnt.set(mapKey, learnStructure(split, (probe) => reference(probe, display)));
    const structure = learnt.get(mapKey)!;
    if (structure === null) unstructured.push(tex);
    else if (fillStructure(structure, split.numbers) !== expected) wrong.push(tex);
  }
  return { wrong, unstructured };
}

describe('KaTeX structures filled with the numbers', () => {
  it('give KaTeX’s own bytes for every worked line and equation of every demo and scaffold', () => {
    const demos = readdirSync(join(PACKAGE_ROOT, 'projects'));
    expect(demos.length).toBeGreaterThanOrEqual(4);
    for (const id of demos) {
      const loaded = loadBasisText(readFileSync(join(PACKAGE_ROOT, 'projects', id, 'basis.yaml'), 'utf8'), `projects/${id}/basis.yaml`, id);
      if (!loaded.ok) throw new Error(`${id}: ${loaded.errors.map((e) => e.message).join('; ')}`);
      documentOf(loaded.basis);
    }
    for (const kind of scaffoldKinds()) documentOf(basisFrom(kind.technology, kind.mode));
    const list = [...expressions.values()];
    const withNumbers = list.filter((e) => splitNumbers(e.tex) !== null);
    // Each document has dozens of worked lines; a collection this small would mean the mock saw nothing.
    expect(withNumbers.length).toBeGreaterThan(300);
    expect(list.some((e) => e.display && e.tex.startsWith('\\begin{aligned}'))).toBe(true);
    expect(differences(list)).toEqual({ wrong: [], unstructured: [] });
  });

  it('give KaTeX’s own bytes for fractions, scripts, text, signs, exponents and thin spaces', () => {
    const cases = [
      '\\frac{12.5}{3.07} = 4.0717',
      '\\dfrac{1}{2}\\,\\frac{34}{5678}',
      'x_{12}^{345} + \\mathrm{H_{2}O}_{7}',
      '\\text{Eq. 12 at 650 K} = 3',
      '-19.54 - (-0.123)',
      '3.223\\times10^{-5} \\cdot 6.02\\times10^{23}',
      '37^{2} + 2.5_{10} - 125_{3}^{4}',
      '328\\,960\\,\\mathrm{J/mol}',
      '\\sqrt{2.5} + \\sqrt[3]{27}',
      '\\ln\\frac{0.21^{0.5}\\,1.013}{0.0317}',
      // More than 9 and more than 81 numbers: two and three probes.
      '1234567890.123 + 7',
      Array.from({ length: 90 }, (_, i) => `${(i * 13) % 1000}`).join(' + '),
      Array.from({ length: 12 }, (_, i) => `${i}.${(i * 37) % 100}\\,${(i * 911) % 1000}`).join(' + '),
    ];
    const list = cases.flatMap((tex) => [{ tex, display: false }, { tex, display: true }]);
    expect(differences(list)).toEqual({ wrong: [], unstructured: [] });
  });

  it('leaves sizes and colours to KaTeX, whose digits are not numbers shown', () => {
    expect(splitNumbers('a\\kern1.5em b')).toBeNull();
    expect(splitNumbers('\\textcolor{#ff0000}{1}')).toBeNull();
    expect(splitNumbers('x = y')).toBeNull();
    expect(renderTex('1\\kern0.25em 2').html).toBe(reference('1\\kern0.25em 2', false));
  });

  it('takes a script’s one digit alone and leaves a command’s bare digit argument to KaTeX', () => {
    // x_12 is x with subscript 1, then 2; \\int_0^1 has limits 0 and 1.
    expect(splitNumbers('x_12 + \\int_0^1')).toEqual({ key: 'x_00 + \\int_0^0', numbers: ['1', '2', '0', '1'], widths: [1, 1, 1, 1] });
    expect(splitNumbers('x_1.5')).toBeNull();
    for (const tex of ['\\frac12', '\\sqrt 2']) expect(splitNumbers(tex)).toBeNull();
    for (const tex of ['x_12', 'y^23', 'x_12^{3.5}', '\\int_0^1 \\mathrm{cm^2}\\,3.25', '\\frac12', '\\sqrt 2']) {
      expect(renderTex(tex).html).toBe(reference(tex, false));
      const split = splitNumbers(tex);
      if (split) expect(fillStructure(learnStructure(split, (t) => reference(t, false))!, split.numbers)).toBe(reference(tex, false));
    }
    // A script binds to the last digit: 10^{-5} is 1 and 0⁻⁵, two numbers of the structure.
    expect(splitNumbers('3.2\\times10^{-5}')).toEqual({ key: '00\\times00^{-0}', numbers: ['3.2', '1', '0', '5'], widths: [2, 1, 1, 1] });
    expect(splitNumbers('1.5^{2}')).toBeNull();
  });

  it('refuses a structure whose output depends on its digits in any other way', () => {
    // The output's length changes with the digits.
    expect(learnStructure({ key: '0+0', widths: [1, 1] }, (t) => String(t.length))).toBeNull();
    // A character other than a digit changes.
    expect(learnStructure({ key: '0', widths: [1] }, (t) => (t === '0' ? 'a0' : `b${t}`))).toBeNull();
    // The probes pass (each digit lands in one place) but the digit shown is not the source's: the last check refuses it.
    expect(learnStructure({ key: '0', widths: [1] }, (t) => t.replace(/\d/g, (d) => String((Number(d) * Number(d)) % 10)))).toBeNull();
    // A plain copy, reordered as KaTeX orders a fraction (denominator first), is learnt.
    const swap = (t: string) => t.split('/').reverse().join('|');
    const structure = learnStructure({ key: '00/0', widths: [2, 1] }, swap)!;
    expect(structure).not.toBeNull();
    expect(fillStructure(structure, ['12.5', '3'])).toBe('3|12.5');
  });
});
