// Two panes side by side with a separator between them that a pointer drags and the arrow
// keys move (react-resizable-panels: the ARIA separator with its value). The second pane is
// the one sized: it opens at its default width in pixels and keeps within its limits.
import type { ReactNode } from 'react';
import { Group, Panel, Separator } from 'react-resizable-panels';

export function SplitPane({
  first,
  second,
  secondDefault,
  secondMin,
  secondMax,
  separatorLabel,
  className = '',
}: {
  first: ReactNode;
  second: ReactNode;
  /** Widths in CSS pixels. */
  secondDefault: number;
  secondMin: number;
  secondMax: number;
  separatorLabel: string;
  className?: string;
}) {
  // The panes' own boxes do not scroll: their contents choose what scrolls.
  const pane = { overflow: 'hidden' } as const;
  return (
    <Group orientation="horizontal" className={className}>
      <Panel minSize={320} className="flex min-w-0 flex-col" style={pane}>
        {first}
      </Panel>
      <Separator
        aria-label={separatorLabel}
        className="w-1.5 shrink-0 cursor-col-resize border-x border-rule bg-sheet-alt hover:bg-rule focus-visible:bg-rule data-[separator=active]:bg-rule"
      />
      <Panel
        defaultSize={secondDefault}
        minSize={secondMin}
        maxSize={secondMax}
        groupResizeBehavior="preserve-pixel-size"
        className="flex min-h-0 flex-col"
        style={pane}
      >
        {second}
      </Panel>
    </Group>
  );
}
