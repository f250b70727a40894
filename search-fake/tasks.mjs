// @ts-check
// The task queue: every write is a task with an increasing uid, answered at once as
// "enqueued" and processed in order in the background (one at a time, each on its own turn
// of the event loop), going enqueued → processing → succeeded | failed | canceled. The log
// keeps the latest MAX_TASKS tasks; the listing filters are the ones of `GET /tasks`.
import { badRequest, errorBody, MeiliError } from './errors.mjs';

/** Tasks kept in the log (older finished ones are dropped). */
export const MAX_TASKS = 5000;

/**
 * @typedef {object} Task
 * @property {number} uid
 * @property {number | null} batchUid
 * @property {string | null} indexUid
 * @property {'enqueued' | 'processing' | 'succeeded' | 'failed' | 'canceled'} status
 * @property {string} type
 * @property {number | null} canceledBy
 * @property {Record<string, any>} details
 * @property {import('./errors.mjs').MeiliErrorBody | null} error
 * @property {string | null} duration
 * @property {string} enqueuedAt
 * @property {string | null} startedAt
 * @property {string | null} finishedAt
 * @property {string} [customMetadata]
 */

/** @typedef {(task: Task) => Record<string, any> | void} TaskRun  returns details to merge; throws to fail */

const STATUSES = ['enqueued', 'processing', 'succeeded', 'failed', 'canceled'];
const TYPES = [
  'documentAdditionOrUpdate',
  'documentEdition',
  'documentDeletion',
  'settingsUpdate',
  'indexCreation',
  'indexDeletion',
  'indexUpdate',
  'indexSwap',
  'taskCancelation',
  'taskDeletion',
  'dumpCreation',
  'snapshotCreation',
  'upgradeDatabase',
];

/** ISO 8601 duration of `ms` milliseconds, as Meilisearch writes it (`PT0.012345S`). @param {number} ms */
export function isoDuration(ms) {
  return `PT${(Math.max(ms, 0) / 1000).toFixed(6)}S`;
}

/** The summarized task answered when a task is enqueued. @param {Task} task */
export function summarize(task) {
  return { taskUid: task.uid, indexUid: task.indexUid, status: task.status, type: task.type, enqueuedAt: task.enqueuedAt };
}

export class TaskQueue {
  /** @param {{ onChange?: () => void }} [options] */
  constructor({ onChange } = {}) {
    /** @type {Map<number, Task>} in uid order */
    this.tasks = new Map();
    /** @type {Array<{ task: Task, run: TaskRun }>} */
    this.pending = [];
    this.nextUid = 0;
    this.nextBatchUid = 0;
    this.scheduled = false;
    this.processing = false;
    this.paused = false;
    this.onChange = onChange ?? (() => {});
    /** @type {Array<() => void>} */
    this.idleWaiters = [];
  }

  /**
   * Enqueues a task; `run` does the work when its turn comes.
   * @param {{ indexUid: string | null, type: string, details?: Record<string, any>, customMetadata?: string }} spec
   * @param {TaskRun} run
   * @returns {Task}
   */
  enqueue(spec, run) {
    /** @type {Task} */
    const task = {
      uid: this.nextUid,
      batchUid: null,
      indexUid: spec.indexUid,
      status: 'enqueued',
      type: spec.type,
      canceledBy: null,
      details: spec.details ?? {},
      error: null,
      duration: null,
      enqueuedAt: new Date().toISOString(),
      startedAt: null,
      finishedAt: null,
    };
    if (spec.customMetadata !== undefined) task.customMetadata = spec.customMetadata;
    this.nextUid += 1;
    this.tasks.set(task.uid, task);
    this.pending.push({ task, run });
    this.trim();
    this.onChange();
    this.schedule();
    return task;
  }

  schedule() {
    if (this.scheduled || this.paused || this.pending.length === 0) return;
    this.scheduled = true;
    setImmediate(() => {
      this.scheduled = false;
      this.step();
    });
  }

  /** Processes one task, then schedules the next. */
  step() {
    if (this.paused) return;
    const next = this.pending.shift();
    if (!next) {
      this.notifyIdle();
      return;
    }
    const { task, run } = next;
    if (task.status !== 'enqueued') {
      this.schedule();
      return;
    }
    this.processing = true;
    task.status = 'processing';
    task.batchUid = this.nextBatchUid;
    this.nextBatchUid += 1;
    const started = performance.now();
    task.startedAt = new Date().toISOString();
    try {
      const details = run(task);
      if (details) Object.assign(task.details, details);
      task.status = 'succeeded';
    } catch (error) {
      task.status = 'failed';
      task.error = errorBody(error);
      // Counts that were never computed read 0 in a failed task, as in Meilisearch.
      for (const key of ['indexedDocuments', 'deletedDocuments', 'matchedTasks', 'canceledTasks', 'deletedTasks']) {
        if (key in task.details && task.details[key] === null) task.details[key] = 0;
      }
      if (!(error instanceof MeiliError)) console.error(`search fake: task ${task.uid} (${task.type}) crashed:`, error);
    }
    task.duration = isoDuration(performance.now() - started);
    task.finishedAt = new Date().toISOString();
    this.processing = false;
    this.onChange();
    if (this.pending.length > 0) this.schedule();
    else this.notifyIdle();
  }

  notifyIdle() {
    const waiters = this.idleWaiters;
    this.idleWaiters = [];
    for (const resolve of waiters) resolve();
  }

  /** Resolves once no task is waiting or running (processing them first). @returns {Promise<void>} */
  drain() {
    if (this.pending.length === 0 && !this.processing) return Promise.resolve();
    return new Promise((resolve) => {
      this.idleWaiters.push(resolve);
      this.schedule();
    });
  }

  /** Drops the oldest finished tasks beyond MAX_TASKS. */
  trim() {
    if (this.tasks.size <= MAX_TASKS) return;
    for (const [uid, task] of this.tasks) {
      if (this.tasks.size <= MAX_TASKS) break;
      if (task.status !== 'enqueued' && task.status !== 'processing') this.tasks.delete(uid);
    }
  }

  /** @param {number} uid */
  get(uid) {
    const task = this.tasks.get(uid);
    if (!task) throw new MeiliError(404, 'task_not_found', `Task \`${uid}\` not found.`);
    return task;
  }

  /**
   * The tasks matching the filters of `GET /tasks` (also used by cancel and delete).
   * @param {URLSearchParams} params
   * @param {{ paging: boolean }} mode
   * @returns {Task[]} newest first
   */
  select(params, { paging }) {
    const allowed = [
      'uids',
      'batchUids',
      'canceledBy',
      'types',
      'statuses',
      'indexUids',
      'afterEnqueuedAt',
      'beforeEnqueuedAt',
      'afterStartedAt',
      'beforeStartedAt',
      'afterFinishedAt',
      'beforeFinishedAt',
      ...(paging ? ['limit', 'from', 'reverse'] : []),
    ];
    for (const key of params.keys()) {
      if (!allowed.includes(key)) {
        throw badRequest('bad_request', `Unknown parameter \`${key}\`: expected one of ${allowed.map((a) => `\`${a}\``).join(', ')}`);
      }
    }
    /** @param {string} name @returns {string[] | null} null = no filter */
    const list = (name) => {
      const raw = params.get(name);
      if (raw === null) return null;
      const items = raw.split(',').map((s) => s.trim()).filter(Boolean);
      return items.includes('*') ? null : items;
    };
    /** @param {string} name @param {string} code */
    const numbers = (name, code) => {
      const items = list(name);
      if (!items) return null;
      return items.map((s) => {
        if (!/^\d+$/.test(s)) throw badRequest(code, `Invalid value in parameter \`${name}\`: could not parse \`${s}\` as a positive integer`);
        return Number(s);
      });
    };
    const uids = numbers('uids', 'invalid_task_uids');
    const batchUids = numbers('batchUids', 'invalid_task_batch_uids');
    const canceledBy = numbers('canceledBy', 'invalid_task_canceled_by');
    const statuses = list('statuses');
    for (const s of statuses ?? []) {
      if (!STATUSES.includes(s)) {
        throw badRequest('invalid_task_statuses', `Invalid value in parameter \`statuses\`: \`${s}\` is not a valid task status. Available statuses are ${STATUSES.map((x) => `\`${x}\``).join(', ')}.`);
      }
    }
    const types = list('types');
    for (const t of types ?? []) {
      if (!TYPES.includes(t)) {
        throw badRequest('invalid_task_types', `Invalid value in parameter \`types\`: \`${t}\` is not a valid task type. Available types are ${TYPES.map((x) => `\`${x}\``).join(', ')}.`);
      }
    }
    const indexUids = list('indexUids');
    /** @type {Array<[keyof Task, 'after' | 'before', number]>} */
    const dates = [];
    for (const [name, field] of /** @type {const} */ ([
      ['EnqueuedAt', 'enqueuedAt'],
      ['StartedAt', 'startedAt'],
      ['FinishedAt', 'finishedAt'],
    ])) {
      for (const side of /** @type {const} */ (['after', 'before'])) {
        const raw = params.get(`${side}${name}`);
        if (raw === null || raw === '*') continue;
        const t = Date.parse(raw);
        if (Number.isNaN(t)) {
          throw badRequest(`invalid_task_${side}_${field.replace('At', '_at').toLowerCase()}`, `Invalid value in parameter \`${side}${name}\`: \`${raw}\` is an invalid date-time. It should follow the YYYY-MM-DD or RFC 3339 date-time format.`);
        }
        dates.push([field, side, t]);
      }
    }
    let selected = [...this.tasks.values()].filter((task) => {
      if (uids && !uids.includes(task.uid)) return false;
      if (batchUids && (task.batchUid === null || !batchUids.includes(task.batchUid))) return false;
      if (canceledBy && (task.canceledBy === null || !canceledBy.includes(task.canceledBy))) return false;
      if (statuses && !statuses.includes(task.status)) return false;
      if (types && !types.includes(task.type)) return false;
      if (indexUids && (task.indexUid === null || !indexUids.includes(task.indexUid))) return false;
      for (const [field, side, t] of dates) {
        const value = task[field];
        if (typeof value !== 'string') return false;
        const v = Date.parse(value);
        if (side === 'after' ? !(v > t) : !(v < t)) return false;
      }
      return true;
    });
    selected.reverse();
    return selected;
  }

  /**
   * `GET /tasks`: `{ results, total, limit, from, next }`, newest first (oldest first with `reverse=true`).
   * @param {URLSearchParams} params
   */
  list(params) {
    const limitRaw = params.get('limit');
    const fromRaw = params.get('from');
    const limit = limitRaw === null ? 20 : Number(limitRaw);
    if (!Number.isInteger(limit) || limit < 0) throw badRequest('invalid_task_limit', `Invalid value in parameter \`limit\`: could not parse \`${limitRaw}\` as a positive integer`);
    const from = fromRaw === null ? null : Number(fromRaw);
    if (from !== null && (!Number.isInteger(from) || from < 0)) throw badRequest('invalid_task_from', `Invalid value in parameter \`from\`: could not parse \`${fromRaw}\` as a positive integer`);
    const reverseRaw = params.get('reverse');
    if (reverseRaw !== null && reverseRaw !== 'true' && reverseRaw !== 'false') {
      throw badRequest('invalid_task_reverse', `Invalid value in parameter \`reverse\`: could not parse \`${reverseRaw}\` as a boolean`);
    }
    const reverse = reverseRaw === 'true';
    let matching = this.select(params, { paging: true });
    const total = matching.length;
    if (reverse) matching.reverse();
    if (from !== null) matching = matching.filter((t) => (reverse ? t.uid >= from : t.uid <= from));
    const page = matching.slice(0, limit);
    const nextTask = matching[limit];
    return { results: page, total, limit, from: page[0]?.uid ?? null, next: nextTask ? nextTask.uid : null };
  }

  /**
   * Cancels the enqueued tasks among `tasks` (running tasks finish; finished ones stay).
   * @param {Task[]} tasks @param {number} by the cancelation task's uid @returns {number}
   */
  cancel(tasks, by) {
    let canceled = 0;
    for (const task of tasks) {
      if (task.status !== 'enqueued' || task.uid === by) continue;
      task.status = 'canceled';
      task.canceledBy = by;
      task.finishedAt = new Date().toISOString();
      task.duration = null;
      canceled += 1;
    }
    this.pending = this.pending.filter(({ task }) => task.status === 'enqueued');
    return canceled;
  }

  /** Deletes the finished tasks among `tasks`. @param {Task[]} tasks @returns {number} */
  remove(tasks) {
    let deleted = 0;
    for (const task of tasks) {
      if (task.status === 'enqueued' || task.status === 'processing') continue;
      if (this.tasks.delete(task.uid)) deleted += 1;
    }
    return deleted;
  }

  /** What is persisted: the log and the next uid. */
  toJSON() {
    return { format: 'sequent-search-fake-tasks', version: 1, nextTaskUid: this.nextUid, nextBatchUid: this.nextBatchUid, tasks: [...this.tasks.values()] };
  }

  /**
   * Restores a persisted log. Tasks that were waiting or running when the fake stopped
   * without draining (a crash) are marked failed: their payloads were never persisted.
   * @param {any} data
   */
  load(data) {
    if (!data || data.format !== 'sequent-search-fake-tasks' || !Array.isArray(data.tasks)) throw new Error('not a task log of the search fake');
    this.tasks = new Map();
    this.pending = [];
    const now = new Date().toISOString();
    for (const task of data.tasks) {
      if (!task || typeof task.uid !== 'number') continue;
      if (task.status === 'enqueued' || task.status === 'processing') {
        task.status = 'failed';
        task.error = new MeiliError(500, 'internal', 'The search fake stopped before this task was processed; it was not applied.', 'internal').toJSON();
        task.finishedAt = now;
      }
      this.tasks.set(task.uid, task);
    }
    const maxUid = Math.max(-1, ...this.tasks.keys());
    this.nextUid = Math.max(Number(data.nextTaskUid) || 0, maxUid + 1);
    this.nextBatchUid = Number(data.nextBatchUid) || 0;
  }
}
