// The messages of two hand-offs inside the review: a recorded decision goes to the site's
// coordinators (reviewers), who issue the stamped return next; a contractor's answer to a
// finding goes to the engineer assigned to the package. Staged in the change's own transaction
// (stageMail), sent after the commit. No internal identifiers in the words: a finding is named
// by its number in the package's list, as the calculation sheet numbers it.
import { createHash } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import type { Decision } from '@shared/schemas/common';
import { siteReviewers, stageMail } from '../mail/service';
import { templates } from '../mail/templates';
import type { LiftPackage } from '../packages/package.entity';
import { Site } from '../sites/site.entity';
import { User } from '../users/user.entity';
import { Finding } from './review.entity';

async function packageRef(m: EntityManager, pkg: LiftPackage, appUrl: string) {
  const site = await m.getRepository(Site).findOneByOrFail({ id: pkg.siteId });
  return {
    reference: pkg.reference,
    title: pkg.title,
    site: site.name,
    plannedLiftDate: pkg.plannedLiftDate,
    url: `${appUrl}/packages/${pkg.id}`,
  };
}

/** A decision was recorded: every coordinator of the site hears of it, once per decision. */
export async function stageDecisionMail(
  m: EntityManager,
  pkg: LiftPackage,
  decision: { id: string; decision: Decision; conditions: string; revision: number },
  engineer: string,
  appUrl: string,
): Promise<string[]> {
  const ref = await packageRef(m, pkg, appUrl);
  const reviewers = await siteReviewers(m, pkg.siteId);
  return stageMail(
    m,
    reviewers.map((r) => ({
      event: 'decided' as const,
      dedupeKey: `decided:${decision.id}:${r.id}`,
      packageId: pkg.id,
      recipient: r,
      content: templates.decided(
        r.name,
        ref,
        decision.revision,
        decision.decision,
        engineer,
        decision.conditions,
      ),
    })),
  );
}

/** A contractor answered a finding: the assigned engineer hears of it, once per answer given. */
export async function stageAnswerMail(
  m: EntityManager,
  pkg: LiftPackage,
  finding: Finding,
  response: string,
  by: string,
  appUrl: string,
): Promise<string[]> {
  if (!pkg.assignedEngineerId) return [];
  const engineer = await m.getRepository(User).findOneBy({ id: pkg.assignedEngineerId, active: true });
  if (!engineer) return [];
  const order: Array<{ id: string }> = await m.query(
    `SELECT id FROM findings WHERE package_id = $1 ORDER BY created_at, id`,
    [pkg.id],
  );
  const number = order.findIndex((f) => f.id === finding.id) + 1;
  const answer = createHash('sha256').update(response).digest('hex').slice(0, 16);
  return stageMail(m, [
    {
      event: 'answered',
      dedupeKey: `answered:${finding.id}:${answer}`,
      packageId: pkg.id,
      recipient: engineer,
      content: templates.answered(engineer.name, await packageRef(m, pkg, appUrl), by, {
        number,
        text: finding.text,
        response,
      }),
    },
  ]);
}
