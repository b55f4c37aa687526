/**
 * One HTML file that needs nothing beside it: every stylesheet link becomes a <style> element,
 * every script with a src becomes an inline script, and every url() of the stylesheets (the
 * KaTeX fonts) becomes a data: URI. Fonts are kept in WOFF2 only (the format every current
 * browser and the PDF printer read); the WOFF and TrueType alternatives are dropped to keep the
 * file small. Links to other documents and to the issued PDF are left as they are.
 *
 *   inlineAssets(html, assetDir): string
 *     html      a page from renderDocumentHtml (lib/publish/render.ts)
 *     assetDir  the folder its relative stylesheet and script URLs start from: for a page
 *               rendered with { assetBase: '' }, the site's assets folder (site/assets, or one
 *               written by writeSiteAssets)
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, extname, isAbsolute, normalize, relative, resolve } from 'node:path';
import { UserError } from '../core/errors.ts';

const MIME: Record<string, string> = { '.woff2': 'font/woff2', '.woff': 'font/woff', '.ttf': 'font/ttf', '.png': 'image/png', '.svg': 'image/svg+xml' };

/** A file of the asset folder by relative URL; refuses URLs that leave it or name nothing. */
function assetFile(root: string, base: string, url: string): string {
  const clean = decodeURIComponent(url.split(/[?#]/)[0]!);
  const path = resolve(base, normalize(clean));
  const inside = relative(root, path);
  if (inside.startsWith('..') || isAbsolute(inside)) throw new UserError(`inlineAssets: ${url} lies outside the asset folder ${root}`);
  if (!existsSync(path)) throw new UserError(`inlineAssets: ${url} is not in the asset folder ${root}`);
  return path;
}

function isRelative(url: string): boolean {
  return !/^(?:[a-z][a-z0-9+.-]*:|\/\/|\/|#)/i.test(url);
}

/** Keeps the WOFF2 sources of each @font-face src list. */
function woff2Only(css: string): string {
  return css.replace(/src:([^;}]*)/g, (whole, list: string) => {
    const sources = list.split(/,(?=\s*url\()/).filter((s) => /format\(["']woff2["']\)/.test(s));
    return sources.length ? `src:${sources.join(',')}` : whole;
  });
}

function inlineCss(css: string, root: string, cssFile: string): string {
  return woff2Only(css).replace(/url\(\s*(['"]?)([^'")]+)\1\s*\)/g, (whole, _q: string, url: string) => {
    if (!isRelative(url)) return whole;
    const file = assetFile(root, dirname(cssFile), url);
    const mime = MIME[extname(file).toLowerCase()] ?? 'application/octet-stream';
    return `url(data:${mime};base64,${readFileSync(file).toString('base64')})`;
  });
}

export function inlineAssets(html: string, assetDir: string): string {
  const root = resolve(assetDir);
  const withStyles = html.replace(/<link\b[^>]*\brel="stylesheet"[^>]*>/g, (tag) => {
    const href = /\bhref="([^"]+)"/.exec(tag)?.[1];
    if (!href || !isRelative(href)) return tag;
    const file = assetFile(root, root, href.replace(/&amp;/g, '&'));
    return `<style>\n${inlineCss(readFileSync(file, 'utf8'), root, file).replace(/<\/style/gi, '<\\/style')}\n</style>`;
  });
  return withStyles.replace(/<script\b([^>]*)\bsrc="([^"]+)"([^>]*)><\/script>/g, (tag, before: string, src: string, after: string) => {
    if (!isRelative(src)) return tag;
    const code = readFileSync(assetFile(root, root, src.replace(/&amp;/g, '&')), 'utf8').replace(/<\/script/gi, '<\\/script');
    return `<script${before}${after}>\n${code}\n</script>`;
  });
}
