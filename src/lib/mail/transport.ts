/**
 * The SMTP side of delivery: a small interface the outbox drain sends through, and the
 * nodemailer transport behind it for a real (or the local fake) SMTP server.
 */
import nodemailer from 'nodemailer';

/** One envelope: a single recipient, both bodies. */
export interface OutgoingMail {
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string;
}

/** Anything that can send one message; rejects when it could not. */
export interface MailTransport {
  sendMail(mail: OutgoingMail): Promise<unknown>;
  /** Closes pooled connections, if any. */
  close?(): void;
}

/**
 * A pooled transport for `smtpUrl` (smtp://, smtps://, with credentials in the URL if the server
 * wants them). Short timeouts: a hanging server must not hold outbox rows locked for long.
 */
export function createSmtpTransport(smtpUrl: string): MailTransport {
  const url = new URL(smtpUrl);
  const transport = nodemailer.createTransport({
    host: url.hostname,
    port: url.port ? Number(url.port) : url.protocol === 'smtps:' ? 465 : 587,
    secure: url.protocol === 'smtps:',
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    // A couple of kept-open connections: a batch does not pay a new SMTP session per message.
    pool: true,
    maxConnections: 2,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 15_000,
  });
  return {
    sendMail: (mail) => transport.sendMail(mail),
    close: () => transport.close(),
  };
}

/** Error codes nodemailer uses when the server itself is unreachable or broke off. */
const CONNECTION_CODES = new Set(['ECONNECTION', 'ETIMEDOUT', 'ESOCKET', 'EDNS', 'ECONNREFUSED', 'ETLS', 'EAUTH', 'EGREETING']);

/**
 * True when `error` says the server could not be reached (not that it refused this one
 * recipient): the rest of a batch would fail the same way, so it is postponed untried.
 */
export function isConnectionFailure(error: unknown): boolean {
  const code = (error as { code?: unknown } | null)?.code;
  return typeof code === 'string' && CONNECTION_CODES.has(code);
}

/** A short, single-line description of a send failure for `mail_outbox.last_error`. */
export function describeSendError(error: unknown): string {
  const e = error as { code?: unknown; responseCode?: unknown; message?: unknown } | null;
  const parts = [typeof e?.code === 'string' ? e.code : null, typeof e?.responseCode === 'number' ? String(e.responseCode) : null];
  const message = typeof e?.message === 'string' ? e.message : String(error);
  return [parts.filter(Boolean).join(' '), message].filter(Boolean).join(': ').replace(/\s+/g, ' ').slice(0, 500);
}
