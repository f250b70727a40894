#!/usr/bin/env node
// `npm run measure:reading` — against a running Sequent (npm start; SEQUENT_URL to point
// elsewhere): server render time of the largest demo case's reading page at 10 concurrent
// requests (p50/p95 over 2000 requests, loopback, load from autocannon), and the JavaScript the page ships
// (gzip sizes of every script it loads). A measurement, not a test: goals are in the README.
import { gzipSync } from 'node:zlib';
import autocannon from 'autocannon';

const base = process.env.SEQUENT_URL ?? 'http://127.0.0.1:4321';
const total = Number(process.env.REQUESTS ?? 2000);
const concurrency = Number(process.env.CONCURRENCY ?? 10);

const signIn = await fetch(`${base}/signin`, {
  method: 'POST',
  redirect: 'manual',
  headers: { 'content-type': 'application/x-www-form-urlencoded', origin: base },
  body: new URLSearchParams({ email: 'tomas.ilvar@kestrelweir.example', password: 'sequent-demo', remember: 'on' }),
});
// Every cookie sign-in sets (the session token and its signed cache), as a browser sends them.
const cookie = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).filter((c) => c.startsWith('sequent.')).join('; ') || null;
if (!cookie) {
  console.error(`Could not sign in at ${base} (is npm start running?)`);
  process.exit(1);
}
const headers = { cookie };
const { cases } = await (await fetch(`${base}/api/v1/cases?limit=100`, { headers })).json();
let largest = null;
for (const c of cases) {
  const detail = await (await fetch(`${base}/api/v1/cases/${c.id}`, { headers })).json();
  const size = detail.case.revision.body.length;
  if (!largest || size > largest.size) largest = { id: c.id, title: c.title, size };
}
const url = `${base}/cases/${largest.id}`;

// Warm up (JIT, caches) before measuring the steady state.
for (let i = 0; i < 1000; i += 1) await (await fetch(url, { headers })).text();
// The load comes from autocannon (raw sockets, keep-alive): Node's fetch costs about 1.5 ms of
// client CPU per 100-KB page, which on a 2-core machine would be counted as server time.
const times = [];
const statuses = new Map();
const run = autocannon({ url, headers, connections: concurrency, amount: total });
run.on('response', (_client, status, _bytes, responseTime) => {
  times.push(responseTime);
  statuses.set(status, (statuses.get(status) ?? 0) + 1);
});
const summary = await run;
if (statuses.size !== 1 || !statuses.has(200)) throw new Error(`Unexpected statuses: ${JSON.stringify([...statuses])}`);
times.sort((a, b) => a - b);
const pct = (p) => times[Math.min(times.length - 1, Math.floor((p / 100) * times.length))].toFixed(1);

const html = await (await fetch(url, { headers })).text();
const scripts = new Set();
for (const m of html.matchAll(/<script[^>]+src="([^"]+)"/g)) scripts.add(m[1]);
for (const m of html.matchAll(/(?:component-url|renderer-url)="([^"]+)"/g)) scripts.add(m[1]);
// Follow static imports of each module once, so shared chunks are counted.
const seen = new Map();
const queue = [...scripts];
while (queue.length) {
  const src = queue.shift();
  const abs = new URL(src, base).href;
  if (seen.has(abs)) continue;
  const text = await (await fetch(abs)).text();
  seen.set(abs, gzipSync(text).length);
  for (const m of text.matchAll(/(?:from|import)\s*["']([^"']+\.js)["']/g)) queue.push(new URL(m[1], abs).href);
}
const inline = [...html.matchAll(/<script(?![^>]+src)[^>]*>([\s\S]*?)<\/script>/g)].reduce((n, m) => n + gzipSync(m[1]).length, 0);
const kb = (n) => (n / 1024).toFixed(1);
const js = [...seen.values()].reduce((a, b) => a + b, 0);

console.log(`Reading page of "${largest.title}" (${largest.size} characters of markdown)`);
console.log(`  ${total} requests, ${concurrency} concurrent: p50 ${pct(50)} ms, p95 ${pct(95)} ms, p99 ${pct(99)} ms (goal p95 ≤ 50 ms); ${Math.round(summary.requests.average)} requests/s`);
console.log(`  JavaScript shipped: ${kb(js)} KB gzip in ${seen.size} files + ${kb(inline)} KB inline (goal ≤ 150 KB)`);
for (const [src, size] of seen) console.log(`    ${kb(size).padStart(6)} KB  ${new URL(src).pathname}`);
