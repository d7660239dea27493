// The title strip at the top of a page, with an optional line of context and actions.
import type { ReactNode } from 'react';

export function PageHeader({
  title,
  context,
  actions,
}: {
  title: string;
  context?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <header className="mb-4 flex flex-wrap items-end justify-between gap-3 border-b-2 border-ink pb-2.5">
      <div>
        <h1 className="text-[22px] font-black leading-tight tracking-[-0.01em]">{title}</h1>
        {context && <p className="mt-0.5 text-sm text-ink-soft">{context}</p>}
      </div>
      {actions && <div className="flex items-center gap-2">{actions}</div>}
    </header>
  );
}
