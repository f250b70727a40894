// @ts-check
// Meilisearch-shaped errors: every failure the fake reports, on the wire or inside a failed
// task, is an object `{ message, code, type, link }` with the same `code` and `type` a real
// Meilisearch server uses, and the same HTTP status. The official SDK turns a non-2xx answer
// with such a body into a `MeilisearchApiError` whose `cause` is this object.

/** @typedef {'invalid_request' | 'internal' | 'auth' | 'system'} ErrorType */

/**
 * @typedef {object} MeiliErrorBody
 * @property {string} message
 * @property {string} code
 * @property {ErrorType} type
 * @property {string} link
 */

const LINK_BASE = 'https://docs.meilisearch.com/errors#';

/** An error with a Meilisearch error code; `status` is the HTTP status it is answered with. */
export class MeiliError extends Error {
  /**
   * @param {number} status
   * @param {string} code
   * @param {string} message
   * @param {ErrorType} [type]
   */
  constructor(status, code, message, type = 'invalid_request') {
    super(message);
    this.name = 'MeiliError';
    this.status = status;
    this.code = code;
    this.type = type;
  }

  /** @returns {MeiliErrorBody} */
  toJSON() {
    return { message: this.message, code: this.code, type: this.type, link: LINK_BASE + this.code };
  }
}

/** 400 with an `invalid_request` type. @param {string} code @param {string} message */
export const badRequest = (code, message) => new MeiliError(400, code, message);

/** @param {string} uid */
export const indexNotFound = (uid) => new MeiliError(404, 'index_not_found', `Index \`${uid}\` not found.`);

/** Any thrown value as an error body (non-Meili errors become `internal`). @param {unknown} error */
export function errorBody(error) {
  if (error instanceof MeiliError) return error.toJSON();
  const message = error instanceof Error ? error.message : String(error);
  return new MeiliError(500, 'internal', `The search fake failed: ${message}`, 'internal').toJSON();
}

/** @param {unknown} error */
export function errorStatus(error) {
  return error instanceof MeiliError ? error.status : 500;
}

const VALID_UID = /^[A-Za-z0-9_-]{1,400}$/;

/** Throws `invalid_index_uid` unless `uid` is a valid index uid. @param {unknown} uid @returns {string} */
export function checkIndexUid(uid) {
  if (typeof uid === 'string' && VALID_UID.test(uid)) return uid;
  throw badRequest(
    'invalid_index_uid',
    `\`${typeof uid === 'string' ? uid : JSON.stringify(uid)}\` is not a valid index uid. Index uid can be an integer or a string containing only alphanumeric characters, hyphens (-) and underscores (_), and can not be more than 512 bytes.`,
  );
}

/**
 * The JSON type name Meilisearch's deserializer uses in "Invalid value type" messages.
 * @param {unknown} value
 */
export function jsonKind(value) {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'an array';
  if (typeof value === 'string') return 'a string';
  if (typeof value === 'number') return Number.isInteger(value) && value >= 0 ? 'a positive integer' : Number.isInteger(value) ? 'a negative integer' : 'a number';
  if (typeof value === 'boolean') return 'a boolean';
  return 'an object';
}

/**
 * "Invalid value type at `.field`: expected X, but found Y: `json`" as `code`.
 * @param {string} code @param {string} path e.g. `.limit` @param {string} expected @param {unknown} value
 */
export function invalidType(code, path, expected, value) {
  const where = path ? ` at \`${path}\`` : '';
  return badRequest(code, `Invalid value type${where}: expected ${expected}, but found ${jsonKind(value)}: \`${JSON.stringify(value)}\``);
}
