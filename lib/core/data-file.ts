/**
 * The library's own data files (YAML with a provenance header: units, technologies, limits,
 * presets, species names, reference checks, hazard data), read once and checked against a zod
 * schema at load. A file that does not match is a fault of the library, not of the user's input:
 * it stops with an internal error naming the file and every place that is wrong, before any
 * number is computed from it.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { relative } from 'node:path';
import { parse as parseYaml } from 'yaml';
import type { z } from 'zod';

const LIB = fileURLToPath(new URL('..', import.meta.url));

/** The file at `url` (beside the module that reads it), parsed as YAML and checked by `schema`. */
export function readDataFile<T extends z.ZodType>(url: URL, schema: T): z.output<T> {
  const name = `lib/${relative(LIB, fileURLToPath(url))}`;
  const result = schema.safeParse(parseYaml(readFileSync(url, 'utf8')));
  if (!result.success) {
    const problems = result.error.issues.map((issue) => `${issue.path.join('.') || '(the file)'}: ${issue.message}`);
    throw new Error(`${name} does not match its schema: ${problems.join('; ')}`);
  }
  return result.data;
}
