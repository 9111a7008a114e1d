import { randomBytes, scrypt as scryptCallback, timingSafeEqual, type ScryptOptions } from 'node:crypto';

/**
 * Password hashing with Node's built-in scrypt. Parameters from the OWASP Password Storage Cheat
 * Sheet (scrypt section): N = 2^17, r = 8, p = 1, with a 16-byte random salt and a 64-byte key.
 * The stored form names its parameters, so they can be raised later without breaking old hashes.
 */
export const SCRYPT_PARAMS = { N: 2 ** 17, r: 8, p: 1, keyLength: 64 } as const;

function scrypt(password: string, salt: Buffer, keyLength: number, options: ScryptOptions): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    scryptCallback(password, salt, keyLength, options, (error, key) => (error ? reject(error) : resolve(key))),
  );
}

const maxmem = (N: number, r: number) => 128 * N * r * 2;

export async function hashPassword(password: string): Promise<string> {
  const { N, r, p, keyLength } = SCRYPT_PARAMS;
  const salt = randomBytes(16);
  const key = await scrypt(password, salt, keyLength, { N, r, p, maxmem: maxmem(N, r) });
  return `scrypt$${N}$${r}$${p}$${salt.toString('base64')}$${key.toString('base64')}`;
}

export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [scheme, n, r, p, saltB64, keyB64] = stored.split('$');
  if (scheme !== 'scrypt' || !saltB64 || !keyB64) return false;
  const expected = Buffer.from(keyB64, 'base64');
  const options = { N: Number(n), r: Number(r), p: Number(p), maxmem: maxmem(Number(n), Number(r)) };
  const key = await scrypt(password, Buffer.from(saltB64, 'base64'), expected.length, options);
  return key.length === expected.length && timingSafeEqual(key, expected);
}

/** A hash to compare against when the e-mail is unknown, so both answers take the same time. */
let decoyHash: Promise<string> | undefined;
export const decoyPasswordHash = () => (decoyHash ??= hashPassword(randomBytes(12).toString('hex')));
