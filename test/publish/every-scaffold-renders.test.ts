// Every scaffold that `cellbasis new` writes, as it stands, gives a document: it is calculated,
// rendered with the site's templates, and each figure has data. A scaffold whose document could
// not be rendered (the proton-ceramic electrolyser's current-density sweep came out empty, so
// its polarisation figure failed and `build` stopped with an internal error) is a defect a new
// user meets in the first minute.
import { describe, expect, it } from 'vitest';
import { scaffoldKinds } from '../../lib/basis/scaffolds.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { renderDocumentHtml } from '../../lib/publish/render.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';

describe.each(scaffoldKinds().map((k) => [k.technology, k.mode] as const))('the %s %s scaffold', (technology, mode) => {
  it('renders its document, every figure with data', () => {
    const basis = basisFrom(technology, mode);
    const results = calculate(basis);
    expect(results.sweeps.currentDensity.length).toBeGreaterThan(5);
    const html = renderDocumentHtml({ basis, results, revision: { kind: 'draft', revision: 'A', lastIssued: null, date: null }, history: [] }, { assetBase: '../../assets/' });
    expect(html).toContain(basis.document.number);
    expect(html).toMatch(/Cell voltage against current density/);
  });
});
