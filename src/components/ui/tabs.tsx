// Tabs on Radix's tabs primitive (arrow keys between tabs, the ARIA tab pattern) in our own
// look: each tab a label with a short count under it, the chosen one underlined in rust.
// Panels stay mounted and are only hidden, so a half-written form in one survives a look at
// another.
import { createContext, useContext, type ReactNode } from 'react';
import * as RadixTabs from '@radix-ui/react-tabs';

// The chosen tab, for the panels to hide themselves with the hidden attribute (not CSS alone).
const Chosen = createContext<string | null>(null);

export type TabItem<T extends string> = { id: T; label: string; count?: string };

export function Tabs<T extends string>({
  value,
  onChange,
  label,
  tabs,
  children,
  className = '',
}: {
  value: T;
  onChange: (value: T) => void;
  label: string;
  tabs: TabItem<T>[];
  children: ReactNode;
  className?: string;
}) {
  return (
    <RadixTabs.Root value={value} onValueChange={(next) => onChange(next as T)} className={className}>
      <RadixTabs.List aria-label={label} className="flex border-b border-rule-strong bg-sheet-alt">
        {tabs.map((t) => (
          <RadixTabs.Trigger
            key={t.id}
            value={t.id}
            // Radix selects on mouse-down and keys; a click without a press (assistive
            // technology, a script) must select too.
            onClick={() => onChange(t.id)}
            className="flex min-w-0 flex-1 flex-col items-start border-b-[3px] border-transparent px-2.5 py-1 text-left hover:bg-sheet data-[state=active]:border-rust data-[state=active]:bg-sheet"
          >
            <span className="text-[13px] font-bold">{t.label}</span>
            {t.count && <span className="truncate text-[11.5px] text-ink-soft">{t.count}</span>}
          </RadixTabs.Trigger>
        ))}
      </RadixTabs.List>
      <Chosen.Provider value={value}>{children}</Chosen.Provider>
    </RadixTabs.Root>
  );
}

export function TabPanel({
  value,
  children,
  className = '',
}: {
  value: string;
  children: ReactNode;
  className?: string;
}) {
  const chosen = useContext(Chosen);
  return (
    <RadixTabs.Content forceMount value={value} hidden={chosen !== value} className={className}>
      {children}
    </RadixTabs.Content>
  );
}
