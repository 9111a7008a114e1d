import cc from 'currency-codes';
import { describe, expect, it } from 'vitest';
import { ISO_4217_MINOR_UNITS, ISO_4217_PUBLISHED } from './iso-4217';

describe('the ISO 4217 minor-unit table the apps carry', () => {
  it('is exactly the currency-codes dataset (run `node shared/scripts/iso-4217.mjs` after updating the package)', () => {
    const fromDataset = Object.fromEntries(cc.data.filter((c) => typeof c.digits === 'number').map((c) => [c.code, c.digits]));
    expect(ISO_4217_MINOR_UNITS).toEqual(fromDataset);
    expect(ISO_4217_PUBLISHED).toBe(cc.publishDate);
  });
});
