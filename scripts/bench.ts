/**
 * Solver benchmark (`npx tsx scripts/bench.ts`, later `npm run bench`).
 * Plain timing with performance.now(): warm-up, then timed batches; prints a table and
 * compares with the goals. Exit code 1 if a goal is missed, so CI can run it.
 */
import { evaluateCase } from '../src/lib/calc';
import {
  dischargeRange,
  solve,
  solveHydraulicJump,
  solveTailwaterCheck,
  SOLVER_VERSION,
  type HydraulicJumpInput,
  type TailwaterCheckInput,
} from '../src/lib/solver/index';

/** A throughput benchmark: `run(i)` performs one operation (i varies the inputs). */
interface ThroughputCase {
  readonly name: string;
  /** Minimum operations per second, or undefined for information only. */
  readonly goal?: number;
  readonly run: (i: number) => number;
}

/** A latency benchmark: `run()` performs one whole task; the median time is reported. */
interface LatencyCase {
  readonly name: string;
  /** Maximum median milliseconds, or undefined for information only. */
  readonly goalMs?: number;
  readonly run: () => number;
}

const VARIANTS = 1024;
let sink = 0; // consumed results, so the work cannot be optimised away

function jumpInputs(make: (k: number) => HydraulicJumpInput): HydraulicJumpInput[] {
  return Array.from({ length: VARIANTS }, (_, k) => make(k));
}

const rect = jumpInputs((k) => ({ section: { shape: 'rectangular', width: 2 + (k % 7) }, discharge: 5 + (k % 13), y1: 0.2 + 0.001 * (k % 97) }));
const trap = jumpInputs((k) => ({ section: { shape: 'trapezoidal', width: 2 + (k % 7), sideSlope: 0.5 + 0.1 * (k % 11) }, discharge: 5 + (k % 13), y1: 0.2 + 0.001 * (k % 97) }));
const circ = jumpInputs((k) => ({ section: { shape: 'circular', diameter: 3 + 0.01 * (k % 50) }, discharge: 2 + 0.05 * (k % 13), y1: 0.25 + 0.001 * (k % 97) }));

const value = (r: ReturnType<typeof solveHydraulicJump>): number => (r.ok ? r.value.y2 : -1);

const sweepTrapezoid: TailwaterCheckInput = {
  section: { shape: 'trapezoidal', width: 12, sideSlope: 1.5 },
  discharges: dischargeRange(10, 400, 500),
  toe: { method: 'head', head: 15, lossCoefficient: 0.05 },
  tailwater: { method: 'manning', n: 0.03, slope: 0.0005 },
};
const sweepRectTable: TailwaterCheckInput = {
  section: { shape: 'rectangular', width: 20 },
  discharges: dischargeRange(10, 400, 500),
  toe: { method: 'head', head: 15 },
  tailwater: { method: 'table', discharge: [0, 100, 200, 300, 400], depth: [0.5, 2.2, 3.4, 4.3, 5.0] },
};
const sweepCircle: TailwaterCheckInput = {
  section: { shape: 'circular', diameter: 4 },
  discharges: dischargeRange(1, 20, 500),
  toe: { method: 'gate', opening: 0.5 },
  tailwater: { method: 'manning', n: 0.013, slope: 0.001 },
};

const THROUGHPUT: ThroughputCase[] = [
  { name: 'rectangular jump (solveHydraulicJump)', goal: 1_000_000, run: (i) => value(solveHydraulicJump(rect[i & (VARIANTS - 1)] as HydraulicJumpInput)) },
  { name: 'trapezoidal jump (solveHydraulicJump)', goal: 100_000, run: (i) => value(solveHydraulicJump(trap[i & (VARIANTS - 1)] as HydraulicJumpInput)) },
  { name: 'circular jump (solveHydraulicJump)', goal: 100_000, run: (i) => value(solveHydraulicJump(circ[i & (VARIANTS - 1)] as HydraulicJumpInput)) },
  {
    name: "rectangular jump via solve('hydraulic-jump')",
    run: (i) => {
      const x = rect[i & (VARIANTS - 1)] as HydraulicJumpInput;
      const r = solve('hydraulic-jump', { width: (x.section as { width: number }).width, discharge: x.discharge, y1: x.y1 });
      return r.ok ? (r.value.values['y2'] as number) : -1;
    },
  },
];

const LATENCY: LatencyCase[] = [
  { name: '500-flow tailwater sweep, trapezoid, head + Manning', goalMs: 5, run: () => sweepOf(sweepTrapezoid) },
  { name: '500-flow tailwater sweep, rectangle, head + table', goalMs: 5, run: () => sweepOf(sweepRectTable) },
  { name: '500-flow tailwater sweep, pipe, gate + Manning', goalMs: 5, run: () => sweepOf(sweepCircle) },
];

/** A case body of 20 blocks of every kind, with references between them (invented numbers). */
const TWENTY_BLOCK_CASE = Array.from({ length: 4 }, (_, k) => {
  const Q = 40 + 15 * k;
  return [
    `\`\`\`toe spill${k}\nshape = rectangular\nb = 12 m\nQ = ${Q} m3/s\nH = ${8 + k} m\nk = 0.1\n\`\`\``,
    `\`\`\`jump basin${k}\nshape = rectangular\nb = spill${k}.b\nQ = ${Q} m3/s\ny1 = spill${k}.y1\n\`\`\``,
    `\`\`\`jump outlet${k}\nshape = trapezoidal\nb = 6 m\nz = 1.5\nQ = ${Q} m3/s\ny1 = basin${k}.y1\n\`\`\``,
    `\`\`\`tailwater check${k}\nb = 12 m\nQ = 10 to ${Q * 2} m3/s count 20\ntoe = head\nH = ${8 + k} m\ntailwater = manning\nn = 0.03\nS = 0.002\n\`\`\``,
    k % 2 ? `\`\`\`surge closure${k}\nh = 2.5 m\nu = 1.2 m/s\ndirection = upstream\ndq = -3 m2/s\n\`\`\`` : `\`\`\`dambreak dam${k}\nh0 = ${10 + k} m\nh1 = 1.5 m\n\`\`\``,
  ].join('\n\nSome prose between the blocks.\n\n');
}).join('\n\n');
// A benchmark of error paths would flatter the figure: every block must solve.
const broken = evaluateCase(TWENTY_BLOCK_CASE).blocks.filter((b) => b.status !== 'ok');
if (broken.length) throw new Error(`bench case: ${broken.map((b) => `${b.name}: ${b.errors[0]?.message}`).join('; ')}`);

function sweepOf(input: TailwaterCheckInput): number {
  const r = solveTailwaterCheck(input);
  return r.ok ? r.value.rows.length : -1;
}

/**
 * ── Extension point ─────────────────────────────────────────────────────────────────
 * Case-level benchmarks go here, e.g. the "20-block case evaluation" (parse a case's
 * blocks, resolve references, run every block). Each entry is a LatencyCase: give it a
 * name, an optional goalMs, and a run() that evaluates the whole case once.
 */
export const CASE_BENCHMARKS: LatencyCase[] = [
  { name: '20-block case evaluated (evaluateCase)', goalMs: 16, run: () => evaluateCase(TWENTY_BLOCK_CASE).blocks.length },
];

function throughput(c: ThroughputCase): number {
  let i = 0;
  const warmEnd = performance.now() + 300;
  while (performance.now() < warmEnd) for (let k = 0; k < 1000; k++) sink += c.run(i++);
  let ops = 0;
  const start = performance.now();
  let now = start;
  while (now - start < 1000) {
    for (let k = 0; k < 10_000; k++) sink += c.run(i++);
    ops += 10_000;
    now = performance.now();
  }
  return (ops / (now - start)) * 1000;
}

function latency(c: LatencyCase, runs = 200): number {
  for (let k = 0; k < 20; k++) sink += c.run();
  const times: number[] = [];
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    sink += c.run();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)] as number;
}

const pad = (s: string, n: number) => s.padEnd(n);
const lpad = (s: string, n: number) => s.padStart(n);
const fmt = (x: number) => Math.round(x).toLocaleString('en-US');

let missed = 0;
console.log(`Sequent solver ${SOLVER_VERSION} benchmark — Node ${process.version}\n`);
console.log(`${pad('Throughput', 52)}${lpad('solves/s', 14)}${lpad('goal', 14)}  ok`);
console.log('-'.repeat(84));
for (const c of THROUGHPUT) {
  const rate = throughput(c);
  const pass = c.goal === undefined || rate >= c.goal;
  if (!pass) missed++;
  console.log(`${pad(c.name, 52)}${lpad(fmt(rate), 14)}${lpad(c.goal === undefined ? '—' : `≥ ${fmt(c.goal)}`, 14)}  ${c.goal === undefined ? '' : pass ? 'yes' : 'NO'}`);
}
console.log(`\n${pad('Latency (median of 200 runs)', 52)}${lpad('ms', 14)}${lpad('goal', 14)}  ok`);
console.log('-'.repeat(84));
for (const c of [...LATENCY, ...CASE_BENCHMARKS]) {
  const ms = latency(c);
  const pass = c.goalMs === undefined || ms <= c.goalMs;
  if (!pass) missed++;
  console.log(`${pad(c.name, 52)}${lpad(ms.toFixed(3), 14)}${lpad(c.goalMs === undefined ? '—' : `≤ ${c.goalMs}`, 14)}  ${c.goalMs === undefined ? '' : pass ? 'yes' : 'NO'}`);
}
console.log(`\n(checksum ${sink.toExponential(3)})`);
if (missed > 0) {
  console.log(`${missed} goal(s) missed.`);
  process.exitCode = 1;
}
