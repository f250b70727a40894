#!/usr/bin/env node
// The production server: Astro's request handler (the node adapter in middleware mode)
// behind a small Node HTTP server of our own, which
//  - serves the built assets in dist/client itself, looking up only paths it knows exist
//    (the list is read once at start), so a page request never costs a file-system probe;
//  - honours forwarded-for headers only when told the app sits behind a trusted load
//    balancer (SEQUENT_TRUST_PROXY=on). Astro takes the client address from
//    X-Forwarded-For whenever it is present; without this, any client could pick its own
//    address and dodge the sign-in rate limit.
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import send from 'send';
import { projectRoot } from './lib/project.mjs';

const { handler } = await import(pathToFileURL(path.join(projectRoot, 'dist/server/entry.mjs')).href);

const clientDir = path.join(projectRoot, 'dist/client');
/** URL paths of the built static files (`/_astro/client.abc123.js`, `/favicon.svg`). */
const staticFiles = new Set(
  fs
    .readdirSync(clientDir, { recursive: true, withFileTypes: true })
    .filter((entry) => entry.isFile())
    .map((entry) => `/${path.relative(clientDir, path.join(entry.parentPath, entry.name)).split(path.sep).join('/')}`),
);

const trustProxy = process.env.SEQUENT_TRUST_PROXY === 'on';
const FORWARDED = ['x-forwarded-for', 'x-forwarded-host', 'x-forwarded-proto', 'x-forwarded-port', 'forwarded'];
const host = process.env.HOST ?? '127.0.0.1';
const port = Number(process.env.PORT ?? 4321);

/** The decoded path of a request URL, or null when it does not decode. */
function pathOf(url) {
  try {
    return decodeURI(new URL(url ?? '/', 'http://localhost').pathname);
  } catch {
    return null;
  }
}

const server = http.createServer((req, res) => {
  if (!trustProxy) for (const name of FORWARDED) delete req.headers[name];
  const pathname = pathOf(req.url);
  if (pathname === null) {
    res.writeHead(400, { 'content-type': 'text/plain; charset=utf-8' });
    res.end('Bad request.');
    return;
  }
  if ((req.method === 'GET' || req.method === 'HEAD') && staticFiles.has(pathname)) {
    const stream = send(req, pathname, { root: clientDir, dotfiles: 'deny' });
    // Hashed bundles never change under their name.
    if (pathname.startsWith('/_astro/')) stream.on('headers', (r) => r.setHeader('cache-control', 'public, max-age=31536000, immutable'));
    stream.on('error', () => handler(req, res));
    stream.pipe(res);
    return;
  }
  handler(req, res);
});
server.listen(port, host, () => console.log(`Sequent listening on http://${host}:${port}`));

for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    server.close(() => process.exit(0));
    server.closeAllConnections();
  });
}
