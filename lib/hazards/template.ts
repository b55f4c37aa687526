/**
 * Text templates of the hazard data: `{name}` is replaced by the value the resolver gives;
 * `[[ ... ]]` is an optional part, kept only when every name inside it has a value. A name
 * outside an optional part without a value is a fault of the data (an Error naming the template),
 * which the tests of every rule catch.
 */

export type Resolver = (name: string) => string | undefined;

const NAME = /\{([A-Za-z0-9_.]+)\}/g;
const OPTIONAL = /\[\[([\s\S]*?)\]\]/g;

function fill(text: string, resolve: Resolver, where: string): string {
  return text.replace(NAME, (_, name: string) => {
    const value = resolve(name);
    if (value === undefined) throw new Error(`${where}: the template names {${name}}, which has no value here`);
    return value;
  });
}

export function renderTemplate(template: string, resolve: Resolver, where: string): string {
  const withOptional = template.replace(OPTIONAL, (_, inner: string) => {
    const names = [...inner.matchAll(NAME)].map((m) => m[1]!);
    return names.every((n) => resolve(n) !== undefined) ? inner : '';
  });
  return fill(withOptional, resolve, where);
}

/** The text with its first letter capitalised (a text may start with a stream name). */
export function sentence(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
