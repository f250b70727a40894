#!/usr/bin/env node
// The production server: Astro's standalone handler (static assets + pages) behind a small
// Node HTTP server of our own, so that forwarded-for headers are honoured only when the app
// is told it sits behind a trusted load balancer (SEQUENT_TRUST_PROXY=on). Astro takes the
// client address from X-Forwarded-For whenever it is present; without this, any client could
// pick its own address and dodge the sign-in rate limit.
import http from 'node:http';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { projectRoot } from './lib/project.mjs';

process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const { handler } = await import(pathToFileURL(path.join(projectRoot, 'dist/server/entry.mjs')).href);

const trustProxy = process.env.SEQUENT_TRUST_PROXY === 'on';
const FORWARDED = ['x-forwarded-for', 'x-forwarded-host', 'x-forwarded-proto', 'x-forwarded-port', 'forwarded'];
const host = process.env.HOST ?? '127.0.0.1';
const port = Number(process.env.PORT ?? 4321);

const server = http.createServer((req, res) => {
  if (!trustProxy) for (const name of FORWARDED) delete req.headers[name];
  handler(req, res);
});
server.listen(port, host, () => console.log(`Sequent listening on http://${host}:${port}`));

for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    server.close(() => process.exit(0));
    server.closeAllConnections();
  });
}
