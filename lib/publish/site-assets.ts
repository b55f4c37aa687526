/**
 * The files the site copies into its assets folder, by source and destination: KaTeX's
 * stylesheet and fonts and Chart.js's browser build from node_modules, and our own stylesheet
 * and chart script from templates/assets. Nothing is fetched from a network, at build time or
 * when a page is viewed.
 */
import { join } from 'node:path';
import { ASSETS } from '../report/assets.ts';
import { packageDir, TEMPLATES_DIR } from './paths.ts';

export const ASSET_DIR = 'assets';

export interface AssetCopy {
  /** Absolute path of a file or folder. */
  from: string;
  /** Path under the site's assets folder. */
  to: string;
}

export function siteAssets(): AssetCopy[] {
  const katex = join(packageDir('katex'), 'dist');
  const chart = join(packageDir('chart.js'), 'dist');
  return [
    { from: join(katex, 'katex.min.css'), to: ASSETS.katexCss },
    { from: join(katex, 'fonts'), to: 'katex/fonts' },
    { from: join(chart, 'chart.umd.min.js'), to: ASSETS.chartJs },
    { from: join(TEMPLATES_DIR, 'assets', 'report.css'), to: ASSETS.reportCss },
    { from: join(TEMPLATES_DIR, 'assets', 'charts.js'), to: ASSETS.chartsScript },
  ];
}
