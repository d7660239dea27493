// Benchmark of building a stamped return: a two-page plan with a markup, the stamp block and the
// calculation sheet for each example lift, N builds in all; prints the mean CPU and wall time per
// build. Used to compare layouts of the calculation sheet (see DEVELOPERS.md).
//   npm run bench:return [-- --n 40]
import { readdirSync, readFileSync } from 'node:fs';
import { PDFDocument, StandardFonts } from 'pdf-lib';
import { checkLift } from '../shared/engineering';
import { buildStampedReturn, type StampInput } from '../server/modules/returns/stamp-pdf';

const nArg = process.argv.indexOf('--n');
const N = nArg > 0 ? Number(process.argv[nArg + 1]) : 40;
const dir = new URL('../shared/engineering/examples/', import.meta.url);

async function plan(): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (let i = 0; i < 2; i++)
    doc.addPage([595.28, 841.89]).drawText(`Plan page ${i + 1}`, { x: 40, y: 800, font });
  return doc.save();
}

const bytes = await plan();
const inputs: StampInput[] = readdirSync(dir)
  .filter((n) => n.endsWith('.json'))
  .sort()
  .map((n) => {
    const raw = JSON.parse(readFileSync(new URL(n, dir), 'utf8')) as Record<string, unknown>;
    const outcome = checkLift(raw, null, { units: 'metric' });
    return {
      documents: [{ fileId: 'plan', name: 'plan.pdf', bytes }],
      markups: [
        {
          fileId: 'plan',
          pageNumber: 1,
          kind: 'rectangle',
          geometry: { x: 100, y: 400, width: 120, height: 80 },
          colour: 'rust',
          text: 'Mat size?',
          number: null,
        },
      ],
      stamp: {
        decision: 'accepted_as_noted',
        reference: 'BENCH-0001',
        title: n,
        revision: 1,
        site: 'Bench site',
        contractor: 'Bench contractor',
        engineer: 'A. Engineer',
        reviewer: 'R. Reviewer',
        decidedAt: '2027-03-14T10:00:00Z',
        issuedAt: '2027-03-15T09:00:00Z',
        timeZone: 'Europe/London',
        conditions: 'Fence the exclusion zone before the lift.',
        verificationCode: 'BENCH-CODE',
        verificationUrl: 'http://127.0.0.1/verify/BENCH-CODE',
      },
      calculation: {
        inputs: raw,
        result: outcome.ok ? outcome.result : null,
        units: 'metric',
        findings: [
          {
            text: 'Sling angle',
            severity: 'major',
            state: 'open',
            response: null,
            checkId: 'rigging',
            pageNumber: 1,
          },
        ],
        acceptedFigures: [],
      },
    };
  });

// Warm-up: font subsetting and JIT.
for (const input of inputs.slice(0, 3)) await buildStampedReturn(input);

const cpu0 = process.cpuUsage();
const t0 = performance.now();
for (let i = 0; i < N; i++) await buildStampedReturn(inputs[i % inputs.length]);
const wall = (performance.now() - t0) / N;
const used = process.cpuUsage(cpu0);
const cpu = (used.user + used.system) / 1000 / N;
console.log(`${N} stamped returns over ${inputs.length} example lifts`);
console.log(`mean CPU ${cpu.toFixed(1)} ms per return, mean wall ${wall.toFixed(1)} ms`);
