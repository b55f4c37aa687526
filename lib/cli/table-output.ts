/**
 * Tables on the command line: the tables of lib/report/table.ts printed as text (their formatted
 * cells, aligned) or, with --csv, as CSV (their data: numbers unrounded, the unit in each
 * column's name; lib/core/csv.ts). Every command that prints a table offers --csv.
 */
import type { Io, OptionSpec, ParsedArgs } from './command.ts';
import { textTable } from '../core/plain-text.ts';
import { UserError } from '../core/errors.ts';
import { didYouMean } from '../core/suggest.ts';
import { tableCsv, type Table } from '../report/table.ts';

export const CSV_OPTION: OptionSpec = {
  name: 'csv',
  type: 'boolean',
  description: 'print the table as CSV (RFC 4180, UTF-8): numbers unrounded, each unit in its column name (or a unit column where rows differ)',
};

/** The table as text: its title (none for null), the header, and its rows as the document shows them. */
export function tableText(t: Table, title: string | null = t.title): string {
  const shown = t.rows.length;
  const all = t.data.rows.length;
  // A chart's data table shows every k-th point; the CSV holds them all.
  const note = t.head.length && shown < all && !t.rows.some((r) => r.group !== undefined) ? `(${shown} of ${all} rows shown; --csv prints all of them)\n` : '';
  const body = t.rows.length ? `${textTable(t.head, t.align, t.rows)}${note}` : '(none)\n';
  return `${title === null ? '' : `${title}\n`}${body}`;
}

/** Whether --json and --csv were both given, which no command accepts. */
export function checkOutputOptions(args: ParsedArgs, command: string): void {
  if (args.values.json && args.values.csv) throw new UserError(`${command}: give --json or --csv, not both (see cellbasis ${command} --help)`);
}

/** Prints a command's table as text (with its title, or `title`; null for none) or, with --csv, as CSV. */
export function printTable(io: Io, args: ParsedArgs, t: Table, title?: string | null): void {
  io.out(args.values.csv ? tableCsv(t) : tableText(t, title));
}

/** The --section option of a command with several tables. */
export function sectionOption(what: string): OptionSpec {
  return { name: 'section', type: 'string', value: 'NAME', multiple: true, description: `print only this ${what}; repeat it, or separate names with commas; "all" for every one` };
}

/**
 * The names --section chose, in the order given (each once), checked against `names`; null
 * when --section was not given. An unknown name is a usage error naming the closest ones.
 */
export function chosenSections(args: ParsedArgs, names: readonly string[], command: string): string[] | null {
  const given = args.values.section;
  if (given === undefined) return null;
  const list = (Array.isArray(given) ? given : [String(given)]).flatMap((v) => v.split(',')).map((v) => v.trim()).filter((v) => v !== '');
  if (list.length === 0) throw new UserError(`${command}: --section needs a name; the sections are ${names.join(', ')}`);
  const chosen: string[] = [];
  for (const name of list) {
    if (name === 'all') chosen.push(...names);
    else if (names.includes(name)) chosen.push(name);
    else throw new UserError(`${command}: no section "${name}"${didYouMean(name, names)} (the sections: ${names.join(', ')})`);
  }
  return [...new Set(chosen)];
}
