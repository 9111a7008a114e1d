import { describe, expect, it } from 'vitest';
import { firmQuoteFigures } from './firm-quote';

describe('firm quote figures', () => {
  it('prices labor at the builder’s own rate and adds the materials', () => {
    // Worked by hand: 14 h × $125.00 = $1,750.00; + $412.60 materials = $2,162.60; − $300.00 deposit = $1,862.60.
    expect(firmQuoteFigures({ hourlyRate: '125.00', laborHours: '14.00', materialsTotal: '412.60', deposit: '300.00' })).toEqual({
      laborTotal: '1750.00',
      total: '2162.60',
      balanceDue: '1862.60',
    });
  });

  it('rounds a fractional labor figure half-up to the cent, with no float error', () => {
    // 7.33 h × $45.55 = $333.8815 → $333.88 (hand-worked); 0.1 + 0.2 style float drift would show as …0000004.
    expect(firmQuoteFigures({ hourlyRate: '45.55', laborHours: '7.33', materialsTotal: '0.10', deposit: '0.20' })).toEqual({
      laborTotal: '333.88',
      total: '333.98',
      balanceDue: '333.78',
    });
    // 2.5 h × $40.01 = $100.025 → half-up gives $100.03.
    expect(firmQuoteFigures({ hourlyRate: '40.01', laborHours: '2.5', materialsTotal: '0', deposit: '0' }).laborTotal).toBe('100.03');
  });

  it('never asks for a negative balance when the deposit covers the total', () => {
    expect(firmQuoteFigures({ hourlyRate: '40.00', laborHours: '1', materialsTotal: '10.00', deposit: '100.00' }).balanceDue).toBe('0.00');
  });
});
