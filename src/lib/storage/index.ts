export type { FileStore, StoredFile } from './types';
export { isStoreKey, sha256Hex } from './keys';
export { LocalFileStore } from './local';
export { fileStore, filesDir } from './store';
