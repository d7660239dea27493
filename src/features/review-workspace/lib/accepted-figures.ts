// The stated figures the engineer has accepted on the current revision. The package detail
// does not carry them yet, so they are read from its audit trail ('figure.accepted' events
// with the figure, the reason and the revision), the newest acceptance of each figure.
import type { PackageDetail } from '@shared/schemas/packages';

export type AcceptedFigure = { figure: string; reason: string; by: string | null; at: string };

export function acceptedFigures(detail: PackageDetail): Map<string, AcceptedFigure> {
  const accepted = new Map<string, AcceptedFigure>();
  const events = [...detail.events].sort((a, b) => b.at.localeCompare(a.at));
  for (const event of events) {
    if (event.action !== 'figure.accepted') continue;
    const { figure, reason, revision } = event.detail as {
      figure?: unknown;
      reason?: unknown;
      revision?: unknown;
    };
    if (typeof figure !== 'string' || typeof reason !== 'string') continue;
    if (typeof revision === 'number' && revision !== detail.current.number) continue;
    if (!accepted.has(figure)) accepted.set(figure, { figure, reason, by: event.actor, at: event.at });
  }
  return accepted;
}

/** A finding raised on a stated figure carries this check id. */
export function figureCheckId(figure: string): string {
  return `stated:${figure}`;
}
