#!/usr/bin/env node
// The local stand-in for an SMTP server: accepts every message on loopback, parses it and
// stores it as one JSON file (from, to, subject, text, html, date), and answers a tiny HTTP
// API on loopback that the development mailbox page (/dev/mailbox) and the tests read:
//   GET    /messages       the messages, newest first, without bodies
//   GET    /messages/:id   one message with its text and HTML bodies
//   DELETE /messages       removes every message
//   GET    /health         {"ok":true}
// Started by `npm start` (as a process) and by the test setup (programmatically, through
// startMailFake). Never for production: it accepts mail from anyone who can reach it.
import { mkdir, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import http from 'node:http';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { listenOn } from '../scripts/lib/ports.mjs';

const HOST = '127.0.0.1';
const ID_PATTERN = /^[0-9]{13}-[0-9]{6}$/;

/**
 * @typedef {object} StoredMessage
 * @property {string} id
 * @property {string} from
 * @property {string[]} to      envelope recipients (who the server was asked to deliver to)
 * @property {string} subject
 * @property {string} text
 * @property {string} html
 * @property {string} date      ISO time the fake received it
 */

/**
 * @typedef {object} MailFake
 * @property {string} smtpUrl   e.g. smtp://127.0.0.1:54330
 * @property {string} apiUrl    e.g. http://127.0.0.1:54331
 * @property {number} smtpPort
 * @property {number} httpPort
 * @property {string} dir       where messages are stored
 * @property {() => Promise<void>} stop  closes both servers and every open connection
 */

/** @param {import('node:net').Server} server @param {number} port */
const listen = (server, port) => listenOn(server, port, HOST);

/** @param {import('mailparser').AddressObject | import('mailparser').AddressObject[] | undefined} value */
function addressText(value) {
  if (!value) return '';
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(', ');
}

let sequence = 0;

/**
 * Starts the fake: SMTP and HTTP on loopback (port 0 picks free ports), storing messages in
 * `dir` (created if missing; existing messages are kept, so a restart loses nothing).
 * With `control`, the HTTP API also takes `POST /smtp/stop` and `POST /smtp/start`, which
 * close and reopen the SMTP port (the tests' way to take the mail server down and back).
 * @param {{ dir: string, smtpPort?: number, httpPort?: number, control?: boolean }} options
 * @returns {Promise<MailFake>}
 */
export async function startMailFake({ dir, smtpPort = 0, httpPort = 0, control = false }) {
  await mkdir(dir, { recursive: true });

  /** @param {string} id */
  const fileOf = (id) => path.join(dir, `${id}.json`);

  /** @returns {Promise<StoredMessage[]>} newest first */
  async function list() {
    const names = (await readdir(dir)).filter((n) => n.endsWith('.json')).sort().reverse();
    const messages = [];
    for (const name of names) {
      try {
        messages.push(JSON.parse(await readFile(path.join(dir, name), 'utf8')));
      } catch {
        // A file being written or removed right now: skip it.
      }
    }
    return messages;
  }

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 10 * 1024 * 1024,
    banner: 'Sequent local mail fake',
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          sequence = (sequence + 1) % 1_000_000;
          const id = `${Date.now()}-${String(sequence).padStart(6, '0')}`;
          /** @type {StoredMessage} */
          const message = {
            id,
            from: addressText(parsed.from) || (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
            date: new Date().toISOString(),
          };
          await writeFile(fileOf(id), JSON.stringify(message, null, 2));
          callback();
        })
        .catch((/** @type {unknown} */ error) => callback(error instanceof Error ? error : new Error(String(error))));
    },
  });
  smtp.on('error', () => {});

  /** @param {http.ServerResponse} res @param {number} status @param {unknown} body */
  const json = (res, status, body) => {
    res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store' });
    res.end(JSON.stringify(body));
  };

  const api = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://localhost');
    const one = /^\/messages\/([^/]+)$/.exec(url.pathname);
    (async () => {
      if (req.method === 'GET' && url.pathname === '/health') return json(res, 200, { ok: true });
      if (req.method === 'GET' && url.pathname === '/messages') {
        const messages = await list();
        return json(res, 200, { messages: messages.map(({ text, html, ...summary }) => summary) });
      }
      if (req.method === 'DELETE' && url.pathname === '/messages') {
        const names = (await readdir(dir)).filter((n) => n.endsWith('.json'));
        await Promise.all(names.map((n) => rm(path.join(dir, n), { force: true })));
        return json(res, 200, { removed: names.length });
      }
      if (control && req.method === 'POST' && url.pathname === '/smtp/stop') {
        await stopSmtp();
        return json(res, 200, { smtp: 'stopped' });
      }
      if (control && req.method === 'POST' && url.pathname === '/smtp/start') {
        await startSmtp();
        return json(res, 200, { smtp: 'listening' });
      }
      if (req.method === 'GET' && one) {
        const id = one[1] ?? '';
        if (!ID_PATTERN.test(id)) return json(res, 404, { error: 'No such message.' });
        try {
          return json(res, 200, JSON.parse(await readFile(fileOf(id), 'utf8')));
        } catch {
          return json(res, 404, { error: 'No such message.' });
        }
      }
      return json(res, 404, { error: 'Not found.' });
    })().catch(() => json(res, 500, { error: 'The mail fake could not read its folder.' }));
  });

  const boundSmtp = await listen(smtp.server, smtpPort);
  let boundHttp;
  try {
    boundHttp = await listen(api, httpPort);
  } catch (error) {
    await new Promise((resolve) => smtp.close(() => resolve(null)));
    throw error;
  }

  // Track SMTP sockets so stop() can end them at once (a client holding a connection open
  // would otherwise keep the port busy and a restart on the same port would fail).
  /** @type {Set<import('node:net').Socket>} */
  const sockets = new Set();
  smtp.server.on('connection', (socket) => {
    sockets.add(socket);
    socket.once('close', () => sockets.delete(socket));
  });

  let smtpListening = true;
  async function stopSmtp() {
    if (!smtpListening) return;
    const closed = new Promise((resolve) => smtp.server.close(() => resolve(null)));
    for (const socket of sockets) socket.destroy();
    await closed;
    smtpListening = false;
  }
  async function startSmtp() {
    if (smtpListening) return;
    await listen(smtp.server, boundSmtp);
    smtpListening = true;
  }

  return {
    smtpUrl: `smtp://${HOST}:${boundSmtp}`,
    apiUrl: `http://${HOST}:${boundHttp}`,
    smtpPort: boundSmtp,
    httpPort: boundHttp,
    dir,
    async stop() {
      const smtpClosed = stopSmtp();
      const apiClosed = new Promise((resolve) => api.close(() => resolve(null)));
      api.closeAllConnections();
      await Promise.all([smtpClosed, apiClosed]);
    },
  };
}

// As a process: `node mail-fake/server.mjs` (ports and folder from the environment).
if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const dir = path.resolve(process.env.MAIL_FAKE_DIR ?? path.join(process.cwd(), '.data', 'mail'));
  const fake = await startMailFake({
    dir,
    smtpPort: Number(process.env.MAIL_FAKE_SMTP_PORT ?? 54330),
    httpPort: Number(process.env.MAIL_FAKE_HTTP_PORT ?? 54331),
  }).catch((/** @type {unknown} */ error) => {
    console.error(`The mail fake could not start: ${error instanceof Error ? error.message : error}`);
    process.exit(1);
  });
  console.log(`Mail fake: SMTP ${fake.smtpUrl}, mailbox API ${fake.apiUrl}, messages in ${dir}`);
  for (const signal of ['SIGINT', 'SIGTERM']) {
    process.on(signal, () => {
      fake.stop().then(() => process.exit(0));
    });
  }
}
