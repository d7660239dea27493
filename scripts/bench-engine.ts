// Benchmark of the calculation engine: 10,000 varied single-crane inputs, mean and p99 time per
// evaluation, evaluate only and parse (zod) only, and the mean for a three-crane lift. Target: under
// 0.2 ms mean per single-crane evaluation, judged on evaluate only (live preview on every keystroke;
// the input is parsed once at the boundary, timed apart). Wall-clock times grow
// when other processes share the CPUs; the CPU time per evaluation is printed beside them.
//   npm run bench:engine [-- --n 10000]
import { readFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { LiftInput, type LiftInputRaw } from '../shared/schemas/lift-input';
import { evaluateLift } from '../shared/engineering/evaluate';

const nArg = process.argv.indexOf('--n');
const N = nArg > 0 ? Number(process.argv[nArg + 1]) : 10_000;
const dir = new URL('../shared/engineering/examples/', import.meta.url);
const names = [
  'pass-outriggers.json',
  'pass-crawler.json',
  'pass-gantry-a-frame.json',
  'fail-stability.json',
  'fail-capacity.json',
  'caution-discrepancies.json',
  'fail-tandem.json',
  'fail-personnel.json',
];
const bases = names.map((n) => JSON.parse(readFileSync(new URL(n, dir), 'utf8')) as LiftInputRaw);

// Deterministic pseudo-random variation so runs are comparable.
let seed = 12345;
const rnd = () => (seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff;

const inputs: LiftInputRaw[] = [];
for (let i = 0; i < N; i++) {
  const x = structuredClone(bases[i % bases.length]);
  x.load.weight = { value: x.load.weight.value * (0.5 + rnd()), unit: x.load.weight.unit };
  if (x.crane.radius)
    x.crane.radius = { value: x.crane.radius.value * (0.8 + 0.5 * rnd()), unit: x.crane.radius.unit };
  if (rnd() < 0.5) delete x.crane.slewAngle;
  else x.crane.slewAngle = { value: rnd() * 360, unit: 'deg' };
  if (x.environment?.windSpeed) x.environment.windSpeed = { value: rnd() * 15, unit: 'm/s' };
  inputs.push(x);
}

function stats(times: number[]) {
  const s = [...times].sort((a, b) => a - b);
  const mean = times.reduce((a, b) => a + b, 0) / times.length;
  return {
    mean,
    p50: s[Math.floor(s.length * 0.5)],
    p99: s[Math.floor(s.length * 0.99)],
    max: s[s.length - 1],
  };
}

// warm-up
for (let i = 0; i < 2000; i++) evaluateLift(LiftInput.parse(inputs[i % inputs.length]));

// Parsing (zod, at the boundary) is timed on its own: the target is for the evaluation.
const parsed = new Array(N);
const tParse: number[] = new Array(N);
for (let i = 0; i < N; i++) {
  const t0 = performance.now();
  parsed[i] = LiftInput.parse(inputs[i]);
  tParse[i] = performance.now() - t0;
}
const tEval: number[] = new Array(N);
let fails = 0;
const cpu0 = process.cpuUsage();
for (let i = 0; i < N; i++) {
  const t0 = performance.now();
  const r = evaluateLift(parsed[i]);
  tEval[i] = performance.now() - t0;
  if (r.overallStatus === 'fail') fails++;
}
const cpu = process.cpuUsage(cpu0);
// Best batch: the same inputs in batches of 500, the lowest batch mean (as timeit takes the best of
// its repeats): what the machine does when other processes leave it alone. Printed beside the mean.
const BATCH = Math.min(500, N);
let bestBatch = Infinity;
for (let start = 0; start + BATCH <= N; start += BATCH) {
  const t0 = performance.now();
  for (let i = start; i < start + BATCH; i++) evaluateLift(parsed[i]);
  bestBatch = Math.min(bestBatch, (performance.now() - t0) / BATCH);
}
const cpuPerEval = (cpu.user + cpu.system) / 1000 / N;

// Several cranes: each crane gets every single-crane check, so about three evaluations' worth.
const three = LiftInput.parse(JSON.parse(readFileSync(new URL('caution-three-cranes.json', dir), 'utf8')));
const N3 = Math.max(100, Math.floor(N / 10));
for (let i = 0; i < 200; i++) evaluateLift(three);
const t3: number[] = new Array(N3);
const cpu3a = process.cpuUsage();
for (let i = 0; i < N3; i++) {
  const t0 = performance.now();
  evaluateLift(three);
  t3[i] = performance.now() - t0;
}
const cpu3 = process.cpuUsage(cpu3a);
const cpu3PerEval = (cpu3.user + cpu3.system) / 1000 / N3;
const fmt = (x: number) => `${(x * 1000).toFixed(1)} µs`;
const a = stats(tParse);
const b = stats(tEval);
console.log(
  `engine benchmark: ${N} varied inputs (${names.length} example families; ${fails} evaluate to fail)`,
);
console.log(`evaluate only:    mean ${fmt(b.mean)}  p50 ${fmt(b.p50)}  p99 ${fmt(b.p99)}  max ${fmt(b.max)}`);
console.log(`parse only (zod): mean ${fmt(a.mean)}  p50 ${fmt(a.p50)}  p99 ${fmt(a.p99)}  max ${fmt(a.max)}`);
console.log(`parse + evaluate: mean ${fmt(a.mean + b.mean)} (sum of the two means)`);
console.log(`evaluate only, CPU time per evaluation: ${fmt(cpuPerEval)}`);
console.log(`evaluate only, best mean of a batch of ${BATCH}: ${fmt(bestBatch)}`);
const c = stats(t3);
console.log(
  `three-crane lift (caution-three-cranes.json, ${N3} runs): mean ${fmt(c.mean)}  p99 ${fmt(c.p99)}  CPU ${fmt(cpu3PerEval)}`,
);
console.log(
  `machine: ${cpus().length} CPUs, load average ${loadavg()[0].toFixed(2)} (other processes inflate p99)`,
);
const busy = loadavg()[0] > cpus().length;
console.log(
  `target: under 200 µs mean per single-crane evaluation — ${b.mean < 0.2 ? 'met' : 'NOT met'} (evaluate only, mean wall clock ${fmt(b.mean)}; parsing ${fmt(a.mean)} more at the boundary)${
    busy
      ? `; the machine is busy (load above its ${cpus().length} CPUs): best batch mean ${fmt(bestBatch)} ${bestBatch < 0.2 ? 'meets' : 'does not meet'} it`
      : ''
  }`,
);
