#!/usr/bin/env node
// `npm run measure:reading` — against a running Sequent (npm start; SEQUENT_URL to point
// elsewhere): server render time of the largest demo case's reading page at 10 concurrent
// requests (p50/p95 over 500 requests, loopback), and the JavaScript the page ships
// (gzip sizes of every script it loads). A measurement, not a test: goals are in the README.
import { gzipSync } from 'node:zlib';

const base = process.env.SEQUENT_URL ?? 'http://127.0.0.1:4321';
const total = Number(process.env.REQUESTS ?? 500);
const concurrency = Number(process.env.CONCURRENCY ?? 10);

const signIn = await fetch(`${base}/signin`, {
  method: 'POST',
  redirect: 'manual',
  headers: { 'content-type': 'application/x-www-form-urlencoded', origin: base },
  body: new URLSearchParams({ email: 'tomas.ilvar@kestrelweir.example', password: 'sequent-demo' }),
});
const cookie = signIn.headers.getSetCookie().find((c) => c.startsWith('sequent.session_token='))?.split(';')[0];
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

for (let i = 0; i < 20; i += 1) await (await fetch(url, { headers })).text();
const times = [];
let next = 0;
await Promise.all(
  Array.from({ length: concurrency }, async () => {
    while (next < total) {
      next += 1;
      const t0 = performance.now();
      const r = await fetch(url, { headers });
      await r.text();
      if (!r.ok) throw new Error(`HTTP ${r.status}`);
      times.push(performance.now() - t0);
    }
  }),
);
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
console.log(`  ${total} requests, ${concurrency} concurrent: p50 ${pct(50)} ms, p95 ${pct(95)} ms (goal p95 ≤ 50 ms)`);
console.log(`  JavaScript shipped: ${kb(js)} KB gzip in ${seen.size} files + ${kb(inline)} KB inline (goal ≤ 150 KB)`);
for (const [src, size] of seen) console.log(`    ${kb(size).padStart(6)} KB  ${new URL(src).pathname}`);
