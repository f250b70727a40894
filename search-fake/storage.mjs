// @ts-check
// The fake's folder on disk:
//   <dir>/tasks.json            the task log and the next task uid
//   <dir>/features.json         experimental features switched on
//   <dir>/indexes/<uid>.json    one snapshot per index: settings, primary key, documents
// Every file is written whole to `<file>.tmp-<pid>-<n>` and renamed over the old one, so a
// reader (or a crash) never sees half a file. Writes are debounced per file: a burst of tasks
// gives one write per DEBOUNCE_MS, and flush() writes whatever is pending at once.
import { mkdir, readdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';

export const DEBOUNCE_MS = 500;

let tmpCounter = 0;

/**
 * Writes `text` to `file` atomically (temporary file + rename).
 * @param {string} file
 * @param {string} text
 */
export async function writeAtomic(file, text) {
  await mkdir(path.dirname(file), { recursive: true });
  tmpCounter += 1;
  const tmp = `${file}.tmp-${process.pid}-${tmpCounter}`;
  try {
    await writeFile(tmp, text);
    await rename(tmp, file);
  } catch (error) {
    await rm(tmp, { force: true }).catch(() => {});
    throw error;
  }
}

/**
 * Reads and parses a JSON file; null when it does not exist. A file that cannot be read or
 * parsed is moved aside to `<file>.corrupt-<time>` with a console warning, and null returned.
 * @param {string} file
 * @param {string} what for the warning, e.g. "index `cases`"
 * @returns {Promise<any>}
 */
export async function readJsonOrWarn(file, what) {
  let text;
  try {
    text = await readFile(file, 'utf8');
  } catch (error) {
    if (/** @type {NodeJS.ErrnoException} */ (error).code === 'ENOENT') return null;
    console.warn(`search fake: could not read ${what} from ${file} (${error instanceof Error ? error.message : error}); starting without it.`);
    return null;
  }
  try {
    return JSON.parse(text);
  } catch (error) {
    await setAside(file, what, error);
    return null;
  }
}

/**
 * Moves an unusable file out of the way and warns.
 * @param {string} file @param {string} what @param {unknown} error
 */
export async function setAside(file, what, error) {
  const aside = `${file}.corrupt-${Date.now()}`;
  await rename(file, aside).catch(() => {});
  console.warn(
    `search fake: ${what} in ${file} is unreadable (${error instanceof Error ? error.message : error}); starting without it. The file was kept as ${aside}.`,
  );
}

/**
 * Debounced writers, one per key (a file): `schedule(key, produce)` writes `produce()` to the
 * file at most once per DEBOUNCE_MS; `flush()` writes everything pending now.
 */
export class Saver {
  constructor(delay = DEBOUNCE_MS) {
    this.delay = delay;
    /** @type {Map<string, { timer: NodeJS.Timeout | null, produce: () => string | null }>} */
    this.pending = new Map();
    /** @type {Map<string, Promise<void>>} */
    this.writing = new Map();
    /** @type {unknown} */
    this.lastError = null;
  }

  /**
   * @param {string} file
   * @param {() => string | null} produce  the file's text, or null to delete the file
   */
  schedule(file, produce) {
    const entry = this.pending.get(file);
    if (entry) {
      entry.produce = produce;
      return;
    }
    const timer = setTimeout(() => {
      this.write(file).catch(() => {});
    }, this.delay);
    timer.unref();
    this.pending.set(file, { timer, produce });
  }

  /** Writes (or deletes) one pending file now, after any write of it in progress. @param {string} file */
  async write(file) {
    const entry = this.pending.get(file);
    if (!entry) return this.writing.get(file);
    if (entry.timer) clearTimeout(entry.timer);
    this.pending.delete(file);
    const previous = this.writing.get(file) ?? Promise.resolve();
    const job = previous
      .catch(() => {})
      .then(async () => {
        const text = entry.produce();
        if (text === null) await rm(file, { force: true });
        else await writeAtomic(file, text);
      })
      .catch((error) => {
        this.lastError = error;
        console.error(`search fake: could not write ${file}:`, error);
      });
    this.writing.set(file, job);
    await job;
    if (this.writing.get(file) === job) this.writing.delete(file);
  }

  /** Writes every pending file and waits for writes in progress. */
  async flush() {
    await Promise.all([...this.pending.keys()].map((file) => this.write(file)));
    await Promise.all([...this.writing.values()]);
  }

  /** Forgets pending writes (used after a reload drops memory). */
  cancel() {
    for (const entry of this.pending.values()) if (entry.timer) clearTimeout(entry.timer);
    this.pending.clear();
  }
}

/**
 * Total size in bytes of the files under `dir` (the fake's "database size").
 * @param {string} dir
 * @returns {Promise<number>}
 */
export async function folderSize(dir) {
  let total = 0;
  let entries;
  try {
    entries = await readdir(dir, { withFileTypes: true });
  } catch {
    return 0;
  }
  for (const entry of entries) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) total += await folderSize(full);
    else if (entry.isFile()) total += await stat(full).then((s) => s.size).catch(() => 0);
  }
  return total;
}

/**
 * The index snapshot files present in `<dir>/indexes`.
 * @param {string} dir
 * @returns {Promise<string[]>} file names
 */
export async function indexFiles(dir) {
  try {
    return (await readdir(path.join(dir, 'indexes'))).filter((name) => /^[A-Za-z0-9_-]+\.json$/.test(name));
  } catch {
    return [];
  }
}
