import { createHash } from 'node:crypto';

/** A store key: the SHA-256 of the bytes, 64 lower-case hex digits. */
const KEY = /^[0-9a-f]{64}$/;

/** Whether `key` is a well-formed store key (the only strings ever turned into paths). */
export function isStoreKey(key: string): boolean {
  return KEY.test(key);
}

/** The SHA-256 of the bytes, as hex: the key they are stored under. */
export function sha256Hex(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}
