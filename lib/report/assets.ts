/**
 * The files every document page loads, by their path under the site's assets folder. The view
 * model writes links to them relative to each page; lib/publish/site-assets.ts says where each
 * one comes from (node_modules or templates/assets) and copies it there.
 */
export const ASSETS = {
  katexCss: 'katex/katex.min.css',
  reportCss: 'report.css',
  chartJs: 'chart.umd.min.js',
  chartsScript: 'charts.js',
} as const;

export interface AssetLinks {
  stylesheets: string[];
  scripts: string[];
}

/** Links to the assets from a page whose assets folder is at `assetBase` ("../../assets/"). */
export function assetLinks(assetBase: string): AssetLinks {
  const base = assetBase === '' || assetBase.endsWith('/') ? assetBase : `${assetBase}/`;
  return {
    stylesheets: [`${base}${ASSETS.katexCss}`, `${base}${ASSETS.reportCss}`],
    scripts: [`${base}${ASSETS.chartJs}`, `${base}${ASSETS.chartsScript}`],
  };
}
