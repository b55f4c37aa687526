/**
 * Relative links between the pages of the site, so that every page works opened from disk
 * (file://) as well as served: site paths are written from the site root with explicit
 * index.html ("projects/x/rev-A/index.html"), and a link is the path from the folder of one page
 * to another.
 */
import { posix } from 'node:path';

/** The relative URL from the page at `fromPath` to the site path `toPath`. */
export function relativeHref(fromPath: string, toPath: string): string {
  const rel = posix.relative(posix.dirname(`/${fromPath}`), `/${toPath}`);
  return rel === '' ? posix.basename(toPath) : rel;
}

/** The folder prefix from a page to the site root: "../../" for projects/x/index.html. */
export function rootPrefix(fromPath: string): string {
  const depth = fromPath.split('/').length - 1;
  return '../'.repeat(depth);
}

/** Site path of a project's working draft page. */
export function draftPagePath(projectId: string): string {
  return `projects/${projectId}/index.html`;
}

/** Site path of an issued revision's page. */
export function revisionPagePath(projectId: string, revision: string): string {
  return `projects/${projectId}/rev-${revision}/index.html`;
}
