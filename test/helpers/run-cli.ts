/** Runs the cellbasis CLI in-process with captured output (for command tests). */
import { main } from '../../lib/cli/main.ts';
import type { Io } from '../../lib/cli/command.ts';

export async function run(argv: string[], cwd: string = process.cwd()): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: Io = { out: (t) => (out += t), err: (t) => (err += t), isTTY: false, cwd };
  const code = await main(argv, io);
  return { code, out, err };
}
