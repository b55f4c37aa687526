/**
 * The units the document prints, each as plain text (tables, result lines) and as LaTeX
 * (substituted equations). A unit not in this table is a fault of the view model and throws,
 * so no unchecked text reaches KaTeX through a unit.
 */
const UNITS: Record<string, { text: string; tex: string }> = {
  '': { text: '', tex: '' },
  V: { text: 'V', tex: '\\mathrm{V}' },
  '1/V': { text: 'V⁻¹', tex: '\\mathrm{V^{-1}}' },
  mV: { text: 'mV', tex: '\\mathrm{mV}' },
  K: { text: 'K', tex: '\\mathrm{K}' },
  bar: { text: 'bar', tex: '\\mathrm{bar}' },
  Pa: { text: 'Pa', tex: '\\mathrm{Pa}' },
  A: { text: 'A', tex: '\\mathrm{A}' },
  W: { text: 'W', tex: '\\mathrm{W}' },
  kW: { text: 'kW', tex: '\\mathrm{kW}' },
  m2: { text: 'm²', tex: '\\mathrm{m^2}' },
  cm2: { text: 'cm²', tex: '\\mathrm{cm^2}' },
  'A/m2': { text: 'A/m²', tex: '\\mathrm{A/m^2}' },
  'A/cm2': { text: 'A/cm²', tex: '\\mathrm{A/cm^2}' },
  'ohm cm2': { text: 'Ω cm²', tex: '\\Omega\\,\\mathrm{cm^2}' },
  'mol/s': { text: 'mol/s', tex: '\\mathrm{mol/s}' },
  'kg/h': { text: 'kg/h', tex: '\\mathrm{kg/h}' },
  'kg/day': { text: 'kg/day', tex: '\\mathrm{kg/day}' },
  'kg/mol': { text: 'kg/mol', tex: '\\mathrm{kg/mol}' },
  'kWh/kg': { text: 'kWh/kg', tex: '\\mathrm{kWh/kg}' },
  'J/mol': { text: 'J/mol', tex: '\\mathrm{J/mol}' },
  'kJ/mol': { text: 'kJ/mol', tex: '\\mathrm{kJ/mol}' },
  'J/(mol K)': { text: 'J/(mol K)', tex: '\\mathrm{J/(mol\\,K)}' },
  'C/mol': { text: 'C/mol', tex: '\\mathrm{C/mol}' },
  kh: { text: 'kh', tex: '\\mathrm{kh}' },
  '1/kh': { text: 'per kh', tex: '\\mathrm{kh^{-1}}' },
  'ohm m2': { text: 'Ω m²', tex: '\\Omega\\,\\mathrm{m^2}' },
};

function unit(key: string): { text: string; tex: string } {
  const u = UNITS[key];
  if (!u) throw new Error(`"${key}" is not a unit of the document`);
  return u;
}

/** The unit as text: "Ω cm²". */
export function unitText(key: string): string {
  return unit(key).text;
}

/** The unit as LaTeX after a number: "\,\Omega\,\mathrm{cm^2}" ("" for none). */
export function unitTex(key: string): string {
  const tex = unit(key).tex;
  return tex ? `\\,${tex}` : '';
}

/** A unit as the loader or a reference check names it ("A/m2", "ohm m2", "bar^2", "Pa") in print: "A/m²", "Ω m²", "bar²", "Pa". */
export function prettyUnit(unit: string): string {
  return unit
    .replace(/\bohm\b/g, 'Ω')
    .replace(/(?<=[A-Za-z])\^?2\b/g, '²')
    .replace(/(?<=[A-Za-z])\^?3\b/g, '³');
}
