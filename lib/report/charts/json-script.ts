/**
 * JSON for a `<script type="application/json">` element: the characters that could end the
 * element or start markup (<, >, &) and the two line separators JavaScript treats as line ends
 * are written as \u escapes, so no string inside can break out of the script element.
 */
import { trustedHtml, type TrustedHtml } from '../trusted-html.ts';

export function jsonForScript(value: unknown): TrustedHtml {
  const json = JSON.stringify(value).replace(/[<>&\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
  return trustedHtml(json);
}
