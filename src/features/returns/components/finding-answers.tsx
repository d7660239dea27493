// The findings the engineer of record raised, each with its severity, page and state,
// and the contractor's answer to it. Closed findings are settled and take no answer.
import { useState } from 'react';
import type { Finding } from '@shared/schemas/reviews';
import { isApiError } from '@/lib/api-client';
import { plural } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/page-loading';
import { FindingEntry } from '@/components/findings/finding-entry';
import { useAnswerFinding } from '@/lib/findings-client';

const SEVERITY_ORDER = { blocking: 0, major: 1, minor: 2, note: 3 } as const;

function AnswerForm({ packageId, finding }: { packageId: string; finding: Finding }) {
  const [editing, setEditing] = useState(finding.response === null);
  const [text, setText] = useState(finding.response ?? '');
  const answer = useAnswerFinding(packageId);
  const id = `answer-${finding.id}`;

  if (!editing) {
    return (
      <Button size="sm" variant="quiet" className="self-start" onClick={() => setEditing(true)}>
        Change the answer
      </Button>
    );
  }
  return (
    <form
      className="flex flex-col gap-1.5"
      onSubmit={(event) => {
        event.preventDefault();
        const response = text.trim();
        if (!response) return;
        answer.mutate({ findingId: finding.id, response }, { onSuccess: () => setEditing(false) });
      }}
    >
      <label htmlFor={id} className="text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft">
        Your answer
      </label>
      <textarea
        id={id}
        value={text}
        maxLength={4000}
        rows={2}
        onChange={(event) => setText(event.target.value)}
        placeholder="What you changed in the lift plan, or why the figure stands"
        className="w-full max-w-[48rem] rounded-[3px] border border-rule-strong bg-sheet px-2 py-1.5 text-[13.5px]"
      />
      <div className="flex items-center gap-2">
        <Button type="submit" size="sm" variant="primary" disabled={!text.trim() || answer.isPending}>
          {answer.isPending ? (
            <>
              <Spinner className="size-3.5" /> Sending…
            </>
          ) : (
            'Send answer'
          )}
        </Button>
        {finding.response !== null && (
          <Button size="sm" variant="quiet" onClick={() => setEditing(false)}>
            Cancel
          </Button>
        )}
      </div>
      {answer.isError && (
        <p role="alert" className="text-[13px] font-bold text-fail-ink">
          {isApiError(answer.error) && answer.error.code === 'finding_closed'
            ? 'The engineer has closed this finding in the meantime; it needs no answer now.'
            : isApiError(answer.error)
              ? answer.error.message
              : 'The answer could not be sent. Try again.'}
        </p>
      )}
    </form>
  );
}

export function FindingAnswers({
  packageId,
  findings,
  canAnswer,
  stampedReturnUrl,
}: {
  packageId: string;
  findings: Finding[];
  canAnswer: boolean;
  /** The stamped PDF, where the markups the findings point at are drawn. */
  stampedReturnUrl?: string;
}) {
  const sorted = [...findings].sort(
    (a, b) =>
      b.revisionNumber - a.revisionNumber ||
      SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity] ||
      a.createdAt.localeCompare(b.createdAt),
  );
  const waiting = findings.filter((f) => f.state === 'open').length;

  if (findings.length === 0) {
    return (
      <p className="px-3 py-2.5 text-[13px] text-ink-soft">The engineer of record raised no findings.</p>
    );
  }
  return (
    <>
      <p className="border-b border-rule px-3 py-2 text-[13px]" aria-live="polite">
        {waiting === 0 ? (
          <strong className="text-pass-ink">Every finding has an answer or is closed.</strong>
        ) : (
          <strong className="text-caution-ink">{plural(waiting, 'finding')} waiting for your answer.</strong>
        )}{' '}
        <span className="text-ink-soft">
          {plural(findings.length, 'finding')} in all, most serious first.
        </span>
      </p>
      <ol>
        {sorted.map((finding) => (
          <li
            key={finding.id}
            className="flex flex-col gap-1.5 border-b border-rule px-3 py-2.5 last:border-b-0"
          >
            <div>
              <FindingEntry
                finding={finding}
                reader="contractor"
                answerLabel="Answer"
                where={
                  (finding.pageNumber !== null || finding.checkId) && (
                    <>
                      {finding.pageNumber !== null &&
                        (stampedReturnUrl ? (
                          <a
                            href={`${stampedReturnUrl}#page=${finding.pageNumber}`}
                            target="_blank"
                            rel="noopener"
                            className="font-bold text-verdigris underline underline-offset-2"
                          >
                            page {finding.pageNumber}
                          </a>
                        ) : (
                          `page ${finding.pageNumber}`
                        ))}
                      {finding.pageNumber !== null && finding.checkId && ' · '}
                      {finding.checkId && <>check {finding.checkId}</>}
                    </>
                  )
                }
              />
            </div>
            {canAnswer && finding.state !== 'closed' && (
              <AnswerForm key={finding.response ?? ''} packageId={packageId} finding={finding} />
            )}
          </li>
        ))}
      </ol>
    </>
  );
}
