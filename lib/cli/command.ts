/**
 * The shape of a cellbasis command and the option parsing every command shares
 * (node:util parseArgs, strict). Help text is generated from the same declarations, so
 * `cellbasis COMMAND --help` always lists every option.
 */
import { parseArgs } from 'node:util';
import { UserError } from '../core/errors.ts';

export interface OptionSpec {
  name: string;
  type: 'string' | 'boolean';
  /** Placeholder shown in help, e.g. "T". */
  value?: string;
  description: string;
  multiple?: boolean;
}

export interface Io {
  out: (text: string) => void;
  err: (text: string) => void;
  /** Whether standard error is a terminal (progress bars) */
  isTTY: boolean;
  cwd: string;
}

export interface ParsedArgs {
  positionals: string[];
  values: Record<string, string | boolean | string[] | undefined>;
}

export interface Command {
  name: string;
  summary: string;
  /** Usage line after "cellbasis ", e.g. 'reaction "EQUATION" --temperature T [--json]'. */
  usage: string;
  /** Longer explanation shown by --help. */
  details?: string;
  options: OptionSpec[];
  /** How many positional arguments: [min, max]. */
  positionals: [number, number];
  run(args: ParsedArgs, io: Io): Promise<number> | number;
}

export const JSON_OPTION: OptionSpec = { name: 'json', type: 'boolean', description: 'print one JSON object (SI units, unit in each key) instead of a table' };

export function helpText(command: Command): string {
  const width = Math.max(...command.options.map((o) => o.name.length + (o.value ? o.value.length + 1 : 0)), 4) + 4;
  const lines = [
    `cellbasis ${command.name}: ${command.summary}`,
    '',
    `usage: cellbasis ${command.usage}`,
  ];
  if (command.details) lines.push('', command.details);
  lines.push('', 'options:');
  for (const o of [...command.options, { name: 'help', type: 'boolean', description: 'show this help' } as OptionSpec]) {
    const flag = `--${o.name}${o.value ? ` ${o.value}` : ''}`;
    lines.push(`  ${flag.padEnd(width + 2)}${o.description}`);
  }
  return lines.join('\n') + '\n';
}

/**
 * What parseArgs lets through but no command means: an option given twice (parseArgs keeps the
 * last, so `--temperature 300K --temperature 400K` would quietly drop one), and an empty or blank
 * argument or option value (`cellbasis keygen ""` would name a file ".key"). Undefined when none.
 */
function argumentProblem(command: Command, tokens: NonNullable<ReturnType<typeof parseArgs>['tokens']>): string | undefined {
  const multiple = new Set(command.options.filter((o) => o.multiple).map((o) => o.name));
  const seen = new Set<string>();
  for (const token of tokens) {
    if (token.kind === 'positional' && token.value.trim() === '') return `an argument is ${token.value === '' ? 'empty' : 'only spaces'}; give a project id, a file or a name`;
    if (token.kind !== 'option') continue;
    if (seen.has(token.name) && !multiple.has(token.name)) return `--${token.name} is given twice; give it once`;
    seen.add(token.name);
    if (typeof token.value === 'string' && token.value.trim() === '') return `--${token.name} is given ${token.value === '' ? 'an empty value' : 'only spaces'}; give it a value`;
  }
  return undefined;
}

/** Parses argv for a command; usage mistakes become UserError (exit 2) naming the command. */
export function parseCommandArgs(command: Command, argv: string[]): ParsedArgs | 'help' {
  const options: Record<string, { type: 'string' | 'boolean'; multiple?: boolean }> = { help: { type: 'boolean' } };
  for (const o of command.options) options[o.name] = { type: o.type, ...(o.multiple ? { multiple: true } : {}) };
  let parsed;
  try {
    parsed = parseArgs({ args: argv, options, allowPositionals: true, strict: true, tokens: true });
  } catch (error) {
    const raw = (error as Error).message;
    const ambiguous = /^Option '(--[\w-]+)[^']*' argument is ambiguous/.exec(raw);
    const message = ambiguous
      ? `${ambiguous[1]}: a value that starts with "-" must be joined to the option, as ${ambiguous[1]}=-VALUE`
      : raw.split('\n')[0]!.replace(/\. To specify a positional argument.*$/s, '').replace(/^Unknown option/, 'unknown option');
    throw new UserError(`${command.name}: ${message} (see cellbasis ${command.name} --help)`);
  }
  if (parsed.values.help) return 'help';
  const problem = argumentProblem(command, parsed.tokens);
  if (problem) throw new UserError(`${command.name}: ${problem} (see cellbasis ${command.name} --help)`);
  const [min, max] = command.positionals;
  if (parsed.positionals.length < min || parsed.positionals.length > max) {
    throw new UserError(`${command.name}: usage: cellbasis ${command.usage} (see cellbasis ${command.name} --help)`);
  }
  return { positionals: parsed.positionals, values: parsed.values as ParsedArgs['values'] };
}

export function requireString(args: ParsedArgs, name: string, command: string): string {
  const value = args.values[name];
  if (typeof value !== 'string' || value.trim() === '') {
    throw new UserError(`${command}: --${name} is required (see cellbasis ${command} --help)`);
  }
  return value;
}

export function optionalString(args: ParsedArgs, name: string): string | undefined {
  const value = args.values[name];
  return typeof value === 'string' ? value : undefined;
}
