import { describe, expect, it } from 'vitest';
import { quantityWithUnit } from './quantity';

// English plural of a count noun adds -s ("supply" -> "supplies"); unit symbols take no plural,
// by the BIPM SI Brochure (9th edition, 2019), its rules for writing unit symbols (section number
// from memory, not checked); "ft" and "h" are written the same way.
describe('quantityWithUnit', () => {
  it('says one device and nine devices', () => {
    expect(quantityWithUnit('1', 'device')).toBe('1 device');
    expect(quantityWithUnit('9', 'device')).toBe('9 devices');
    expect(quantityWithUnit('26', 'plug')).toBe('26 plugs');
  });
  it('leaves symbols and "each" alone', () => {
    expect(quantityWithUnit('26.00', 'ft')).toBe('26.00 ft');
    expect(quantityWithUnit('13.00', 'h')).toBe('13.00 h');
    expect(quantityWithUnit('1', 'each')).toBe('1 each');
  });
  it('reads 1.00 as one', () => {
    expect(quantityWithUnit('1.00', 'supply')).toBe('1.00 supply');
    expect(quantityWithUnit('2', 'supply')).toBe('2 supplies');
  });
});
