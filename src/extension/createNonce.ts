import { randomBytes } from 'node:crypto';

/** Bytes of randomness in a script nonce; 16 bytes (128 bits) is the usual minimum for CSP nonces (common practice). */
const NONCE_BYTES = 16;

/**
 * A fresh nonce for the panel's Content-Security-Policy, from the operating system's random source
 * (never the clock), so no injected script can guess it.
 * @returns 32 hexadecimal characters
 */
export function createNonce(): string {
  return randomBytes(NONCE_BYTES).toString('hex');
}
