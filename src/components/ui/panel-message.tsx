// Empty and error states: say what happened or what would fill the space, and what to do.
import type { ReactNode } from 'react';

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="flex flex-col items-start gap-1.5 border border-dashed border-rule-strong bg-sheet px-6 py-8">
      <h2 className="text-base font-bold">{title}</h2>
      {children && <div className="max-w-prose text-sm text-ink-soft">{children}</div>}
    </div>
  );
}

export function ErrorPanel({
  title,
  message,
  action,
}: {
  title: string;
  message: string;
  action?: ReactNode;
}) {
  return (
    <div
      role="alert"
      className="flex items-start gap-3 border border-failed-edge border-l-4 bg-failed-tint px-4 py-3"
    >
      <div className="flex-1">
        <h2 className="text-sm font-bold text-failed-ink">{title}</h2>
        <p className="text-sm text-ink">{message}</p>
      </div>
      {action}
    </div>
  );
}
