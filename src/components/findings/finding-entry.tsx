// One finding as both sides read it: severity and state, where it points, the text, who
// raised it and when, and the contractor's answer. Built from spans only, so the workspace
// can make the whole entry one button that takes the pages to the finding.
import type { ReactNode } from 'react';
import type { Finding } from '@shared/schemas/reviews';
import { formatDateTime } from '@/lib/format';
import { FindingStateMark, SeverityMark, type FindingReader } from './finding-marks';

export function FindingEntry({
  finding,
  reader = 'desk',
  where,
  answerLabel,
  noAnswer,
}: {
  finding: Finding;
  reader?: FindingReader;
  /** What the finding is tied to (a markup, a page link, a check), beside the marks. */
  where?: ReactNode;
  answerLabel: string;
  /** Said when there is no answer yet; nothing is shown when left out. */
  noAnswer?: string;
}) {
  return (
    <>
      <span className="flex flex-wrap items-center gap-1.5 text-[12px]">
        <SeverityMark severity={finding.severity} />
        <FindingStateMark state={finding.state} reader={reader} />
        {where && <span className="text-ink-soft">{where}</span>}
      </span>
      <span className="mt-1 block whitespace-pre-wrap text-[13.5px] leading-snug">{finding.text}</span>
      <span className="mt-0.5 block text-[12px] text-ink-soft">
        Revision {finding.revisionNumber} · {finding.createdBy} · {formatDateTime(finding.createdAt)}
      </span>
      {finding.response !== null && finding.response !== '' ? (
        <span className="mt-1 block border-l-[3px] border-ready-edge bg-ready-tint px-2.5 py-1.5 text-[13px]">
          <span className="block text-[11.5px] font-bold uppercase tracking-[0.06em] text-ink-soft">
            {answerLabel}
          </span>
          <span className="whitespace-pre-wrap">{finding.response}</span>
        </span>
      ) : (
        noAnswer && <span className="mt-1 block text-[12.5px] text-ink-soft">{noAnswer}</span>
      )}
    </>
  );
}
