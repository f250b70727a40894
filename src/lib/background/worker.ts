/**
 * A background worker of one server process: a `globalThis` singleton (so dev reloads do
 * not start a second one) that runs a turn every few seconds, and at once when woken after
 * a commit. Turns never overlap: a wake during a turn makes the worker go round again
 * straight after it, so nothing woken for is missed. A turn that throws is logged and the
 * next tick tries again; it never takes the server down. The mail and search outboxes are
 * drained this way.
 */

/** What a worker is made of. */
export interface WorkerSpec<R> {
  /** Its `globalThis` slot, unique per worker. */
  key: string;
  /** How often it runs a turn when nobody wakes it. */
  intervalMs: number;
  /** What its turns use (a transport, a client); null when not configured: the worker stays off. */
  setup: () => R | null;
  /** One turn; resolves true to go round again at once (more work than one batch). */
  turn: (resource: R) => Promise<boolean>;
  /** The log line for a turn that threw. */
  failed: (error: unknown) => string;
  /** Releases the resource when the worker stops. */
  close?: (resource: R) => void;
}

/** Start, wake and stop of one worker. */
export interface BackgroundWorker {
  /** Starts the worker once per process; returns whether it runs (false when not configured). */
  start(): boolean;
  /**
   * Asks the running worker, if any, to run a turn now. Never starts one: scripts and test
   * processes that queue work must be able to exit; a server's worker picks it up. Never throws.
   */
  wake(): void;
  /** Stops the worker of this process (tests, shutdown). */
  stop(): void;
}

interface State<R> {
  resource: R;
  timer: NodeJS.Timeout;
  running: boolean;
  again: boolean;
}

/** A worker as {@link WorkerSpec} describes it; see the module comment. */
export function backgroundWorker<R>(spec: WorkerSpec<R>): BackgroundWorker {
  const slots = globalThis as unknown as Record<string, State<R> | null | undefined>;

  async function tick(state: State<R>): Promise<void> {
    if (state.running) {
      state.again = true;
      return;
    }
    state.running = true;
    try {
      do {
        state.again = false;
        if (await spec.turn(state.resource)) state.again = true;
      } while (state.again);
    } catch (error) {
      console.error(spec.failed(error));
    } finally {
      state.running = false;
    }
  }

  return {
    start() {
      const current = slots[spec.key];
      if (current !== undefined) return current !== null;
      const resource = spec.setup();
      if (resource === null) {
        slots[spec.key] = null;
        return false;
      }
      const state: State<R> = { resource, timer: setInterval(() => void tick(state), spec.intervalMs), running: false, again: false };
      state.timer.unref();
      slots[spec.key] = state;
      void tick(state);
      return true;
    },
    wake() {
      const state = slots[spec.key];
      if (state) setImmediate(() => void tick(state));
    },
    stop() {
      const state = slots[spec.key];
      if (state) {
        clearInterval(state.timer);
        spec.close?.(state.resource);
      }
      slots[spec.key] = undefined;
    },
  };
}

/** `error` as text for a log line. */
export const reasonOf = (error: unknown): string => (error instanceof Error ? error.message : String(error));
