// The sealed basis text: only document.revision and document.status change, byte for byte.
import { describe, expect, it } from 'vitest';
import { renderScaffold } from '../../lib/basis/scaffolds.ts';
import { sealedBasisText } from '../../lib/archive/sealed-basis.ts';
import { loadBasisText } from '../../lib/basis/load.ts';

const BASE = renderScaffold('pem', 'power', 'demo', '2026-11-30');

describe('sealedBasisText', () => {
  it('replaces the two values and keeps every comment and every other character', () => {
    const sealed = sealedBasisText(BASE, 'B', 'issued for review');
    const expected = BASE.replace(/^(  revision: )A( +#)/m, '$1B$2').replace(/^(  status: )draft( +#)/m, '$1issued for review$2');
    expect(expected).not.toBe(BASE);
    expect(sealed).toBe(expected);
    const loaded = loadBasisText(sealed, 'sealed.yaml', 'demo');
    expect(loaded.ok && loaded.basis.document).toMatchObject({ revision: 'B', status: 'issued for review' });
  });

  it('quotes a number revision, keeps quoting styles and works in flow mappings', () => {
    expect(sealedBasisText(BASE, '0', 'approved')).toMatch(/^ {2}revision: "0" +# revision/m);
    const quoted = BASE.replace('revision: A ', "revision: 'A'").replace('status: draft ', 'status: "draft"');
    expect(sealedBasisText(quoted, 'C', 'issued for approval')).toMatch(/revision: 'C'[\s\S]*status: "issued for approval"/);
    const flow = 'document: { revision: A, status: draft }  # control\n';
    expect(sealedBasisText(flow, '1', 'issued for review')).toBe('document: { revision: "1", status: issued for review }  # control\n');
  });
});
