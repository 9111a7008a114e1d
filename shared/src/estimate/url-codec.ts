import type { RigConfiguration } from './types';

/**
 * A configuration travels in the storefront's URL as one search parameter, `c`, holding
 * base64url(JSON). The configurator writes it; the request page and shared links read it back.
 */
export const CONFIGURATION_PARAM = 'c';

function toBase64Url(text: string): string {
  const bytes = new TextEncoder().encode(text);
  let binary = '';
  for (const b of bytes) binary += String.fromCharCode(b);
  return btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

function fromBase64Url(encoded: string): string {
  const padded = encoded.replace(/-/g, '+').replace(/_/g, '/') + '==='.slice((encoded.length + 3) % 4);
  const binary = atob(padded);
  return new TextDecoder().decode(Uint8Array.from(binary, (ch) => ch.charCodeAt(0)));
}

export function encodeConfiguration(configuration: Partial<RigConfiguration>): string {
  return toBase64Url(JSON.stringify(configuration));
}

/** Undefined when the parameter is missing or not a configuration we wrote; validate before use. */
export function decodeConfiguration(encoded: string | null | undefined): Partial<RigConfiguration> | undefined {
  if (!encoded) return undefined;
  try {
    const value = JSON.parse(fromBase64Url(encoded));
    return value && typeof value === 'object' && !Array.isArray(value) ? value : undefined;
  } catch {
    return undefined;
  }
}
