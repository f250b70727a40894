/**
 * The editor's save loop, free of React and the network so it can be tested: edits are
 * debounced into saves that carry the revision they started from; a failed save keeps the
 * text (in memory and in the browser's storage) and retries with backoff; a conflict stops
 * and waits for the author to choose. Nothing typed is ever dropped.
 */

/** What is saved: the body and the case's metadata. */
export interface DraftPayload {
  body: string;
  metadata: Record<string, unknown>;
}

/** The newer revision someone else saved, as the API returns it with a 409. */
export interface ConflictingRevision {
  number: number;
  body: string;
  authorName?: string;
  createdAt?: string;
}

/** The outcome of one save request. */
export type SaveOutcome =
  | { ok: true; revision: number }
  | { ok: false; kind: 'conflict'; latest: ConflictingRevision }
  | { ok: false; kind: 'invalid'; message: string }
  | { ok: false; kind: 'failed'; message: string };

/** What the editor shows about saving. */
export type SaveStatus =
  | { state: 'saved'; revision: number; at: number | null }
  | { state: 'unsaved'; revision: number }
  | { state: 'saving'; revision: number }
  | { state: 'retrying'; revision: number; attempt: number; nextInMs: number; message: string }
  | { state: 'invalid'; revision: number; message: string }
  | { state: 'conflict'; revision: number; latest: ConflictingRevision };

/** Where unsaved text is kept between page loads (the browser's localStorage). */
export interface DraftStore {
  get(): (DraftPayload & { baseRevision: number }) | null;
  set(value: DraftPayload & { baseRevision: number }): void;
  clear(): void;
}

export interface DraftSaverOptions {
  baseRevision: number;
  save: (payload: DraftPayload, baseRevision: number) => Promise<SaveOutcome>;
  store: DraftStore;
  onStatus: (status: SaveStatus) => void;
  /** Quiet time after the last keystroke before saving. */
  debounceMs?: number;
  now?: () => number;
  setTimer?: (fn: () => void, ms: number) => unknown;
  clearTimer?: (handle: unknown) => void;
}

const BACKOFF_MS = [1000, 2000, 5000, 10_000, 30_000];

/** See the module comment. */
export class DraftSaver {
  private baseRevision: number;
  private pending: DraftPayload | null = null;
  private inFlight = false;
  private timer: unknown = null;
  private attempt = 0;
  private blocked = false;
  private readonly o: Required<DraftSaverOptions>;

  constructor(options: DraftSaverOptions) {
    this.o = {
      debounceMs: 1500,
      now: () => Date.now(),
      setTimer: (fn, ms) => setTimeout(fn, ms),
      clearTimer: (h) => clearTimeout(h as ReturnType<typeof setTimeout>),
      ...options,
    };
    this.baseRevision = options.baseRevision;
  }

  /** The revision the next save starts from. */
  get revision(): number {
    return this.baseRevision;
  }

  /** True while something typed is not yet saved. */
  get dirty(): boolean {
    return this.pending !== null || this.inFlight;
  }

  /** Records an edit: kept in the store at once, saved after the debounce. */
  edit(payload: DraftPayload): void {
    this.pending = payload;
    this.o.store.set({ ...payload, baseRevision: this.baseRevision });
    if (this.blocked) return;
    this.o.onStatus({ state: 'unsaved', revision: this.baseRevision });
    this.schedule(this.o.debounceMs);
  }

  /** Saves now (Ctrl-S, leaving the page). */
  flush(): void {
    if (!this.blocked) this.schedule(0);
  }

  /**
   * Resolves a conflict: `mine` saves the author's text over the newer revision (as a new
   * revision after it); `theirs` drops the local text and continues from the newer one.
   */
  resolveConflict(choice: 'mine' | 'theirs', latest: ConflictingRevision): void {
    this.blocked = false;
    this.baseRevision = latest.number;
    if (choice === 'theirs') {
      this.pending = null;
      this.o.store.clear();
      this.o.onStatus({ state: 'saved', revision: latest.number, at: this.o.now() });
      return;
    }
    this.schedule(0);
  }

  private schedule(ms: number): void {
    if (this.timer !== null) this.o.clearTimer(this.timer);
    this.timer = this.o.setTimer(() => {
      this.timer = null;
      void this.run();
    }, ms);
  }

  private async run(): Promise<void> {
    if (this.inFlight || this.pending === null || this.blocked) return;
    const payload = this.pending;
    this.pending = null;
    this.inFlight = true;
    this.o.onStatus({ state: 'saving', revision: this.baseRevision });
    let outcome: SaveOutcome;
    try {
      outcome = await this.o.save(payload, this.baseRevision);
    } catch (error) {
      outcome = { ok: false, kind: 'failed', message: error instanceof Error ? error.message : 'The save did not reach the server.' };
    }
    this.inFlight = false;
    if (outcome.ok) {
      this.attempt = 0;
      this.baseRevision = outcome.revision;
      // this.pending may have been set by edit() while the request was out.
      const typedMeanwhile = this.pending as DraftPayload | null;
      if (typedMeanwhile === null) {
        this.o.store.clear();
        this.o.onStatus({ state: 'saved', revision: outcome.revision, at: this.o.now() });
      } else {
        // Typed while saving: keep the newer text and save it from the new revision.
        this.o.store.set({ ...typedMeanwhile, baseRevision: this.baseRevision });
        this.o.onStatus({ state: 'unsaved', revision: this.baseRevision });
        this.schedule(this.o.debounceMs);
      }
      return;
    }
    this.pending ??= payload;
    if (outcome.kind === 'conflict') {
      this.blocked = true;
      this.o.onStatus({ state: 'conflict', revision: this.baseRevision, latest: outcome.latest });
      return;
    }
    if (outcome.kind === 'invalid') {
      this.o.onStatus({ state: 'invalid', revision: this.baseRevision, message: outcome.message });
      return;
    }
    const wait = BACKOFF_MS[Math.min(this.attempt, BACKOFF_MS.length - 1)]!;
    this.attempt += 1;
    this.o.onStatus({ state: 'retrying', revision: this.baseRevision, attempt: this.attempt, nextInMs: wait, message: outcome.message });
    this.schedule(wait);
  }
}
