/**
 * Tests that need Chromium: they run when /usr/bin/chromium (or CELLBASIS_CHROMIUM) is there,
 * and always when CI is set (where a missing browser must fail, not skip); elsewhere they skip
 * with a loud message.
 */
import { describe } from 'vitest';
import { findChromium } from '../../lib/publish/chromium.ts';

export const CHROMIUM = findChromium();

export const describeWithChromium = describe.skipIf(CHROMIUM === null && !process.env.CI);

export function announceChromiumSkip(what: string): void {
  if (CHROMIUM === null && !process.env.CI) {
    console.warn(`\n*** SKIPPED ${what}: no Chromium at /usr/bin/chromium (apt-get install -y chromium); these tests run whenever CI is set ***\n`);
  }
}
