import { randomBytes } from 'node:crypto';
import { mkdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { isStoreKey, sha256Hex } from './keys';
import type { FileStore, StoredFile } from './types';

/**
 * A file store in a local folder: `<root>/ab/cdef…` for the SHA-256 `abcdef…`. Writes go to
 * a temporary file in `<root>/tmp` and are renamed into place, so a crash leaves no half
 * file under a key. Paths are built only from validated hex keys, never from names, so
 * nothing is ever written outside the root.
 */
export class LocalFileStore implements FileStore {
  readonly root: string;

  constructor(root: string) {
    this.root = path.resolve(root);
  }

  /** The path of a key's file, or null for a malformed key. */
  pathOf(key: string): string | null {
    return isStoreKey(key) ? path.join(this.root, key.slice(0, 2), key.slice(2)) : null;
  }

  async put(bytes: Uint8Array): Promise<StoredFile> {
    const sha256 = sha256Hex(bytes);
    const target = this.pathOf(sha256)!;
    const stored = { key: sha256, sha256, size: bytes.byteLength };
    if (await this.has(sha256)) return stored;
    const tmpDir = path.join(this.root, 'tmp');
    await mkdir(tmpDir, { recursive: true });
    await mkdir(path.dirname(target), { recursive: true });
    const tmp = path.join(tmpDir, `${sha256}.${randomBytes(6).toString('hex')}`);
    try {
      await writeFile(tmp, bytes, { flag: 'wx' });
      await rename(tmp, target);
    } catch (error) {
      await rm(tmp, { force: true });
      throw error;
    }
    return stored;
  }

  async get(key: string): Promise<Buffer | null> {
    const file = this.pathOf(key);
    if (!file) return null;
    try {
      return await readFile(file);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw error;
    }
  }

  async has(key: string): Promise<boolean> {
    const file = this.pathOf(key);
    if (!file) return false;
    try {
      return (await stat(file)).isFile();
    } catch {
      return false;
    }
  }

  async delete(key: string): Promise<void> {
    const file = this.pathOf(key);
    if (file) await rm(file, { force: true });
  }
}
