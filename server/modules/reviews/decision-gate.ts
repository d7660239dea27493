// The deliberate decision's server side: the engineer's password again (step-up), the gate on
// Accepted / Accepted as noted while something stands against them (shared/rules/decision-gate.ts),
// and the version of the inputs and results the decision is made on.
import { createHash } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { DataSource, EntityManager } from 'typeorm';
import { readStoredResult } from '@shared/engineering/stored-result';
import type { Actor } from '@shared/rules/actor';
import { blockerLines, decisionBlockers, isGatedDecision } from '@shared/rules/decision-gate';
import type { Decision } from '@shared/schemas/common';
import { DECISION_LABELS } from '@shared/schemas/common';
import { AppError } from '../../lib/app-error';
import type { Revision } from '../packages/package.entity';
import { User } from '../users/user.entity';
import { Finding } from './review.entity';

/** One message for every refused step-up: it says nothing about why the password failed. */
const STEP_UP_REFUSED = 'The password did not confirm the decision. Nothing was recorded.';

/** 401 `step_up_failed` unless `password` is the person's own. */
export async function confirmPassword(ds: DataSource, actor: Actor, password: string): Promise<void> {
  const user = await ds.getRepository(User).findOneBy({ id: actor.id, active: true });
  const ok = Boolean(user?.passwordHash) && (await bcrypt.compare(password, user!.passwordHash!));
  if (!ok) {
    throw new AppError(401, 'step_up_failed', STEP_UP_REFUSED, [
      { path: 'password', message: 'password did not confirm the decision' },
    ]);
  }
}

/** JSON with every object's keys sorted: the same value always gives the same text. */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
}

export function jsonSha256(value: unknown): string {
  return createHash('sha256').update(canonicalJson(value), 'utf8').digest('hex');
}

/** What a decision records about what it was made on. */
export function madeOn(revision: Revision) {
  const result = readStoredResult(revision.results);
  return {
    inputsSha256: jsonSha256(revision.inputs),
    resultsSha256: revision.results ? jsonSha256(revision.results) : null,
    engineVersion: result?.engineVersion ?? null,
  };
}

/**
 * The gate, under the package lock: the items standing against an acceptance now. A gated
 * decision with items and no override reason answers 422 `override_required`, naming the field
 * and listing the items in words. Returns what the decision records: the items it overrode and
 * the reason (both empty when nothing stood against it or the decision is not an acceptance).
 */
export async function passGate(
  m: EntityManager,
  packageId: string,
  revision: Revision,
  decision: Decision,
  overrideReason: string,
): Promise<{ overridden: string[]; overrideReason: string | null }> {
  if (!isGatedDecision(decision)) return { overridden: [], overrideReason: null };
  const findings = await m.getRepository(Finding).find({
    where: { packageId },
    select: { severity: true, state: true, text: true },
    order: { createdAt: 'ASC' },
  });
  const lines = blockerLines(
    decisionBlockers({
      result: readStoredResult(revision.results),
      findings,
      acceptedFigures: (revision.acceptedFigures ?? []).map((a) => a.figure),
    }),
  );
  if (!lines.length) return { overridden: [], overrideReason: null };
  if (!overrideReason) {
    const what = lines.length === 1 ? 'one item stands' : `${lines.length} items stand`;
    throw new AppError(
      422,
      'override_required',
      `${DECISION_LABELS[decision]} needs an override reason: ${what} against it — ${lines.join('; ')}`,
      [
        {
          path: 'overrideReason',
          message: `overrideReason is required: write why the lift may go ahead although ${what} against it`,
        },
      ],
    );
  }
  return { overridden: lines, overrideReason };
}
