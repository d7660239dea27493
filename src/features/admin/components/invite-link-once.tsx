// The invitation link, shown once to the admin who sent it (for a person whose mail does not
// arrive). It is not stored readable anywhere: closing this notice is the last time it is seen.
import { useState } from 'react';
import { Button } from '@/components/ui/button';

export function InviteLinkOnce({ link }: { link: string }) {
  const [copied, setCopied] = useState(false);
  return (
    <span className="mt-1.5 flex flex-col gap-1 text-left text-ink">
      <span className="text-[12.5px]">
        The link, shown only now (pass it on yourself if the e-mail does not arrive):
      </span>
      <span className="flex items-center gap-1.5">
        <input
          readOnly
          aria-label="Invitation link"
          value={link}
          onFocus={(e) => e.currentTarget.select()}
          className="h-7 min-w-0 flex-1 rounded-[3px] border border-rule-strong bg-sheet px-1.5 font-mono text-[12px]"
        />
        <Button
          size="sm"
          onClick={() => {
            void navigator.clipboard?.writeText(link).then(() => setCopied(true));
          }}
        >
          {copied ? 'Copied' : 'Copy'}
        </Button>
      </span>
    </span>
  );
}
