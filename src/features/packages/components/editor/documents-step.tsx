// The documents of a draft: the lift plan PDF (required, one; a new one replaces it) and
// supporting PDFs (drawings, chart pages, certificates). Each upload shows the bytes sent;
// a file the server refuses keeps its row with the server's reason beside it. A stored file
// that carries comments, stamps, form fields, scripts or attachments says so under its row:
// the stamped return leaves them out, so the contractor flattens what is meant to stay.
import { useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { FileKind, FileSummary, PackageDetail } from '@shared/schemas/packages';
import { isApiError } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';
import { formatDateTime } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { deleteFile, fileUrl, uploadFile } from '../../api/files';
import { getPackage } from '../../api/get-package';

type Upload = {
  key: number;
  kind: FileKind;
  name: string;
  size: number;
  loaded: number;
  state: 'sending' | 'failed';
  error?: string;
};

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(bytes < 10 * 1024 ? 1 : 0)} kB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

function ProgressBar({ loaded, total, label }: { loaded: number; total: number; label: string }) {
  const pct = total > 0 ? Math.min(100, Math.round((loaded / total) * 100)) : 0;
  return (
    <div className="flex items-center gap-2">
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct}
        className="h-2.5 w-48 overflow-hidden rounded-sm border border-rule-strong bg-sheet"
      >
        <div className="h-full bg-verdigris" style={{ width: `${pct}%` }} />
      </div>
      <span className="tabular text-[12.5px] text-ink-soft">
        {formatBytes(loaded)} of {formatBytes(total)} · {pct}%
      </span>
    </div>
  );
}

/** What the stamped return leaves out of this file, in the server's words (shared/vocabulary/pdf-contents.ts). */
function NotCarriedNote({ file }: { file: FileSummary }) {
  if (!file.notCarried) return null;
  return (
    <p
      role="note"
      aria-label={`Left out of the stamped return: ${file.originalName}`}
      className="flex basis-full items-start gap-2 border border-caution-ink/40 bg-caution-tint px-2 py-1.5 text-[12.5px] text-ink"
    >
      <svg
        className="mt-0.5 size-4 shrink-0 text-caution-ink"
        viewBox="0 0 16 16"
        aria-hidden="true"
        fill="none"
        stroke="currentColor"
        strokeWidth="1.6"
      >
        <path d="M8 1.5 L15 14.5 H1 Z" />
        <path d="M8 6 V10 M8 12 V12.5" />
      </svg>
      <span>{file.notCarried}</span>
    </p>
  );
}

export function FileRow({
  packageId,
  file,
  onRemove,
  onReplace,
  removing,
  showNotCarried = false,
}: {
  packageId: string;
  file: FileSummary;
  onRemove?: () => void;
  /** A supporting PDF: a new file takes its place (uploaded first, then this one removed). */
  onReplace?: (list: ArrayLike<File> | null) => void;
  removing?: boolean;
  /** Say under the row what the stamped return leaves out (the upload step). */
  showNotCarried?: boolean;
}) {
  const carried = file.carriedFromRevision;
  return (
    <li className="flex flex-wrap items-center gap-x-4 gap-y-1 border-b border-rule px-3 py-2 last:border-b-0">
      <svg
        className="size-5 shrink-0 text-fail-ink"
        viewBox="0 0 20 20"
        aria-hidden="true"
        fill="none"
        stroke="currentColor"
        strokeWidth="1.4"
      >
        <path d="M5 2 H12 L16 6 V18 H5 Z" />
        <path d="M12 2 V6 H16" />
        <path d="M7.5 12 H13.5 M7.5 14.5 H11.5" />
      </svg>
      <a
        href={fileUrl(packageId, file.id)}
        target="_blank"
        rel="noreferrer"
        className="min-w-0 flex-1 truncate font-bold text-verdigris underline underline-offset-2"
      >
        {file.originalName}
      </a>
      <span className="tabular text-[12.5px] text-ink-soft">
        {file.pages} {file.pages === 1 ? 'page' : 'pages'} · {formatBytes(file.sizeBytes)} ·{' '}
        <abbr title={`SHA-256 ${file.sha256}`} className="font-mono no-underline">
          sha-256 {file.sha256.slice(0, 12)}
        </abbr>{' '}
        · {formatDateTime(file.createdAt)}
      </span>
      {carried !== null && (
        <span className="inline-flex items-center rounded-[3px] border border-rule-strong bg-sheet-alt px-1.5 text-[12px] font-bold text-ink-soft">
          Kept from revision {carried}
        </span>
      )}
      {onReplace && (
        <label className="cursor-pointer">
          <input
            type="file"
            accept="application/pdf,.pdf"
            className="peer sr-only"
            aria-label={`Replace ${file.originalName}`}
            onChange={(event) => {
              onReplace(event.target.files);
              event.target.value = '';
            }}
          />
          <span className="inline-flex h-7 items-center rounded-[3px] px-2 text-[12.5px] font-bold text-verdigris underline underline-offset-2 peer-focus-visible:outline-3 peer-focus-visible:outline-rust">
            Replace…
          </span>
        </label>
      )}
      {onRemove && (
        <Button
          size="sm"
          variant="quiet"
          disabled={removing}
          onClick={onRemove}
          aria-label={`Remove ${file.originalName}`}
        >
          {removing ? 'Removing…' : 'Remove'}
        </Button>
      )}
      {showNotCarried && <NotCarriedNote file={file} />}
    </li>
  );
}

export function DocumentsStep({
  detail,
  onFilesChanged,
  planMissing,
}: {
  detail: PackageDetail;
  onFilesChanged: (fresh: PackageDetail) => void;
  planMissing: boolean;
}) {
  const packageId = detail.package.id;
  const queryClient = useQueryClient();
  const [uploads, setUploads] = useState<Upload[]>([]);
  const [removing, setRemoving] = useState<string | null>(null);
  const [removeError, setRemoveError] = useState<string | null>(null);
  const nextKey = useRef(1);
  const files = detail.current.files;
  const plan = files.find((file) => file.kind === 'lift_plan');
  const supporting = files.filter((file) => file.kind === 'supporting');

  async function refresh() {
    const fresh = await getPackage(packageId);
    queryClient.setQueryData(packageKeys.detail(packageId), fresh);
    onFilesChanged(fresh);
  }

  function start(kind: FileKind, list: ArrayLike<File> | null, replaces?: FileSummary) {
    if (!list) return;
    for (const file of Array.from(list)) {
      const key = nextKey.current++;
      setUploads((current) => [
        ...current.filter((u) => !(kind === 'lift_plan' && u.kind === 'lift_plan' && u.state === 'failed')),
        { key, kind, name: file.name, size: file.size, loaded: 0, state: 'sending' },
      ]);
      uploadFile(packageId, kind, file, ({ loaded, total }) =>
        setUploads((current) =>
          current.map((u) => (u.key === key ? { ...u, loaded, size: total || u.size } : u)),
        ),
      )
        .then(async () => {
          setUploads((current) => current.filter((u) => u.key !== key));
          if (replaces) await deleteFile(packageId, replaces.id).catch(() => undefined);
          await refresh().catch(() => undefined);
        })
        .catch((error: unknown) => {
          setUploads((current) =>
            current.map((u) =>
              u.key === key
                ? {
                    ...u,
                    state: 'failed',
                    error: isApiError(error) ? error.message : 'The upload did not finish. Try again.',
                  }
                : u,
            ),
          );
        });
    }
  }

  async function remove(file: FileSummary) {
    setRemoving(file.id);
    setRemoveError(null);
    try {
      await deleteFile(packageId, file.id);
      await refresh();
    } catch (error) {
      setRemoveError(
        `${file.originalName} could not be removed: ${isApiError(error) ? error.message : 'try again.'}`,
      );
    } finally {
      setRemoving(null);
    }
  }

  const pendingRows = (kind: FileKind) =>
    uploads
      .filter((u) => u.kind === kind)
      .map((u) => (
        <li key={u.key} className="flex flex-col gap-1 border-b border-rule px-3 py-2 last:border-b-0">
          <span className="font-bold">{u.name}</span>
          {u.state === 'sending' ? (
            <ProgressBar loaded={u.loaded} total={u.size} label={`Uploading ${u.name}`} />
          ) : (
            <span role="alert" className="flex items-start gap-2 text-[13px]">
              <span className="font-bold text-fail-ink">Not accepted:</span>
              <span>{u.error}</span>
              <button
                type="button"
                className="ml-auto text-[12.5px] font-bold text-verdigris underline"
                onClick={() => setUploads((current) => current.filter((x) => x.key !== u.key))}
              >
                Dismiss
              </button>
            </span>
          )}
        </li>
      ));

  const carried = files.filter((file) => file.carriedFromRevision !== null);
  return (
    <div className="flex flex-col gap-5">
      {carried.length > 0 && (
        <p className="border-l-4 border-verdigris bg-sheet-alt px-3 py-2 text-[13px]">
          This revision starts with the previous revision’s documents, each marked “Kept from revision …” (the
          revision it was uploaded to). Keep each as it is, replace it with a new file, or remove it: the
          engineer sees which documents changed.
        </p>
      )}
      <section aria-labelledby="lift-plan-title" className="flex flex-col gap-2">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h3 id="lift-plan-title" className="text-[14px] font-bold">
            Lift plan PDF{' '}
            <span className="font-normal text-ink-soft">(required, one file; a new one replaces it)</span>
          </h3>
          <label className="cursor-pointer">
            <input
              type="file"
              accept="application/pdf,.pdf"
              className="peer sr-only"
              aria-label="Choose the lift plan PDF"
              onChange={(event) => {
                start('lift_plan', event.target.files);
                event.target.value = '';
              }}
            />
            <span className="inline-flex h-8 items-center rounded-[3px] border border-verdigris bg-verdigris px-3 text-[13px] font-bold text-white peer-focus-visible:outline-3 peer-focus-visible:outline-rust">
              {plan ? 'Replace the lift plan…' : 'Choose the lift plan…'}
            </span>
          </label>
        </div>
        <ul className="border border-rule bg-sheet">
          {plan && (
            <FileRow
              packageId={packageId}
              file={plan}
              onRemove={() => remove(plan)}
              removing={removing === plan.id}
              showNotCarried
            />
          )}
          {pendingRows('lift_plan')}
          {!plan && uploads.every((u) => u.kind !== 'lift_plan') && (
            <li
              className={`px-3 py-3 text-[13px] ${planMissing ? 'font-bold text-fail-ink' : 'text-ink-soft'}`}
            >
              {planMissing
                ? 'The lift plan PDF is missing: a package cannot be submitted without it.'
                : 'No lift plan yet. Choose the signed lift plan as one PDF.'}
            </li>
          )}
        </ul>
      </section>

      <section aria-labelledby="supporting-title" className="flex flex-col gap-2">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h3 id="supporting-title" className="text-[14px] font-bold">
            Supporting PDFs{' '}
            <span className="font-normal text-ink-soft">(drawings, chart pages, certificates)</span>
          </h3>
          <label className="cursor-pointer">
            <input
              type="file"
              accept="application/pdf,.pdf"
              multiple
              className="peer sr-only"
              aria-label="Choose supporting PDFs"
              onChange={(event) => {
                start('supporting', event.target.files);
                event.target.value = '';
              }}
            />
            <span className="inline-flex h-8 items-center rounded-[3px] border border-rule-strong bg-sheet px-3 text-[13px] font-bold text-ink peer-focus-visible:outline-3 peer-focus-visible:outline-rust">
              Add supporting PDFs…
            </span>
          </label>
        </div>
        <ul className="border border-rule bg-sheet">
          {supporting.map((file) => (
            <FileRow
              key={file.id}
              packageId={packageId}
              file={file}
              onRemove={() => remove(file)}
              onReplace={(list) => start('supporting', list?.length ? [list[0]] : null, file)}
              removing={removing === file.id}
              showNotCarried
            />
          ))}
          {pendingRows('supporting')}
          {supporting.length === 0 && uploads.every((u) => u.kind !== 'supporting') && (
            <li className="px-3 py-3 text-[13px] text-ink-soft">
              No supporting documents. They are optional.
            </li>
          )}
        </ul>
      </section>
      {removeError && (
        <p role="alert" className="text-[13px] font-bold text-fail-ink">
          {removeError}
        </p>
      )}
      <p className="text-[12.5px] text-ink-soft">
        PDF files only, checked by their content: not encrypted, within the desk’s size and page limits. The
        server names the rule and the limit if a file is refused. The stamped return carries each page’s
        printed content only: comments, stamps, form fields, links, scripts and attached files are left out,
        so flatten anything meant to stay before uploading.
      </p>
    </div>
  );
}
