// The frame for pages outside the signed-in desk (sign-in, not found): the mark, the
// content in the middle, and the standing caution at the foot.
import type { ReactNode } from 'react';
import { Wordmark } from '@/components/ui/logo';
import { CautionNote } from '@/components/ui/caution-note';

export function PlainLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="on-dark bg-graphite px-6 py-3 text-chalk">
        <Wordmark />
      </header>
      <main id="main" className="flex flex-1 items-start justify-center px-6 py-12">
        {children}
      </main>
      <CautionNote className="mx-auto max-w-4xl border-t-0" />
    </div>
  );
}
