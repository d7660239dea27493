// What changed between the previous revision and this one: the inputs side by side, every
// check's status and value in each, the documents kept, replaced, added or removed, and the
// findings carried over with their answers.
import { formatQuantity } from '@shared/engineering/format';
import type { UnitKind, UnitSystem } from '@shared/engineering/types';
import type { CheckStatus } from '@shared/schemas/packages';
import type { Finding, RevisionCompare } from '@shared/schemas/reviews';
import { CheckStatusMark } from '@/components/ui/check-status-mark';
import { PageLoading } from '@/components/ui/page-loading';
import { isApiError } from '@/lib/api-client';
import { useCompare } from '../api/get-compare';
import { FindingEntry } from '@/components/findings/finding-entry';
import { readableField } from '@shared/catalogue/readable-issue';

const STATUSES = ['pass', 'caution', 'fail', 'not_applicable'];

function inputText(value: unknown): string {
  if (value === undefined) return 'not given';
  if (value === null || value === '') return '—';
  if (typeof value === 'object' && value && 'value' in value && 'unit' in value) {
    const q = value as { value: unknown; unit: unknown };
    return `${String(q.value)} ${String(q.unit)}`;
  }
  if (Array.isArray(value)) return value.length === 0 ? 'none' : JSON.stringify(value);
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return String(value);
}

/** The form's own label for an input path ("load.weight" → "Load weight"), else the path made readable. */
function pathText(path: string): string {
  const dotted = path.replace(/\[(\d+)\]/g, '.$1');
  const label = readableField(dotted);
  if (label !== dotted) return label;
  return path
    .replace(/\[(\d+)\]/g, (_m, i: string) => ` ${Number(i) + 1}`)
    .split('.')
    .join(' › ');
}

function Side({
  side,
  unit,
  system,
}: {
  side: { status: string; value: number | null } | null;
  unit: string;
  system: UnitSystem;
}) {
  if (!side) return <span className="text-ink-soft">not checked</span>;
  return (
    <span className="flex flex-col items-start gap-0.5">
      {STATUSES.includes(side.status) && <CheckStatusMark status={side.status as CheckStatus} />}
      <span className="tabular">{formatQuantity(side.value, unit as UnitKind, system)}</span>
    </span>
  );
}

const CHANGE_WORDS: Record<RevisionCompare['documents'][number]['change'], string> = {
  unchanged: 'Same file',
  replaced: 'Replaced',
  added: 'Added',
  removed: 'Removed',
};

function DocumentChanges({
  documents,
  from,
  to,
}: {
  documents: RevisionCompare['documents'];
  from: number;
  to: number;
}) {
  const changed = documents.filter((d) => d.change !== 'unchanged').length;
  const side = (d: RevisionCompare['documents'][number]['from']) =>
    d ? `${d.name} · ${d.pages} ${d.pages === 1 ? 'page' : 'pages'}` : '—';
  return (
    <section aria-labelledby="diff-documents">
      <h3 id="diff-documents" className="border-b border-rule bg-sheet-alt px-3 py-1.5 text-[13px] font-bold">
        Documents{' '}
        <span className="font-normal text-ink-soft">
          · {changed} changed, {documents.length - changed} the same
        </span>
      </h3>
      <table className="w-full border-collapse text-[12.5px]">
        <SideBySideHead first="Document" from={from} to={to} />
        <tbody>
          {documents.map((d, i) => (
            <tr key={i} className="border-b border-rule align-top">
              <th scope="row" className="px-2 py-1 text-left">
                <span className="block font-bold">
                  {d.kind === 'lift_plan' ? 'Lift plan' : 'Supporting PDF'}
                </span>
                <span className={d.change === 'unchanged' ? 'text-ink-soft' : 'font-bold text-engineer-ink'}>
                  {CHANGE_WORDS[d.change]}
                </span>
              </th>
              <td className="break-all px-2 py-1 text-ink-soft">{side(d.from)}</td>
              <td className={`break-all px-2 py-1 ${d.change === 'unchanged' ? '' : 'font-bold'}`}>
                {side(d.to)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}

const th = 'px-2 py-1 text-left text-[11.5px] uppercase tracking-[0.05em] text-ink-soft';

/** The head of a side-by-side table: what each row is, then the two revisions. */
function SideBySideHead({ first, from, to }: { first: string; from: number; to: number }) {
  return (
    <thead>
      <tr className="border-b border-rule-strong">
        {[first, `Revision ${from}`, `Revision ${to}`].map((label) => (
          <th key={label} scope="col" className={th}>
            {label}
          </th>
        ))}
      </tr>
    </thead>
  );
}

function ChangedMark() {
  return (
    <span className="inline-flex items-center gap-1 text-[12px] font-bold text-engineer-ink">
      <svg
        className="size-3"
        viewBox="0 0 12 12"
        aria-hidden="true"
        fill="none"
        stroke="currentColor"
        strokeWidth="1.5"
      >
        <path d="M1.5 4 H9.5 L7.5 2 M10.5 8 H2.5 L4.5 10" />
      </svg>
      Changed
    </span>
  );
}

export function RevisionDifference({
  packageId,
  revision,
  system,
  findings,
}: {
  packageId: string;
  revision: number;
  system: UnitSystem;
  findings: Finding[];
}) {
  const from = revision - 1;
  const compare = useCompare(packageId, from, revision, revision > 1);
  const carried = findings.filter((f) => f.revisionNumber < revision);
  if (compare.isPending) return <PageLoading label={`Comparing revisions ${from} and ${revision}`} />;
  if (compare.isError)
    return (
      <p role="alert" className="px-3 py-3 text-[13px] font-bold text-fail-ink">
        {isApiError(compare.error) ? compare.error.message : 'The revisions could not be compared.'}
      </p>
    );
  const { inputs, checks, documents } = compare.data;
  const changedChecks = checks.filter((c) => c.changed);
  const sameChecks = checks.filter((c) => !c.changed);
  return (
    <div className="flex flex-col">
      <DocumentChanges documents={documents} from={from} to={revision} />
      <section aria-labelledby="diff-inputs">
        <h3 id="diff-inputs" className="border-b border-rule bg-sheet-alt px-3 py-1.5 text-[13px] font-bold">
          Inputs changed <span className="font-normal text-ink-soft">· {inputs.length}</span>
        </h3>
        {inputs.length === 0 ? (
          <p className="px-3 py-2 text-[13px] text-ink-soft">
            No input changed between revision {from} and {revision}.
          </p>
        ) : (
          <table className="w-full border-collapse text-[12.5px]">
            <SideBySideHead first="Input" from={from} to={revision} />
            <tbody>
              {inputs.map((row) => (
                <tr key={row.path} className="border-b border-rule align-top">
                  <th scope="row" className="px-2 py-1 text-left font-bold">
                    {pathText(row.path)}
                  </th>
                  <td className="px-2 py-1 tabular text-ink-soft line-through decoration-ink-soft/50">
                    {inputText(row.from)}
                  </td>
                  <td className="px-2 py-1 font-bold tabular">{inputText(row.to)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      <section aria-labelledby="diff-checks">
        <h3 id="diff-checks" className="border-y border-rule bg-sheet-alt px-3 py-1.5 text-[13px] font-bold">
          Checks{' '}
          <span className="font-normal text-ink-soft">
            · {changedChecks.length} changed, {sameChecks.length} the same
          </span>
        </h3>
        <table className="w-full border-collapse text-[12.5px]">
          <SideBySideHead first="Check" from={from} to={revision} />
          <tbody>
            {[...changedChecks, ...sameChecks].map((c) => (
              <tr
                key={c.id}
                className={`border-b border-rule align-top ${c.changed ? '' : 'text-ink-soft'}`}
                data-testid="diff-check"
              >
                <th scope="row" className="px-2 py-1 text-left">
                  <span className="block font-bold">{c.label}</span>
                  {c.changed && <ChangedMark />}
                </th>
                <td className="px-2 py-1">
                  <Side side={c.from} unit={c.unit} system={system} />
                </td>
                <td className="px-2 py-1">
                  <Side side={c.to} unit={c.unit} system={system} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      <section aria-labelledby="diff-findings">
        <h3
          id="diff-findings"
          className="border-y border-rule bg-sheet-alt px-3 py-1.5 text-[13px] font-bold"
        >
          Findings carried over <span className="font-normal text-ink-soft">· {carried.length}</span>
        </h3>
        {carried.length === 0 ? (
          <p className="px-3 py-2 text-[13px] text-ink-soft">No findings were raised on earlier revisions.</p>
        ) : (
          <ul>
            {carried.map((f) => (
              <li key={f.id} className="border-b border-rule px-3 py-2 last:border-b-0">
                <FindingEntry
                  finding={f}
                  answerLabel="Contractor’s answer"
                  noAnswer="No answer from the contractor."
                />
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
