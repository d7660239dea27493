// Command line for the calculation engine:
//   npm run check-lift -- <input.json> [--units imperial|metric] [--format json|table] [--policy policy.json]
// Prints the checks (table or JSON). Exit 0 when evaluated, 1 when the lift fails a check,
// 2 for invalid input (zod issues, path: message), 3 for a missing or unparseable file or bad arguments.
import { readFileSync } from 'node:fs';
import { checkLift } from '../shared/engineering/evaluate';
import { formatQuantity } from '../shared/engineering/format';
import type { CheckStatus, LiftResult, UnitSystem } from '../shared/engineering/types';

const USAGE =
  'usage: npm run check-lift -- <input.json> [--units imperial|metric] [--format json|table] [--policy policy.json]';

function fail(code: number, msg: string): never {
  process.stderr.write(msg.endsWith('\n') ? msg : msg + '\n');
  process.exit(code);
}

function parseArgs(argv: string[]) {
  let file: string | undefined;
  let units: UnitSystem = 'metric';
  let format: 'json' | 'table' = 'table';
  let policy: string | undefined;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const val = () => {
      const v = argv[++i];
      if (v === undefined) fail(3, `${a} needs a value\n${USAGE}`);
      return v;
    };
    if (a === '--units') {
      const v = val();
      if (v !== 'metric' && v !== 'imperial') fail(3, `--units must be metric or imperial\n${USAGE}`);
      units = v;
    } else if (a === '--format') {
      const v = val();
      if (v !== 'json' && v !== 'table') fail(3, `--format must be json or table\n${USAGE}`);
      format = v;
    } else if (a === '--policy') policy = val();
    else if (a === '--help' || a === '-h') {
      process.stdout.write(USAGE + '\n');
      process.exit(0);
    } else if (a.startsWith('--')) fail(3, `unknown option ${a}\n${USAGE}`);
    else if (!file) file = a;
    else fail(3, `only one input file expected\n${USAGE}`);
  }
  if (!file) fail(3, `no input file given\n${USAGE}`);
  return { file, units, format, policy };
}

function readJson(path: string, what: string): unknown {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    fail(3, `cannot read ${what} ${path}: ${code === 'ENOENT' ? 'file not found' : (e as Error).message}`);
  }
  try {
    return JSON.parse(text);
  } catch (e) {
    fail(3, `${what} ${path} is not valid JSON: ${(e as Error).message}`);
  }
}

const MARK: Record<CheckStatus, string> = {
  pass: 'pass',
  caution: 'CAUTION',
  fail: 'FAIL',
  not_applicable: 'n/a',
};

function pad(s: string, n: number) {
  return s.length >= n ? s : s + ' '.repeat(n - s.length);
}

function table(r: LiftResult, units: UnitSystem): string {
  const rows: string[][] = [['check', 'value', 'limit', 'status', 'source']];
  for (const c of r.checks) {
    for (const it of c.items) {
      rows.push([
        `${c.label}: ${it.label}`,
        formatQuantity(it.value, it.unit, units),
        it.limit === null
          ? ''
          : `${it.limitType === 'min' ? '≥ ' : '≤ '}${formatQuantity(it.limit, it.unit, units)}`,
        MARK[it.status],
        it.source.text,
      ]);
    }
  }
  const w = [0, 0, 0, 0];
  for (const row of rows) for (let i = 0; i < 4; i++) w[i] = Math.max(w[i], row[i].length);
  const lines = rows.map((row) => row.map((cell, i) => (i < 4 ? pad(cell, w[i]) : cell)).join('  '));
  lines.splice(1, 0, w.map((n) => '-'.repeat(n)).join('  ') + '  ------');
  let out = `Overall: ${MARK[r.overallStatus]}\n\n${lines.join('\n')}\n`;
  out += '\nFormulas:\n';
  for (const c of r.checks)
    for (const it of c.items) if (it.formulaText) out += `  [${it.id}] ${it.formulaText}\n`;
  out += '\nDiscrepancies (stated vs recomputed):\n';
  out += r.discrepancies.length
    ? r.discrepancies.map((d) => `  ${d.status === 'discrepancy' ? '!!' : 'ok'} ${d.message}`).join('\n') +
      '\n'
    : '  none stated\n';
  out += `\nCritical lift: ${r.critical.isCritical ? 'yes' : 'no'}\n`;
  for (const t of r.critical.triggers) out += `  - ${t.reason} (${t.source.text})\n`;
  if (r.fixes.length) {
    out += '\nWhat would fix it:\n';
    for (const f of r.fixes) out += `  - ${f.text}\n`;
  }
  out += '\nCaution:\n' + r.cautions.map((c) => `  ${c}`).join('\n') + '\n';
  return out;
}

const args = parseArgs(process.argv.slice(2));
const raw = readJson(args.file, 'input file');
const policy = args.policy ? readJson(args.policy, 'policy file') : undefined;
const outcome = checkLift(raw, policy, { units: args.units });
if (!outcome.ok) {
  fail(
    2,
    `invalid input (${outcome.issues.length} issue${outcome.issues.length === 1 ? '' : 's'}):\n` +
      outcome.issues.map((i) => `  ${i.path}: ${i.message}`).join('\n'),
  );
}
process.stdout.write(
  args.format === 'json' ? JSON.stringify(outcome.result, null, 2) + '\n' : table(outcome.result, args.units),
);
process.exit(outcome.result.overallStatus === 'fail' ? 1 : 0);
