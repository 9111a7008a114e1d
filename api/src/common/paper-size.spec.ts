import { describe, expect, it } from 'vitest';
import { paperSizeFor } from './paper-size';

describe('paper size from the shop’s country (Unicode CLDR supplemental measurementData, paperSize)', () => {
  it('US Letter in the Letter territories, A4 elsewhere', () => {
    // CLDR lists US-Letter for, among others, US, CA, MX, PH, CL, CO and VE; "001" (the world) is A4.
    for (const country of ['US', 'CA', 'MX', 'PH', 'CL', 'CO', 'VE', 'us']) expect(paperSizeFor(country), country).toBe('LETTER');
    for (const country of ['DE', 'GB', 'JP', 'FR', 'AU', 'HU', 'KW', 'ID']) expect(paperSizeFor(country), country).toBe('A4');
    expect(paperSizeFor('')).toBe('A4');
    expect(paperSizeFor(undefined)).toBe('A4');
  });
});
