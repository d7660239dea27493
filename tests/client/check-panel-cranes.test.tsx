// @vitest-environment jsdom
// The review workspace's check panel for a lift with several cranes shows each crane's share, gross
// load and worst check above the checks; a one-crane lift shows no such table.
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { evaluateLift } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import twoCranes from '@shared/engineering/examples/caution-two-cranes.json';
import oneCrane from '@shared/engineering/examples/pass-outriggers.json';
import { CheckPanel } from '@/features/review-workspace/components/check-panel';

afterEach(cleanup);

function panel(raw: unknown) {
  const result = evaluateLift(LiftInput.parse(raw), null, { units: 'metric' });
  render(
    <QueryClientProvider client={new QueryClient()}>
      <CheckPanel
        packageId="p1"
        result={result}
        system="metric"
        accepted={new Map()}
        editable={false}
        findingsByCheck={new Map()}
        onRaise={() => {}}
        onAccepted={() => {}}
      />
    </QueryClientProvider>,
  );
}

describe('check panel with several cranes', () => {
  it('when two cranes share the load, then the panel lists each crane with its share (7.20 t and 8.80 t by hand)', () => {
    panel(twoCranes);
    const shares = screen.getByRole('region', { name: 'Shares of the cranes' });
    const rows = within(shares).getAllByTestId('crane-share');
    expect(rows).toHaveLength(2);
    // W 16 t, picks at ∓6 m, centre of gravity at 0.6 m: 16 × 5.4/12 = 7.20 t and 16 × 6.6/12 = 8.80 t
    expect(rows[0].textContent).toContain('7.20 t');
    expect(rows[1].textContent).toContain('8.80 t');
  });

  it('when one crane lifts, then there is no table of shares', () => {
    panel(oneCrane);
    expect(screen.queryByRole('region', { name: 'Shares of the cranes' })).toBeNull();
  });
});
