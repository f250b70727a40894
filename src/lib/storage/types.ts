/** What a stored file is known by: its key in the store, its SHA-256 (hex) and its size in bytes. */
export interface StoredFile {
  key: string;
  sha256: string;
  size: number;
}

/**
 * Where file bytes live. Content-addressed: the key is derived from the bytes, so putting
 * the same bytes twice stores them once and a key never changes meaning. A store keeps no
 * metadata (names, types, owners): that is the database's job. An S3-compatible store
 * implements the same four calls (PutObject, GetObject, HeadObject, DeleteObject).
 */
export interface FileStore {
  /** Stores the bytes (atomically: a reader never sees half a file). */
  put(bytes: Uint8Array): Promise<StoredFile>;
  /** The bytes under `key`, or null when there are none (or the key is malformed). */
  get(key: string): Promise<Buffer | null>;
  /** Whether bytes are stored under `key`. */
  has(key: string): Promise<boolean>;
  /** Removes the bytes under `key`; nothing happens when there are none. */
  delete(key: string): Promise<void>;
}
