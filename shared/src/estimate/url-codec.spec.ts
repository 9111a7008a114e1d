import { describe, expect, it } from 'vitest';
import { decodeConfiguration, encodeConfiguration } from './url-codec';

describe('configuration in the URL', () => {
  it('round-trips a configuration, names with non-ASCII letters included, through URL-safe text', () => {
    const config = {
      surfaceId: 'surface-610',
      pedals: [{ name: 'Fuzz “Ødegård”', powered: true, inLoop: false }],
      functions: ['stereo_output'],
    };
    const encoded = encodeConfiguration(config);
    // RFC 4648 §5 base64url alphabet, no padding.
    expect(encoded).toMatch(/^[A-Za-z0-9_-]+$/);
    expect(decodeConfiguration(encoded)).toEqual(config);
  });

  it('gives undefined for text that is not one of ours', () => {
    expect(decodeConfiguration('not-base64!')).toBeUndefined();
    expect(decodeConfiguration(encodeConfiguration([] as never))).toBeUndefined();
    expect(decodeConfiguration(null)).toBeUndefined();
  });
});
