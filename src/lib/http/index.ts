export { requireMember, type MemberContext } from './guards';
export { errors, json, jsonError, parseJsonBody, toFieldIssues, type ApiErrorBody, type FieldIssue, type Parsed } from './responses';
