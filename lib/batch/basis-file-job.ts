/**
 * The calculation job of a project's basis file (`projects/<id>/basis.yaml` under a root), as a
 * build lists it: the file is read once to key it (resultsKey) and its bytes let go; when the
 * job's turn comes the file is read again, keyed again and loaded. A waiting job is its names and
 * key, where it held the basis's bytes before (about 6.3 kB a synthetic project, 12 MiB for 2 000
 * held through the calculation). Measured 5 December 2026 on the cold build of 2 000
 * bench/synthetic.ts projects (peak RSS by bench/site.ts's probe, beside the full bench, load
 * average 9-13; the peak in the first 150 calculations, while the worker starts): 383 MiB before,
 * 344 MiB with the reader's smaller buffers alone (lib/core/read-file.ts), 327 and 339 MiB (two
 * runs) with this too, in the same processor time (310-311 s against 324 s).
 *
 * A file changed between the listing and its turn is calculated as it then reads, and its results
 * stored under the key of those bytes (`load` gives it): the cache never holds results under the
 * key of other bytes, and the site model, which reads every basis again, finds them there if the
 * file has not changed once more. A file that no longer reads or loads leaves the job out
 * (`load` gives undefined), to be named, with its file and field, when the site model loads it.
 *
 *   basisFileJob(root, id): DeferredJob    throws the UserError of readRegularFile when the file
 *                                          cannot be read now
 */
import { join } from 'node:path';
import { loadBasisText } from '../basis/load.ts';
import { MAX_BASIS_BYTES } from '../basis/source-text.ts';
import type { DesignBasis } from '../basis/types.ts';
import { UserError } from '../core/errors.ts';
import { readRegularFile } from '../core/read-file.ts';
import type { DeferredJob } from './batch.ts';
import { resultsKey } from './results-cache.ts';

/** The bytes of the basis file, by the bounded reader (a design basis is at most MAX_BASIS_BYTES). */
function readBasis(path: string, shown: string): Buffer {
  return readRegularFile(path, { maxBytes: MAX_BASIS_BYTES, what: 'design basis', shown });
}

/**
 * The job's `load`, made here rather than inside basisFileJob: an arrow made there would share
 * that function's variables, the listed bytes among them, and hold them until the job's turn.
 */
function loadAtTurn(path: string, id: string, shown: string): () => { basis: DesignBasis; key: string } | undefined {
  return () => {
    let bytes: Buffer;
    try {
      bytes = readBasis(path, shown);
    } catch (error) {
      if (error instanceof UserError) return undefined;
      throw error;
    }
    const loaded = loadBasisText(bytes, shown, id);
    return loaded.ok ? { basis: loaded.basis, key: resultsKey(bytes, id, shown) } : undefined;
  };
}

export function basisFileJob(root: string, id: string): DeferredJob {
  const shown = `projects/${id}/basis.yaml`;
  const path = join(root, 'projects', id, 'basis.yaml');
  return { id, file: shown, key: resultsKey(readBasis(path, shown), id, shown), load: loadAtTurn(path, id, shown) };
}
