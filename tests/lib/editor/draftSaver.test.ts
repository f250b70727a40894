import { describe, expect, it } from 'vitest';
import { DraftSaver, type DraftPayload, type SaveOutcome, type SaveStatus } from '../../../src/components/editor/draftSaver';

/** A saver with manual timers and a scripted server. */
function harness(responses: Array<SaveOutcome | Error>) {
  const timers: Array<{ fn: () => void; ms: number }> = [];
  const statuses: SaveStatus[] = [];
  const requests: Array<{ payload: DraftPayload; base: number }> = [];
  let stored: (DraftPayload & { baseRevision: number }) | null = null;
  const saver = new DraftSaver({
    baseRevision: 1,
    save: async (payload, base) => {
      requests.push({ payload, base });
      const next = responses.shift() ?? { ok: true, revision: base + 1 };
      if (next instanceof Error) throw next;
      return next;
    },
    store: { get: () => stored, set: (v) => (stored = v), clear: () => (stored = null) },
    onStatus: (s) => statuses.push(s),
    now: () => 1000,
    setTimer: (fn, ms) => timers.push({ fn, ms }) - 1,
    clearTimer: (h) => {
      timers[h as number] = { fn: () => {}, ms: -1 };
    },
  });
  const tick = async () => {
    const due = timers.splice(0).filter((t) => t.ms >= 0);
    for (const t of due) t.fn();
    await new Promise((r) => setTimeout(r, 0));
  };
  return { saver, statuses, requests, tick, stored: () => stored, timers };
}

const edit = (body: string): DraftPayload => ({ body, metadata: { title: 'Basin' } });

describe('DraftSaver', () => {
  it('debounces edits into one save that carries the revision it started from', async () => {
    const h = harness([]);
    h.saver.edit(edit('a'));
    h.saver.edit(edit('ab'));
    await h.tick();
    expect(h.requests).toEqual([{ payload: edit('ab'), base: 1 }]);
    expect(h.statuses.at(-1)).toEqual({ state: 'saved', revision: 2, at: 1000 });
    expect(h.saver.revision).toBe(2);
    expect(h.stored()).toBeNull();
  });

  it('keeps the text in the store until it is saved', () => {
    const h = harness([]);
    h.saver.edit(edit('typed'));
    expect(h.stored()).toEqual({ ...edit('typed'), baseRevision: 1 });
    expect(h.saver.dirty).toBe(true);
  });

  it('retries a failed save with backoff and never loses the text', async () => {
    const h = harness([new Error('network down'), { ok: false, kind: 'failed', message: 'HTTP 503' }]);
    h.saver.edit(edit('x'));
    await h.tick();
    expect(h.statuses.at(-1)).toMatchObject({ state: 'retrying', attempt: 1, nextInMs: 1000, message: 'network down' });
    expect(h.stored()?.body).toBe('x');
    await h.tick();
    expect(h.statuses.at(-1)).toMatchObject({ state: 'retrying', attempt: 2, nextInMs: 2000 });
    await h.tick();
    expect(h.statuses.at(-1)).toMatchObject({ state: 'saved', revision: 2 });
    expect(h.requests.map((r) => r.payload.body)).toEqual(['x', 'x', 'x']);
  });

  it('stops on a conflict and saves "mine" on top of the newer revision', async () => {
    const latest = { number: 5, body: 'theirs' };
    const h = harness([{ ok: false, kind: 'conflict', latest }]);
    h.saver.edit(edit('mine'));
    await h.tick();
    expect(h.statuses.at(-1)).toEqual({ state: 'conflict', revision: 1, latest });
    h.saver.edit(edit('mine, more'));
    await h.tick();
    expect(h.requests).toHaveLength(1);
    h.saver.resolveConflict('mine', latest);
    await h.tick();
    expect(h.requests[1]).toEqual({ payload: edit('mine, more'), base: 5 });
    expect(h.statuses.at(-1)).toMatchObject({ state: 'saved', revision: 6 });
  });

  it('continues from the newer revision when the author takes "theirs"', async () => {
    const latest = { number: 3, body: 'theirs' };
    const h = harness([{ ok: false, kind: 'conflict', latest }]);
    h.saver.edit(edit('mine'));
    await h.tick();
    h.saver.resolveConflict('theirs', latest);
    expect(h.saver.revision).toBe(3);
    expect(h.saver.dirty).toBe(false);
    expect(h.stored()).toBeNull();
  });

  it('saves text typed during a save afterwards, from the new revision', async () => {
    let release: (o: SaveOutcome) => void = () => {};
    const h = harness([]);
    const slow = new DraftSaver({
      baseRevision: 1,
      save: (_p, base) => new Promise((r) => (release = () => r({ ok: true, revision: base + 1 }))),
      store: { get: () => null, set: () => {}, clear: () => {} },
      onStatus: (s) => h.statuses.push(s),
      setTimer: (fn) => (fn(), 0),
      clearTimer: () => {},
    });
    slow.edit(edit('one'));
    slow.edit(edit('two'));
    release({ ok: true, revision: 2 });
    await new Promise((r) => setTimeout(r, 0));
    expect(slow.revision).toBeGreaterThanOrEqual(2);
  });

  it('reports an invalid save without retrying', async () => {
    const h = harness([{ ok: false, kind: 'invalid', message: 'title: Enter a title.' }]);
    h.saver.edit(edit('x'));
    await h.tick();
    expect(h.statuses.at(-1)).toEqual({ state: 'invalid', revision: 1, message: 'title: Enter a title.' });
    expect(h.timers.filter((t) => t.ms >= 0)).toHaveLength(0);
  });
});
