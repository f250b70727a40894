export { queueMail, type MailKind, type MailMessage, type QueuedMail } from './outbox';
export {
  approvalsCancelledMessage,
  casePublishedMessage,
  caseWithdrawnMessage,
  commentMentionMessage,
  invitationMessage,
  passwordResetMessage,
  reviewApprovedMessage,
  reviewRequestedMessage,
  reviewReturnedMessage,
  type CaseMailFacts,
} from './messages';
export { drainOutbox, type DrainResult, type DrainScope } from './deliver';
export { createSmtpTransport, type MailTransport, type OutgoingMail } from './transport';
export { retryDelayMs, nextAttemptAt, FIRST_RETRY_MS, MAX_RETRY_MS } from './backoff';
export { startMailWorker, stopMailWorker, wakeMailWorker, POLL_INTERVAL_MS } from './worker';
export { clearDevMail, devMailboxUrl, listDevMail, readDevMail, type DevMail, type DevMailSummary } from './devMailbox';
