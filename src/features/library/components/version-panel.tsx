// One version read in full: the configuration's details, notes, the manufacturer's document,
// the chart grid and its pictures, the files to export, and the owner desk's verification.
import { useState } from 'react';
import { WORKING_AREA_LABELS, type VersionDetail } from '@shared/schemas/library';
import { TO_SI } from '@shared/engineering/units';
import { formatDate } from '@/lib/format';
import { Button, buttonClasses } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panel-message';
import { isApiError } from '@/lib/api-client';
import { chartFileUrl, documentUrl, useAttachDocument, useVerifyVersion } from '../api/versions';
import { ChartGridTable } from './chart-grid-table';
import { ChartPlots, type PackageOnChart } from './chart-plot';

const qty = (x?: { value: number; unit: string }) => (x ? `${x.value} ${x.unit}` : '—');
const si = (x?: { value: number; unit: string }) =>
  x ? x.value * TO_SI[x.unit as keyof typeof TO_SI] : undefined;

/** The owner desk engineer's "verified against the manufacturer's document" form for one version. */
export function VerifyForm({
  versionId,
  packageId,
  label = 'Verify the chart',
}: {
  versionId: string;
  packageId?: string;
  label?: string;
}) {
  const verify = useVerifyVersion();
  const [note, setNote] = useState('');
  return (
    <form
      className="flex flex-col gap-2 border border-rule bg-sheet p-3"
      aria-label={label}
      onSubmit={(e) => {
        e.preventDefault();
        verify.mutate({ id: versionId, note, packageId });
      }}
    >
      <label className="flex flex-col gap-1 text-[13px] font-bold">
        Note (what you compared, e.g. “every cell against page 14, edition 2026-1”)
        <textarea
          className="rounded-[3px] border border-rule-strong p-2 text-sm"
          rows={2}
          value={note}
          onChange={(e) => setNote(e.target.value)}
        />
      </label>
      <div>
        <Button
          type="submit"
          variant="primary"
          disabled={!note.trim() || verify.isPending}
          // wraps in the review workspace's narrow column
          className="h-auto! min-h-9 py-1.5 text-left whitespace-normal!"
        >
          Mark the chart verified against the manufacturer's document
        </Button>
      </div>
      {verify.isError && (
        <ErrorPanel
          title="Not recorded"
          message={isApiError(verify.error) ? verify.error.message : 'Try again.'}
        />
      )}
    </form>
  );
}

export function VerificationBlock({
  version,
  canVerify,
  packageId,
  place = 'form',
}: {
  version: VersionDetail;
  canVerify: boolean;
  packageId?: string;
  /** Above the chart a line says where to verify; the form itself sits below the chart, once read */
  place?: 'notice' | 'form';
}) {
  const v = version.verifications[0];
  if (v && place === 'form') return null;
  if (v)
    return (
      <p
        className="border border-l-4 border-pass-ink bg-pass-tint px-3 py-2 text-sm"
        data-testid="chart-verified"
      >
        <strong>✓ Chart verified against the manufacturer's document</strong> by {v.engineer.name} on{' '}
        {formatDate(v.at)}: {v.note}
      </p>
    );
  if (!canVerify) return null;
  if (place === 'notice')
    return (
      <p className="border border-l-4 border-caution-ink bg-caution-tint px-3 py-2 text-sm" role="note">
        <strong>Not yet verified by your desk.</strong> Compare the chart below with the manufacturer's
        document, then mark it verified under the chart.
      </p>
    );
  return <VerifyForm versionId={version.id} packageId={packageId} />;
}

function AttachDocument({ version }: { version: VersionDetail }) {
  const attach = useAttachDocument();
  const [file, setFile] = useState<File | null>(null);
  return (
    <span className="mt-1 flex flex-wrap items-center gap-2">
      <label className="text-[13px]">
        <span className="sr-only">Manufacturer's document (PDF)</span>
        <input
          type="file"
          accept="application/pdf,.pdf"
          onChange={(e) => setFile(e.target.files?.[0] ?? null)}
        />
      </label>
      <Button
        size="sm"
        disabled={!file || attach.isPending}
        onClick={() => file && attach.mutate({ id: version.id, file })}
      >
        {attach.isPending ? 'Attaching…' : 'Attach the PDF'}
      </Button>
      {attach.isError && (
        <span role="alert" className="text-[13px] font-bold text-failed-ink">
          {isApiError(attach.error) ? attach.error.message : 'Not attached. Try again.'}
        </span>
      )}
    </span>
  );
}

export function VersionPanel({
  version,
  fromPackage,
  canVerify = false,
  canAttach = false,
  packageId,
}: {
  version: VersionDetail;
  /** Opened from a package: its cranes that use this version, drawn on the pictures */
  fromPackage?: PackageOnChart;
  canVerify?: boolean;
  /** The contractor may attach the PDF while the version has none and no package uses it */
  canAttach?: boolean;
  packageId?: string;
}) {
  const d = version.details;
  const n = version.notes;
  return (
    <div className="flex flex-col gap-3">
      <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 border border-rule bg-sheet p-3 text-[13.5px]">
        <dt className="font-bold">Working area</dt>
        <dd>{WORKING_AREA_LABELS[d.workingArea]}</dd>
        <dt className="font-bold">Boom length</dt>
        <dd>
          {d.boomLengthMin || d.boomLengthMax
            ? `${qty(d.boomLengthMin)} to ${qty(d.boomLengthMax)}`
            : 'as listed in the chart'}
        </dd>
        {d.outriggerSpread && (
          <>
            <dt className="font-bold">Outrigger spread</dt>
            <dd>{d.outriggerSpread}</dd>
          </>
        )}
        <dt className="font-bold">Jib</dt>
        <dd>{d.jib || 'none'}</dd>
        <dt className="font-bold">Counterweight</dt>
        <dd>
          {d.counterweight
            ? `${d.counterweight.arrangement}: ${qty(d.counterweight.weight)}, CG ${qty(d.counterweight.cgBehindRotation)} behind rotation`
            : '—'}
        </dd>
        <dt className="font-bold">Hook block</dt>
        <dd>{d.hookBlock ? `${d.hookBlock.name ?? ''} ${qty(d.hookBlock.weight)}` : '—'}</dd>
        <dt className="font-bold">Chart notes</dt>
        <dd>
          {n.blockIncluded ? 'Capacities include the hook block' : 'Hook block not included (deducted)'} ·{' '}
          {n.interpolationAllowed ? 'interpolation allowed' : 'no interpolation'}
          {n.deductions.length > 0 &&
            ` · deductions: ${n.deductions.map((x) => `${x.name} ${qty(x.weight)}`).join(', ')}`}
          {n.text && <span className="block">{n.text}</span>}
        </dd>
        <dt className="font-bold">Manufacturer's document</dt>
        <dd>
          {version.document.title}
          {version.document.edition && `, edition ${version.document.edition}`}
          {version.document.page && `, page ${version.document.page}`}
          {version.document.file ? (
            <>
              {' · '}
              <a
                href={documentUrl(version.id)}
                className="text-verdigris underline underline-offset-2"
                target="_blank"
                rel="noreferrer"
              >
                open the PDF ({version.document.file.pages} page{version.document.file.pages === 1 ? '' : 's'}
                )
              </a>
            </>
          ) : (
            <span className="text-ink-soft"> · no PDF attached</span>
          )}
          {canAttach && !version.document.file && version.usedBy === 0 && (
            <AttachDocument version={version} />
          )}
        </dd>
      </dl>
      <VerificationBlock version={version} canVerify={canVerify} packageId={packageId} place="notice" />
      <ChartPlots
        grid={version.chart}
        pivotOffset={si(version.crane.fixed.pivotOffset)}
        pivotHeight={si(version.crane.fixed.pivotHeight)}
        fromPackage={fromPackage}
      />
      <ChartGridTable grid={version.chart} caption={`Load chart, version ${version.number}`} />
      <VerificationBlock version={version} canVerify={canVerify} packageId={packageId} />
      <div className="flex gap-2">
        <a className={buttonClasses('secondary', 'sm')} href={chartFileUrl(version.id, 'csv')}>
          Export CSV
        </a>
        <a className={buttonClasses('secondary', 'sm')} href={chartFileUrl(version.id, 'xlsx')}>
          Export .xlsx
        </a>
      </div>
      <p className="text-[12.5px] text-ink-soft">
        The library holds what the contractor entered from the manufacturer's chart; it does not replace the
        manufacturer's load chart and instructions.
      </p>
    </div>
  );
}
