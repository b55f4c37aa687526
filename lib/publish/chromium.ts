/**
 * The Chromium that prints the PDFs: Debian's /usr/bin/chromium (or CELLBASIS_CHROMIUM), never a
 * downloaded browser, launched headless and kept off the network altogether (OFFLINE_ARGS), and
 * what to say when there is none.
 */
import { accessSync, constants } from 'node:fs';
import { chromium, type Browser } from 'playwright-core';
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';

const DEFAULT_CHROMIUM = '/usr/bin/chromium';

/**
 * Chromium off the network altogether, not only the pages: Chromium makes requests of its own
 * whatever the page does (Debian's build, with --disable-background-networking and
 * --disable-component-update, still asks update.googleapis.com and accounts.google.com, through
 * the proxy of the environment when one is set). The printer only ever opens files, so it uses
 * no proxy and resolves no host name: each such request fails inside Chromium, before any DNS
 * query or connection. (Extra --disable-features would replace playwright-core's own list.)
 */
export const OFFLINE_ARGS = ['--no-proxy-server', '--host-resolver-rules=MAP * ~NOTFOUND'];

export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  ...OFFLINE_ARGS,
];

/** The Chromium binary to use, or null when there is none: CELLBASIS_CHROMIUM if set, else /usr/bin/chromium. */
export function findChromium(): string | null {
  const path = process.env.CELLBASIS_CHROMIUM || DEFAULT_CHROMIUM;
  try {
    accessSync(path, constants.X_OK);
    return path;
  } catch {
    return null;
  }
}

export function chromiumMissingMessage(): string {
  const named = process.env.CELLBASIS_CHROMIUM;
  const where = named ? `CELLBASIS_CHROMIUM names ${named}, which is not an executable file` : `Chromium was not found at ${DEFAULT_CHROMIUM}`;
  return `${where}: PDFs need Debian's Chromium (apt-get install -y chromium), or CELLBASIS_CHROMIUM set to a Chromium binary; cellbasis never downloads a browser`;
}

export class ChromiumMissingError extends UserError {
  constructor() {
    super(chromiumMissingMessage(), EXIT_VALIDATION);
    this.name = 'ChromiumMissingError';
  }
}

/** Launches the Chromium (`executablePath`, else findChromium()) headless with CHROMIUM_ARGS; a UserError when it is missing or does not start. */
export async function openBrowser(options: { executablePath?: string; timeoutMs?: number }): Promise<Browser> {
  const executablePath = options.executablePath ?? findChromium();
  if (executablePath === null) throw new ChromiumMissingError();
  try {
    return await chromium.launch({ executablePath, args: CHROMIUM_ARGS, headless: true, timeout: options.timeoutMs ?? 60_000 });
  } catch (error) {
    throw new UserError(`pdf: Chromium (${executablePath}) did not start: ${(error as Error).message.split('\n')[0]}`, EXIT_VALIDATION);
  }
}
