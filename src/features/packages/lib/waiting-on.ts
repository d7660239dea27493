// Who a package is waiting on, in the words of the person reading the list.
import type { PackageSummary } from '@shared/schemas/packages';
import type { Role } from '@shared/schemas/common';

export type WaitingOn = { text: string; onYou: boolean };

export function waitingOn(pkg: PackageSummary, role: Role): WaitingOn {
  const you = role === 'contractor';
  switch (pkg.status) {
    case 'draft':
      return you
        ? { text: 'You: finish and submit', onYou: true }
        : { text: 'Contractor: not yet submitted', onYou: false };
    case 'check_failed':
      return you
        ? { text: 'You: correct the inputs so the check can run', onYou: true }
        : { text: 'Contractor: check could not run', onYou: false };
    case 'checking':
      return { text: 'Independent check running', onYou: false };
    case 'ready_for_review':
      return {
        text: role === 'reviewer' ? 'You: triage and assign' : 'Reviewer: triage',
        onYou: role === 'reviewer',
      };
    case 'with_engineer':
      return {
        text: role === 'engineer' ? 'You: review and decide' : `Engineer: ${pkg.engineer?.name ?? 'review'}`,
        onYou: role === 'engineer',
      };
    case 'decided':
      return {
        text: role === 'reviewer' ? 'You: issue the stamped return' : 'Reviewer: stamped return',
        onYou: role === 'reviewer',
      };
    case 'returned':
      if (pkg.decision === 'revise_and_resubmit' || pkg.decision === 'rejected') {
        return you
          ? { text: 'You: revise and resubmit', onYou: true }
          : { text: 'Contractor: new revision', onYou: false };
      }
      return { text: 'Nothing — returned', onYou: false };
  }
}
