import { randomBytes, timingSafeEqual } from 'node:crypto';

/** A fresh random token for one run of the loopback host (256 bits, hex). */
export function newToken(): string {
  return randomBytes(32).toString('hex');
}

/** Constant-time comparison, so the token cannot be guessed byte by byte from timings. */
export function sameToken(given: string | undefined, expected: string): boolean {
  if (given === undefined) return false;
  const a = Buffer.from(given, 'utf8');
  const b = Buffer.from(expected, 'utf8');
  return a.length === b.length && timingSafeEqual(a, b);
}
