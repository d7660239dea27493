// What stands against an acceptance: a failing check, a Major or Blocking finding that is not
// closed, a stated figure that disagrees with the recomputation and has not been accepted with a
// reason, or no check result at all. While any stands, Accepted and Accepted as noted need an
// override reason in writing (the server refuses them without one, the workspace lists them).
// One function for the server's gate and the engineer's dialog, so both list the same items in
// the same words.
import type { LiftResult } from '../engineering/types';
import type { Decision } from '../schemas/common';

/** The decisions that let a lift go ahead: these are the gated ones. */
const GATED_DECISIONS: readonly Decision[] = ['accepted', 'accepted_as_noted'];

export function isGatedDecision(decision: Decision): boolean {
  return GATED_DECISIONS.includes(decision);
}

type BlockerKind = 'no_result' | 'failing_check' | 'open_finding' | 'unaccepted_figure';

/** One item standing against an acceptance, in words a person reads (no ids). */
export interface DecisionBlocker {
  kind: BlockerKind;
  /** What kind of item it is: "Failing check", "Major finding not closed"… */
  title: string;
  /** The item itself: the check's verdict, the finding's text, the figures compared. */
  text: string;
}

const BLOCKER_TITLES: Record<BlockerKind, string> = {
  no_result: 'No check result',
  failing_check: 'Failing check',
  open_finding: 'Finding not closed',
  unaccepted_figure: 'Disagreeing stated figure not accepted',
};

interface GateFinding {
  severity: 'note' | 'minor' | 'major' | 'blocking';
  state: 'open' | 'answered' | 'closed';
  text: string;
}

const FINDING_TEXT_MAX = 160;

function shorten(text: string, max: number): string {
  const flat = text.replace(/\s+/g, ' ').trim();
  return flat.length <= max ? flat : `${flat.slice(0, max - 1).trimEnd()}…`;
}

/**
 * The items standing against Accepted / Accepted as noted, in the order the engineer reads
 * them: the check first, then the findings, then the stated figures. Empty: nothing to override.
 */
export function decisionBlockers(input: {
  result: LiftResult | null;
  /** Every finding of the package (carried ones included): a Major one not closed still stands. */
  findings: readonly GateFinding[];
  /** The stated figures the engineer has accepted on this revision. */
  acceptedFigures: readonly string[];
}): DecisionBlocker[] {
  const blockers: DecisionBlocker[] = [];
  const { result } = input;
  if (!result) {
    blockers.push({
      kind: 'no_result',
      title: BLOCKER_TITLES.no_result,
      text: 'The independent check has no result for this revision.',
    });
  }
  for (const check of result?.checks ?? []) {
    if (check.status !== 'fail') continue;
    blockers.push({
      kind: 'failing_check',
      title: BLOCKER_TITLES.failing_check,
      text: `${check.label}: ${check.message}`,
    });
  }
  for (const finding of input.findings) {
    if (finding.state === 'closed') continue;
    if (finding.severity !== 'major' && finding.severity !== 'blocking') continue;
    const severity = finding.severity === 'major' ? 'Major' : 'Blocking';
    const answered = finding.state === 'answered' ? ' (answered by the contractor, not closed)' : '';
    blockers.push({
      kind: 'open_finding',
      title: `${severity} finding not closed`,
      text: `${shorten(finding.text, FINDING_TEXT_MAX)}${answered}`,
    });
  }
  const accepted = new Set(input.acceptedFigures);
  for (const d of result?.discrepancies ?? []) {
    if (d.status !== 'discrepancy' || accepted.has(d.figure)) continue;
    blockers.push({ kind: 'unaccepted_figure', title: BLOCKER_TITLES.unaccepted_figure, text: d.message });
  }
  return blockers;
}

/** The list as one sentence each, for messages and the printed record. */
export function blockerLines(blockers: readonly DecisionBlocker[]): string[] {
  return blockers.map((b) => `${b.title}: ${b.text}`);
}
