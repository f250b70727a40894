/**
 * Peer review (`@/lib/review`): the workflow's decisions, pure. The database services and
 * e-mail come with the rest of the review work.
 */
export { ACTION_FROM, afterEdit, decideReview, REVIEW_ACTIONS, type ReviewAction, type ReviewActor, type ReviewDecision, type ReviewRefusal, type ReviewSituation } from './transitions';
