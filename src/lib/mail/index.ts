export { queueMail, type MailKind, type MailMessage, type QueuedMail } from './outbox';
export * from './messages';
