// The text templates of the hazard data: named values, optional parts, data values, and the
// error a template naming a missing value raises (so a broken rule text fails the tests).
import { describe, expect, it } from 'vitest';
import { renderTemplate, sentence } from '../../lib/hazards/template.ts';
import { dataValue } from '../../lib/hazards/data-values.ts';

const values: Record<string, string> = { a: 'one', b: 'two' };
const resolve = (name: string) => values[name];

describe('templates', () => {
  it('replaces {name} by its value and keeps an optional part only when all its names have values', () => {
    expect(renderTemplate('{a} and {b}', resolve, 't')).toBe('one and two');
    expect(renderTemplate('{a}[[ with {b}]][[ with {c}]].', resolve, 't')).toBe('one with two.');
  });
  it('raises an error naming the template and the missing name', () => {
    expect(() => renderTemplate('{a} {missing}', resolve, 'rule x')).toThrow(/rule x: the template names \{missing\}, which has no value here/);
  });
  it('does not re-read inserted values as templates', () => {
    expect(renderTemplate('{a}', () => '{b}', 't')).toBe('{b}');
  });
  it('capitalises a text that starts with a stream name', () => {
    expect(sentence('anode outlet at 800 °C')).toBe('Anode outlet at 800 °C');
  });
});

describe('data values named by templates', () => {
  it('reads substances by key and thresholds by id, formatted to 3 significant digits', () => {
    expect(dataValue('co.idlh')).toBe('1,200');
    expect(dataValue('h2.lfl')).toBe('4');
    expect(dataValue('h2.mie')).toBe('0.017');
    expect(dataValue('h2.ait')).toBe('400');
    expect(dataValue('nico4.oshaPelTwa')).toBe('0.001');
    expect(dataValue('threshold.nickelCarbonyl_C')).toBe('200');
    expect(dataValue('substance.idlh', 'NH3')).toBe('300');
  });
  it('has no value for unknown keys, fields or data that are not recorded', () => {
    expect(dataValue('xx.lfl')).toBeUndefined();
    expect(dataValue('co.colour')).toBeUndefined();
    expect(dataValue('co.mie')).toBeUndefined();
    expect(dataValue('threshold.none')).toBeUndefined();
    expect(dataValue('plain')).toBeUndefined();
  });
});
