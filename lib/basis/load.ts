/**
 * Loads a design basis: bytes → text (source-text.ts) → YAML tree (yaml-syntax.ts) → schema
 * (zod-findings.ts) → physics and consistency (interpret.ts), and each operating case as a basis
 * of its own (read-cases.ts) → `DesignBasis`, or every problem
 * found, each located at `file:line:col` and sorted by position. Warnings never stop a basis.
 */
import { isMap, isScalar, isSeq } from 'yaml';
import { decodeBasisBytes, MAX_BASIS_BYTES, tooLargeError } from './source-text.ts';
import { parseBasisYaml } from './yaml-syntax.ts';
import { schemaFindings } from './zod-findings.ts';
import { RETIRED_DOCUMENT_KEYS } from './schema.ts';
import { interpret } from './interpret.ts';
import { locate } from './locate.ts';
import { Reader } from './reader.ts';
import { Findings, sortDiagnostics, type Path } from './diagnostics.ts';
import { completeCases, mixturesNamedByCases, readCases } from './read-cases.ts';
import type { DesignBasis, Diagnostic } from './types.ts';
import { EXIT_USAGE } from '../core/errors.ts';
import { readRegularFile } from '../core/read-file.ts';

export type LoadResult = { ok: true; basis: DesignBasis; warnings: Diagnostic[] } | { ok: false; errors: Diagnostic[]; warnings: Diagnostic[] };

function failed(errors: Diagnostic[], warnings: Diagnostic[] = []): LoadResult {
  return { ok: false, errors: sortDiagnostics(errors), warnings: sortDiagnostics(warnings) };
}

/** Line and column of every value of the document, keyed by dotted path. */
function valuePositions(doc: Parameters<typeof locate>[0], lines: Parameters<typeof locate>[1]): Record<string, { line: number; column: number }> {
  const out: Record<string, { line: number; column: number }> = {};
  const walk = (node: unknown, path: string) => {
    if (isMap(node)) {
      for (const pair of node.items) {
        const key = isScalar(pair.key) ? String(pair.key.value) : String(pair.key);
        const child = path ? `${path}.${key}` : key;
        const target = (pair.value as { range?: [number, number, number] } | null)?.range ?? (pair.key as { range?: [number, number, number] } | null)?.range;
        if (target) {
          const { line, col } = lines.linePos(target[0]);
          out[child] = { line, column: col };
        }
        walk(pair.value, child);
      }
    } else if (isSeq(node)) {
      node.items.forEach((item, i) => {
        const child = `${path}.${i}`;
        const range = (item as { range?: [number, number, number] } | null)?.range;
        if (range) {
          const { line, col } = lines.linePos(range[0]);
          out[child] = { line, column: col };
        }
        walk(item, child);
      });
    }
  };
  walk(doc.contents, '');
  return out;
}

export interface LoadOptions {
  /**
   * Read `document.revision` and `document.status` as bases issued before the archive numbered
   * the revisions carried them (issue format 1, whose manifest the audit checks them against), and
   * leave them out of the basis; elsewhere they are refused (schema.ts RETIRED_DOCUMENT_KEYS).
   */
  formerRevisionKeys?: boolean;
}

/** The data without document.revision and document.status (see LoadOptions). */
function withoutRetiredKeys(data: unknown): unknown {
  if (data === null || typeof data !== 'object' || Array.isArray(data)) return data;
  const document = (data as Record<string, unknown>).document;
  if (document === null || typeof document !== 'object' || Array.isArray(document)) return data;
  const kept = Object.fromEntries(Object.entries(document).filter(([key]) => !Object.hasOwn(RETIRED_DOCUMENT_KEYS, key)));
  return { ...(data as Record<string, unknown>), document: kept };
}

/**
 * Checks the text (or bytes) of a basis. `file` names it in diagnostics (as the user gave it);
 * `id` is the project id.
 */
export function loadBasisText(text: string | Uint8Array, file: string, id: string, options: LoadOptions = {}): LoadResult {
  const decoded = decodeBasisBytes(text, file);
  if (!decoded.ok) return failed(decoded.errors);
  const parsed = parseBasisYaml(decoded.text, file);
  if (!parsed.ok) return failed(parsed.errors, parsed.warnings);
  const data = options.formerRevisionKeys ? withoutRetiredKeys(parsed.data) : parsed.data;
  const findings = new Findings();
  const flagged = schemaFindings(data, findings);
  const reader = new Reader(data, flagged, findings);
  const result = interpret(reader, { mixturesUsedElsewhere: mixturesNamedByCases(data) });
  const drafts = readCases(data, flagged, findings, result);
  const place = (f: Parameters<typeof locate>[3]) => locate(parsed.doc, parsed.lines, file, f);
  const located = findings.list.map(place);
  const errors = located.filter((d) => d.severity === 'error');
  const warnings = sortDiagnostics([...parsed.warnings, ...located.filter((d) => d.severity === 'warning')]);
  if (errors.length) return failed(errors, warnings);
  if (!result) throw new Error(`${file}: the basis could not be read, yet no problem was found in it`);
  const position = (d: Diagnostic) => d.line * 1e6 + d.column;
  const inputs = reader.inputs
    .map((input) => ({ input, where: place({ severity: 'warning', at: input.at, target: 'value', message: '' }) }))
    .sort((a, b) => position(a.where) - position(b.where))
    .map(({ input, where }) => ({ ...input.record, line: where.line, column: where.column }));
  const positions = valuePositions(parsed.doc, parsed.lines);
  const base = { id, file, ...result, inputs, warnings, positions };
  const at = (input: { at: Path }) => place({ severity: 'warning', at: input.at, target: 'value', message: '' });
  return { ok: true, basis: { ...base, cases: completeCases(drafts, base, at, place) }, warnings };
}

/** A basis file over the size limit, as the located diagnostic the loader reports. */
class TooLarge extends Error {
  constructor(readonly diagnostic: Diagnostic) {
    super(diagnostic.message);
  }
}

/**
 * Reads a basis file once (lib/core/read-file.ts: a FIFO, a device or a folder is refused before
 * it is opened, exit 2 since the argument names no basis; never more than the size limit is read,
 * whatever the size said) and checks it: the result and the bytes it was made from, so that a
 * caller keying a cache or quoting the text uses the very bytes that were checked. `check` loads
 * the bytes instead of loadBasisText (the site's loads go through a cache of checked bases,
 * lib/batch/basis-cache.ts).
 */
export function readBasisFile(
  path: string,
  options: { id?: string; displayPath?: string; check?: (bytes: Buffer, file: string, id: string) => LoadResult } & LoadOptions = {},
): { result: LoadResult; bytes?: Buffer } {
  const file = options.displayPath ?? path;
  const id = options.id ?? path.split(/[\\/]/).slice(-2, -1)[0] ?? 'basis';
  let bytes: Buffer;
  try {
    bytes = readRegularFile(path, {
      maxBytes: MAX_BASIS_BYTES,
      what: 'design basis',
      shown: file,
      exitCode: EXIT_USAGE,
      tooLarge: (size, atLeast) => new TooLarge(tooLargeError(file, size, atLeast)),
    });
  } catch (error) {
    if (error instanceof TooLarge) return { result: failed([error.diagnostic]) };
    throw error;
  }
  return { result: options.check ? options.check(bytes, file, id) : loadBasisText(bytes, file, id, options), bytes };
}

/** Reads and checks a basis file; the id defaults to the name of its folder. */
export function loadBasisFile(path: string, options: { id?: string; displayPath?: string } & LoadOptions = {}): LoadResult {
  return readBasisFile(path, options).result;
}
