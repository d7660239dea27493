// @vitest-environment jsdom
// The shared primitives on Radix: the dialog keeps focus inside, closes on Escape and gives
// focus back; the tabs move with the arrow keys and keep hidden panels mounted. And the
// review workspace's keyboard map, key by key.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { useState } from 'react';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { Dialog } from '@/components/ui/dialog';
import { TabPanel, Tabs } from '@/components/ui/tabs';
import { keyAction, type WorkspaceKeyActions } from '@/features/review-workspace/hooks/use-workspace-keys';

afterEach(cleanup);

function DialogHost() {
  const [open, setOpen] = useState(false);
  return (
    <>
      <button type="button" onClick={() => setOpen(true)}>
        Open
      </button>
      {open && (
        <Dialog title="Add a site" description="Name and code." onClose={() => setOpen(false)}>
          <label>
            Name <input />
          </label>
          <button type="button">Save</button>
        </Dialog>
      )}
    </>
  );
}

describe('dialog', () => {
  it('when it opens, then focus is on the first field, Tab stays inside, and Escape closes it and returns focus', async () => {
    const user = userEvent.setup();
    render(<DialogHost />);
    const opener = screen.getByRole('button', { name: 'Open' });
    await user.click(opener);

    const dialog = screen.getByRole('dialog', { name: 'Add a site' });
    expect(dialog.getAttribute('aria-describedby')).toBeTruthy();
    expect(document.activeElement).toBe(screen.getByRole('textbox', { name: 'Name' }));
    for (let i = 0; i < 4; i++) {
      await user.tab();
      expect(dialog.contains(document.activeElement)).toBe(true);
    }

    await user.keyboard('{Escape}');
    expect(screen.queryByRole('dialog')).toBeNull();
    await vi.waitFor(() => expect(document.activeElement).toBe(opener));
  });

  it('when the close button is pressed, then the dialog closes', async () => {
    const user = userEvent.setup();
    render(<DialogHost />);
    await user.click(screen.getByRole('button', { name: 'Open' }));
    await user.click(screen.getByRole('button', { name: 'Close' }));
    expect(screen.queryByRole('dialog')).toBeNull();
  });
});

function TabsHost() {
  const [tab, setTab] = useState<'a' | 'b'>('a');
  return (
    <Tabs
      value={tab}
      onChange={setTab}
      label="Panels"
      tabs={[
        { id: 'a', label: 'First', count: '2 open' },
        { id: 'b', label: 'Second' },
      ]}
    >
      <TabPanel value="a">
        <input aria-label="Draft" />
      </TabPanel>
      <TabPanel value="b">Second panel</TabPanel>
    </Tabs>
  );
}

describe('tabs', () => {
  it('when the right arrow is pressed on a tab, then the next tab is chosen and the first panel keeps what was typed', async () => {
    const user = userEvent.setup();
    render(<TabsHost />);
    await user.type(screen.getByRole('textbox', { name: 'Draft' }), 'half a finding');
    screen.getByRole('tab', { name: /First/ }).focus();
    await user.keyboard('{ArrowRight}');

    expect(screen.getByRole('tab', { name: 'Second' }).getAttribute('aria-selected')).toBe('true');
    expect(screen.getByRole('tabpanel', { name: 'Second' }).textContent).toBe('Second panel');
    expect(screen.queryByRole('textbox', { name: 'Draft' })).toBeNull();
    await user.click(screen.getByRole('tab', { name: /First/ }));
    expect((screen.getByRole('textbox', { name: 'Draft' }) as HTMLInputElement).value).toBe('half a finding');
  });
});

describe('workspace keys', () => {
  const calls: string[] = [];
  const record = (name: string) => () => void calls.push(name);
  const actions = (over: Partial<WorkspaceKeyActions> = {}): WorkspaceKeyActions => ({
    save: record('save'),
    nextPage: record('nextPage'),
    previousPage: record('previousPage'),
    nextFinding: record('nextFinding'),
    previousFinding: record('previousFinding'),
    removeSelected: null,
    drop: record('drop'),
    zoomIn: record('zoomIn'),
    zoomOut: record('zoomOut'),
    zoomActual: record('zoomActual'),
    pickTool: null,
    ...over,
  });
  const key = (k: string, more: { ctrlKey?: boolean; target?: EventTarget | null } = {}) => ({
    key: k,
    ctrlKey: more.ctrlKey ?? false,
    metaKey: false,
    altKey: false,
    target: more.target ?? document.body,
  });

  it('when each mapped key is pressed, then its action runs', () => {
    calls.length = 0;
    const a = actions();
    for (const k of [']', 'PageDown', '[', 'PageUp', 'n', 'p', 's', 'Escape', '+', '=', '-', '0'])
      keyAction(key(k), a)?.run();
    expect(calls).toEqual([
      'nextPage',
      'nextPage',
      'previousPage',
      'previousPage',
      'nextFinding',
      'previousFinding',
      'save',
      'drop',
      'zoomIn',
      'zoomIn',
      'zoomOut',
      'zoomActual',
    ]);
  });

  it('when typing in a field, then only Ctrl+S is taken', () => {
    const field = document.createElement('textarea');
    expect(keyAction(key('n', { target: field }), actions())).toBeNull();
    expect(keyAction(key('s', { ctrlKey: true, target: field }), actions())?.preventDefault).toBe(true);
  });

  it('when nothing is picked or the person may not mark up, then Delete and the tool keys do nothing', () => {
    expect(keyAction(key('Delete'), actions())).toBeNull();
    expect(keyAction(key('2'), actions())).toBeNull();
    const picked: string[] = [];
    keyAction(key('2'), actions({ pickTool: (t) => void picked.push(t) }))?.run();
    expect(picked).toEqual(['rectangle']);
  });
});
