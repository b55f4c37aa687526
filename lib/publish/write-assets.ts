/**
 * Copies the site's assets (lib/publish/site-assets.ts) into a folder: for a document rendered
 * on its own (an issued revision's document.html) before inlineAssets reads them, and for anyone
 * who wants the asset folder without building the site.
 *
 *   writeSiteAssets(assetDir): void   assetDir is created if missing; existing files are replaced
 */
import { cpSync, mkdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { siteAssets } from './site-assets.ts';

export function writeSiteAssets(assetDir: string): void {
  for (const asset of siteAssets()) {
    const target = join(assetDir, asset.to);
    mkdirSync(dirname(target), { recursive: true });
    cpSync(asset.from, target, { recursive: true });
  }
}
