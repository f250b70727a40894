import path from 'node:path';
import { config } from '../config';
import { LocalFileStore } from './local';
import type { FileStore } from './types';

let cached: FileStore | undefined;

/** The folder of the local store: `SEQUENT_FILES_DIR`, else `<SEQUENT_DATA_DIR or .data>/files`. */
export function filesDir(): string {
  const settings = config();
  if (settings.SEQUENT_FILES_DIR) return path.resolve(settings.SEQUENT_FILES_DIR);
  return path.join(settings.SEQUENT_DATA_DIR ? path.resolve(settings.SEQUENT_DATA_DIR) : path.resolve('.data'), 'files');
}

/** The app's file store (one per process). An S3-compatible store would be chosen here. */
export function fileStore(): FileStore {
  cached ??= new LocalFileStore(filesDir());
  return cached;
}
