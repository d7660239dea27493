// /verify/:code — public, no sign-in. Someone on site scans the code on a stamped return
// and gets one answer first (current and accepted, superseded, or not found), then the
// facts to compare with the paper, and the standing caution.
import { useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { isApiError } from '@/lib/api-client';
import { Wordmark } from '@/components/ui/logo';
import { STANDING_CAUTION } from '@shared/vocabulary/cautions';
import { normaliseCode, useVerification } from '@/features/verify/api/get-verification';
import {
  AnswerBlock,
  answerFor,
  VerificationDetails,
} from '@/features/verify/components/verification-answer';

function CodeForm({ initial }: { initial: string }) {
  const navigate = useNavigate();
  const [text, setText] = useState(initial);
  return (
    <form
      className="flex flex-col gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        const code = normaliseCode(text);
        if (code) navigate(`/verify/${code}`);
      }}
    >
      <label htmlFor="verify-code" className="text-[15px] font-bold">
        Code printed on the stamp
      </label>
      <div className="flex gap-2">
        <input
          id="verify-code"
          value={text}
          onChange={(event) => setText(event.target.value)}
          autoCapitalize="characters"
          autoComplete="off"
          spellCheck={false}
          inputMode="text"
          className="h-12 min-w-0 flex-1 rounded-[3px] border-2 border-ink bg-sheet px-3 font-mono text-[18px] uppercase"
        />
        <button
          type="submit"
          className="h-12 rounded-[3px] border-2 border-verdigris bg-verdigris px-4 text-[17px] font-bold text-white hover:bg-verdigris-deep"
        >
          Check
        </button>
      </div>
    </form>
  );
}

export default function VerifyRoute() {
  const { code: raw = '' } = useParams();
  const code = normaliseCode(raw);
  const verification = useVerification(code);

  let body;
  if (!code) {
    body = (
      <AnswerBlock kind="unknown" headline="Enter the code from the stamp">
        It is printed under the QR code in the stamp block on the first page.
      </AnswerBlock>
    );
  } else if (verification.isPending) {
    body = <AnswerBlock kind="wait" headline="Checking the code…" />;
  } else if (verification.isError) {
    const error = verification.error;
    const status = isApiError(error) ? error.status : 0;
    body =
      status === 404 ? (
        <AnswerBlock kind="unknown" headline="Not found — check the code">
          No stamped return has this code. Compare it letter by letter with the stamp; if it matches, do not
          lift to this plan until the lift coordinator confirms it.
        </AnswerBlock>
      ) : status === 429 ? (
        <AnswerBlock kind="wait" headline="Too many checks — wait a minute">
          This connection has checked many codes in a short time. Try again in a minute.
        </AnswerBlock>
      ) : (
        <AnswerBlock kind="wait" headline="Could not check right now">
          {status === 0
            ? 'The phone could not reach Counterpoise. Check the signal and try again.'
            : 'Counterpoise could not answer. Try again in a minute.'}{' '}
          <button
            type="button"
            onClick={() => verification.refetch()}
            className="underline underline-offset-4"
          >
            Try again
          </button>
        </AnswerBlock>
      );
  } else {
    const answer = answerFor(verification.data);
    body = (
      <>
        <AnswerBlock kind={answer.kind} headline={answer.headline}>
          {answer.line}
        </AnswerBlock>
        <VerificationDetails v={verification.data} code={code} />
      </>
    );
  }

  return (
    <div className="flex min-h-screen flex-col bg-chalk">
      <header className="on-dark flex items-center justify-between gap-3 bg-graphite px-4 py-3 text-chalk">
        <Wordmark />
        <span className="text-[14px] font-bold text-steel">Stamped return check</span>
      </header>
      <main id="main" className="mx-auto flex w-full max-w-[40rem] flex-1 flex-col gap-4 px-4 py-5">
        {body}
        <p className="flex items-start gap-2 border-l-[5px] border-caution-ink bg-caution-tint px-4 py-3 text-[15px] leading-snug text-ink">
          <strong className="shrink-0">Caution.</strong>
          <span>{STANDING_CAUTION}</span>
        </p>
        <details className="border border-rule bg-sheet px-4 py-3" open={!code || verification.isError}>
          <summary className="cursor-pointer text-[16px] font-bold">Check another code</summary>
          <div className="mt-3">
            <CodeForm key={code} initial={code} />
          </div>
        </details>
      </main>
    </div>
  );
}
