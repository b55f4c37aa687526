// Eleventy configuration of the cellbasis design-basis site. The configuration itself is
// TypeScript (lib/publish/eleventy-config.ts). Run from `cellbasis build` or `cellbasis serve`,
// tsx is already registered by bin/cellbasis.js; run as `npx @11ty/eleventy` (which publishes
// projects/ of the working folder into site/), tsx is registered here first.
import { register } from 'tsx/esm/api';

async function typescriptImports() {
  try {
    await import('./lib/publish/loader-probe.ts');
    return true;
  } catch {
    return false;
  }
}

if (!(await typescriptImports())) register();

const { default: configureSite } = await import('./lib/publish/eleventy-config.ts');

export default configureSite;
