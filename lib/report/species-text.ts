/**
 * Species labels in running text and tables, with the counts of the formula as subscript digits:
 * CH4 → CH₄, n-C4H10 → n-C₄H₁₀, H2O(L) → H₂O(l). Only the digits that follow an element symbol or a
 * closing parenthesis are lowered, so a prefix such as "n-" stays as it is.
 */
const SUBSCRIPT = '₀₁₂₃₄₅₆₇₈₉';

export function speciesText(label: string): string {
  return label.replace(/(?<=[A-Za-z)])\d+/g, (digits) => [...digits].map((d) => SUBSCRIPT[Number(d)]!).join('')).replace(/\(L\)$/, '(l)');
}
