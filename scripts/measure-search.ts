// `npm run measure:search`: precedent search at library scale. Builds a throwaway
// PostgreSQL cluster with 10,000 synthetic published cases (generated here, not demo data)
// in one firm (plus 200 in another), starts the search fake, times a full reindex, then
// serves the built app (run `npm run build` or `npm start` once first) and measures
// `GET /api/v1/search` for a text + Fr1-range + facet query at 10 concurrent requests on
// loopback (autocannon). Prints p50/p95/p99, requests/s, index size. A measurement, not a
// test: the goals are in the README. CASES=, REQUESTS=, CONCURRENCY= change the sizes.
import { spawn } from 'node:child_process';
import { randomBytes, randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { freePort, waitForPort } from './lib/ports.mjs';
import { destroyCluster, ensureDatabase, initCluster, startCluster } from './lib/postgres.mjs';
import { projectRoot, serverNodeFlags } from './lib/project.mjs';

const CASES = Number(process.env.CASES ?? 10_000);
const REQUESTS = Number(process.env.REQUESTS ?? 2_000);
const CONCURRENCY = Number(process.env.CONCURRENCY ?? 10);
const PASSWORD = 'measure-search-password';

/** A small seeded generator, so two runs measure the same library. */
function random(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const STRUCTURES = ['spillway-basin', 'chute-outlet', 'culvert-outlet', 'outfall', 'drop-structure', 'gate-tailwater', 'weir-tailwater'] as const;
/** Words of each structure type's cases; a body is mostly common words with some of these. */
const TOPICS: Record<(typeof STRUCTURES)[number], string[]> = {
  'spillway-basin': ['spillway', 'basin', 'chute', 'baffle', 'endsill', 'apron', 'stilling'],
  'chute-outlet': ['chute', 'outlet', 'deflector', 'riprap', 'apron', 'energy'],
  'culvert-outlet': ['culvert', 'barrel', 'headwall', 'apron', 'outlet', 'wingwall'],
  outfall: ['outfall', 'pipe', 'headwall', 'scour', 'riprap', 'surcharge'],
  'drop-structure': ['drop', 'crest', 'pool', 'sill', 'grade', 'nappe'],
  'gate-tailwater': ['gate', 'sluice', 'opening', 'tailwater', 'contraction', 'vena'],
  'weir-tailwater': ['weir', 'crest', 'tailwater', 'apron', 'submergence', 'nappe'],
};
const COMMON = (
  'the of and to in is was for on that with as by at from this which be are were has have not it an or its been ' +
  'flow depth water level design check case channel section bed width slope survey value values figure result results ' +
  'upstream downstream left right bank side length height over under above below between within along across near ' +
  'high low steep mild rough smooth concrete masonry earth rock gravel sand clay lined unlined existing proposed new ' +
  'flood event return period year annual peak mean normal critical supercritical subcritical rating curve gauge record ' +
  'client county council authority engineer reviewer drawing report appendix table note method assumption margin ' +
  'velocity discharge energy loss head pressure force momentum jump toe sequent conjugate froude manning roughness ' +
  'structure wall floor joint block step edge face toe crest invert soffit level datum benchmark site visit photo ' +
  'maintenance access safety fence debris sediment erosion protection stone size grading layer filter geotextile'
).split(' ');
const PLACES = ['Aldermere', 'Brackwater', 'Cindervale', 'Dunmarsh', 'Eskerby', 'Fallowmead', 'Grisedale', 'Hollinsford', 'Ivybridge Fen', 'Jasper Reach', 'Kettlecombe', 'Larkspur Vale'];
const TAGS = ['design flood', 'apron', 'basin', 'culvert', 'outlet', 'scour', 'undular', 'retrofit', 'survey', 'model study', 'tailwater', 'trapezoidal'];

function syntheticCase(r: () => number, n: number) {
  const pick = <T>(list: readonly T[]) => list[Math.floor(r() * list.length)]!;
  const structureType = pick(STRUCTURES);
  const place = pick(PLACES);
  const blocks: string[] = [];
  for (let k = 0, count = 1 + Math.floor(r() * 3); k < count; k += 1) {
    const b = (2 + r() * 18).toFixed(1);
    const y1 = (0.15 + r() * 0.9).toFixed(2);
    // Fr1 spread over about 1.5–12: q = Fr1·√(g·y1³).
    const fr1 = 1.5 + r() * 10.5;
    const q = (fr1 * Math.sqrt(9.80665 * Number(y1) ** 3) * Number(b)).toFixed(2);
    blocks.push(`\`\`\`jump j${k}\nb = ${b} m\nQ = ${q} m3/s\ny1 = ${y1} m\n\`\`\``);
  }
  const topic = TOPICS[structureType];
  const word = () => (r() < 0.12 ? pick(topic) : pick(COMMON));
  const prose = Array.from({ length: 40 }, () => Array.from({ length: 12 }, word).join(' ') + '.').join(' ');
  return {
    title: `${place} ${pick(topic)} ${pick(topic)} no. ${n}`,
    structureType,
    summary: `Synthetic case ${n}: ${pick(topic)} and ${pick(topic)} at ${place}.`,
    region: `${place} catchment`,
    tags: [...new Set([pick(TAGS), pick(TAGS), pick(TAGS)])],
    body: `## Context\n\n${prose}\n\n${blocks.join('\n\n')}\n`,
  };
}

const root = await mkdtemp(path.join(tmpdir(), 'sequent-measure-pg-'));
const searchDir = await mkdtemp(path.join(tmpdir(), 'sequent-measure-search-'));
const cluster = { root, port: await freePort(), throwaway: true };
const quiet = () => {};
let stopAll: () => Promise<void> = async () => {};
try {
  if (!existsSync(path.join(projectRoot, 'dist', 'server', 'entry.mjs'))) throw new Error('Build the app first: npm run build');
  initCluster(cluster, quiet);
  startCluster(cluster, quiet);
  const databaseUrl = ensureDatabase(cluster, { database: 'sequent_measure', role: 'sequent', password: randomBytes(12).toString('hex') });
  // The fake in its own process, as npm start runs it (and as a real search server would be),
  // so it never shares an event loop with the load generator.
  const searchPort = await freePort();
  const searchKey = randomBytes(12).toString('hex');
  const search = spawn(process.execPath, [path.join(projectRoot, 'search-fake', 'server.mjs')], {
    cwd: projectRoot,
    stdio: ['ignore', 'ignore', 'inherit'],
    env: { ...process.env, SEARCH_FAKE_DIR: searchDir, SEARCH_FAKE_PORT: String(searchPort), SEARCH_FAKE_API_KEY: searchKey },
  });
  await waitForPort(searchPort);
  Object.assign(process.env, { DATABASE_URL: databaseUrl, SEQUENT_SEARCH_URL: `http://127.0.0.1:${searchPort}`, SEQUENT_SEARCH_KEY: searchKey, SEQUENT_SEARCH_INDEX: 'measure-cases' });

  const { migrateDatabase } = await import('../src/db/migrate');
  const { closeDb, db, pool } = await import('../src/db/client');
  const schema = await import('../src/db/schema');
  const { hashPassword } = await import('../src/lib/auth');
  const { addMember, ensureFirm } = await import('../src/lib/firms');
  const { evaluateCase } = await import('../src/lib/calc');
  const { keyFigures } = await import('../src/lib/cases');
  const { keyFigureValues } = await import('../src/lib/cases/rows');
  const { reindexAll, searchService } = await import('../src/lib/search');
  stopAll = async () => {
    await closeDb();
    search.kill('SIGTERM');
    await new Promise((resolve) => (search.exitCode !== null ? resolve(null) : search.once('exit', resolve)));
  };
  await migrateDatabase(databaseUrl);

  console.log(`Generating ${CASES.toLocaleString('en-GB')} synthetic published cases…`);
  const started = performance.now();
  const r = random(20261202);
  const firms = [
    { firm: await ensureFirm(db(), { name: 'Measure firm', slug: 'measure' }), cases: CASES },
    { firm: await ensureFirm(db(), { name: 'Other firm', slug: 'other' }), cases: 200 },
  ];
  let engineerEmail = '';
  for (const [i, { firm, cases }] of firms.entries()) {
    const people = [];
    for (const role of ['engineer', 'reviewer'] as const) {
      const email = `${role}.${i}@measure.example`;
      const added = await addMember(db(), hashPassword, { firmId: firm.id, name: `${role} ${i}`, email, role, temporaryPassword: PASSWORD, actorUserId: null });
      if (!added.ok) throw new Error(`could not add ${email}`);
      people.push(added.member.userId);
      if (i === 0 && role === 'engineer') engineerEmail = email;
    }
    const [author, reviewer] = people as [string, string];
    for (let start = 0; start < cases; start += 250) {
      const batch = Array.from({ length: Math.min(250, cases - start) }, (_, k) => ({ id: randomUUID(), ...syntheticCase(r, start + k + 1) }));
      const evaluated = batch.map((c) => ({ ...c, results: evaluateCase(c.body) }));
      const rounds = evaluated.map(() => randomUUID());
      await db().transaction(async (tx) => {
        await tx.insert(schema.caseFile).values(
          evaluated.map((c) => ({
            id: c.id, firmId: firm.id, title: c.title, slug: `case-${c.id}`, structureType: c.structureType, sectionShape: 'rectangular',
            summary: c.summary, region: c.region, tags: c.tags, authorId: author, state: 'published' as const, latestRevision: 1, publishedRevision: 1,
          })),
        );
        await tx.insert(schema.caseRevision).values(
          evaluated.map((c) => ({ id: randomUUID(), caseId: c.id, firmId: firm.id, number: 1, body: c.body, authorId: author, ...keyFigureValues(keyFigures(c.results)), results: c.results, solverVersion: c.results.solverVersion })),
        );
        await tx.insert(schema.reviewRound).values(
          evaluated.map((c, k) => ({ id: rounds[k]!, caseId: c.id, firmId: firm.id, submittedRevision: 1, submittedBy: author, outcome: 'published', closedAt: new Date() })),
        );
        await tx.insert(schema.approval).values(
          evaluated.map((c, k) => ({ id: randomUUID(), roundId: rounds[k]!, caseId: c.id, firmId: firm.id, revisionNumber: 1, reviewerId: reviewer, solverVersion: c.results.solverVersion, snapshot: c.results })),
        );
      });
    }
  }
  console.log(`  done in ${((performance.now() - started) / 1000).toFixed(1)} s`);

  console.log('Reindexing from PostgreSQL…');
  const service = searchService()!;
  const reindex = await reindexAll(pool(), service);
  const stats = await service.client.getStats();
  console.log(`  ${reindex.indexed.toLocaleString('en-GB')} cases in ${(reindex.ms / 1000).toFixed(1)} s (goal ≤ 30 s); index on disk ${(stats.databaseSize / 1024 / 1024).toFixed(1)} MB`);

  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = spawn(process.execPath, [...serverNodeFlags, path.join(projectRoot, 'scripts', 'serve.mjs')], {
    cwd: projectRoot,
    stdio: ['ignore', 'ignore', 'inherit'],
    env: { ...process.env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(port), SEQUENT_BASE_URL: base, SEQUENT_RATE_LIMIT: 'off', BETTER_AUTH_SECRET: randomBytes(32).toString('hex') },
  });
  const previousStop = stopAll;
  stopAll = async () => {
    server.kill('SIGTERM');
    await previousStop();
  };
  await waitForPort(port);
  const signIn = await fetch(`${base}/signin`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', origin: base },
    body: new URLSearchParams({ email: engineerEmail, password: PASSWORD, remember: 'on' }),
  });
  const cookie = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).filter((c) => c!.startsWith('sequent.')).join('; ');
  if (!cookie) throw new Error('could not sign in to the measured app');

  // Text + Fr1 range + one facet ticked (a multi-search of the hits and that group's counts).
  const words = ['culvert', 'apron basin', 'stilling', 'scour riprap', 'outfall', 'weir tailwater', 'baffle', 'headwall wingwall'];
  const paths = words.map((w, i) => `/api/v1/search?q=${encodeURIComponent(w)}&frMin=${3 + (i % 3)}&frMax=${6 + (i % 4)}&structure=${STRUCTURES[i % STRUCTURES.length]}`);
  const sample = await (await fetch(`${base}${paths[0]}`, { headers: { cookie } })).json();
  if (!Array.isArray(sample.hits)) throw new Error(`unexpected answer: ${JSON.stringify(sample).slice(0, 300)}`);
  for (let i = 0; i < 300; i += 1) await (await fetch(`${base}${paths[i % paths.length]}`, { headers: { cookie } })).text();

  /** Sends REQUESTS requests in turn, CONCURRENCY at a time; percentiles in ms. */
  async function load(requests: autocannon.Request[], url = base, headers: Record<string, string> = { cookie }) {
    const times: number[] = [];
    const statuses = new Map<number, number>();
    const summary = await new Promise<autocannon.Result>((resolve, reject) => {
      const run = autocannon({ url, headers, connections: CONCURRENCY, amount: REQUESTS, requests }, (error, result) => (error ? reject(error) : resolve(result)));
      run.on('response', (_client, status, _bytes, responseTime) => {
        times.push(responseTime);
        statuses.set(status, (statuses.get(status) ?? 0) + 1);
      });
    });
    if (statuses.size !== 1 || !statuses.has(200)) throw new Error(`unexpected statuses: ${JSON.stringify([...statuses])}`);
    times.sort((x, y) => x - y);
    const pct = (p: number) => times[Math.min(times.length - 1, Math.floor((p / 100) * times.length))]!.toFixed(1);
    return `${REQUESTS} requests, ${CONCURRENCY} concurrent: p50 ${pct(50)} ms, p95 ${pct(95)} ms, p99 ${pct(99)} ms; ${Math.round(summary.requests.average)} requests/s`;
  }
  console.log(`GET /api/v1/search, text + Fr1 range + facet, ${sample.total.toLocaleString('en-GB')} hits for "${words[0]}" (goal p95 ≤ 20 ms)`);
  console.log(`  ${await load(paths.map((p) => ({ method: 'GET', path: p })))}`);
  // The search service's share: the same multi-searches straight to the fake.
  const { PrecedentQuerySchema, queryFromParams, searchRequests } = await import('../src/lib/search');
  const bodies = paths.map((p) => {
    const query = PrecedentQuerySchema.parse(queryFromParams(new URL(p, base).searchParams));
    return JSON.stringify({ queries: searchRequests(service.indexUid, firms[0]!.firm.id, query).requests });
  });
  console.log('The same multi-searches sent straight to the search fake');
  console.log(`  ${await load(bodies.map((body) => ({ method: 'POST', path: '/multi-search', body })), process.env.SEQUENT_SEARCH_URL!, { authorization: `Bearer ${searchKey}`, 'content-type': 'application/json' })}`);
  // The floor under the same load: session, firm and a JSON answer, no search.
  console.log('For reference, GET /api/v1/me (session and firm only)');
  console.log(`  ${await load([{ method: 'GET', path: '/api/v1/me' }])}`);
} catch (error) {
  console.error(`measure:search failed: ${error instanceof Error ? (error.stack ?? error.message) : error}`);
  process.exitCode = 1;
} finally {
  await stopAll().catch(() => {});
  destroyCluster(cluster);
  await rm(searchDir, { recursive: true, force: true });
}
