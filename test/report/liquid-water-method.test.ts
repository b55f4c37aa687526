// The method of a liquid-water cell says what it computes (issue 17 items 1-3): the vapour by
// IAPWS-IF97 over water of activity a_w, which gas composition its Nernst voltage uses, and, for an
// alkaline electrolyser, that electrolysis consumes the electrolyte's water at the hydrogen
// electrode (2H2O + 2e⁻ → H2 + 2OH⁻; fact of the trade, e.g. Larminie & Dicks, §8.3; from memory),
// not the power-direction wording the document carried ("consumed at the air electrode").
import { describe, expect, it } from 'vitest';
import { documentText as text } from '../helpers/scaffold-cases.ts';

describe('the method of liquid-water cells', () => {
  it('an alkaline electrolyser: water consumed at the hydrogen electrode, the KOH water activity and the E° it shifts', () => {
    const t = text('alkaline', 'electrolysis');
    expect(t).toContain('In electrolysis the electrode reactions run backwards: the fuel (hydrogen) electrode consumes water from the aqueous electrolyte');
    expect(t).not.toContain('consumed at the air electrode and formed at the fuel electrode');
    expect(t).toContain("The cell runs with the water of its potassium hydroxide electrolyte, whose activity is ");
    expect(t).toContain("(Balej's correlation, 1985)");
    // Its water is the circulating electrolyte's: one balance for the whole cell, not one per point.
    expect(t).toContain('The water belongs to the circulating electrolyte, which every point of the cell stands over');
    expect(t).not.toContain('The water is balanced at every point');
  });

  it('a PEM cell: vapour by IAPWS-IF97, the water balanced at every point, and the Nernst voltage said to use the gases that balance gives, saturated or not', () => {
    const t = text('pem', 'power');
    expect(t).toContain('by IAPWS-IF97 (region 4)');
    expect(t).toContain('The water is balanced at every point');
    expect(t).toContain('The document uses these gases, saturated or not as the balance gives them, at every point');
    expect(t).toContain('its chemical potential is that of the liquid plus');
    // The earlier wording, saturated gases throughout whatever the water balance said, is gone.
    expect(t).not.toContain('The Nernst voltage is evaluated with these saturated gases.');
    expect(t).not.toContain('their own Nernst voltage is higher than the one shown');
  });
});
