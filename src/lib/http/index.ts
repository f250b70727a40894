export { requireMember, type MemberContext } from './guards';
export { readMultipart, type LimitedBody } from './body';
export { errors, json, jsonError, parseJsonBody, toFieldIssues, type ApiErrorBody, type FieldIssue, type Parsed } from './responses';
