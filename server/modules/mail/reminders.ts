// The daily reminder: packages whose planned lift date falls within the next N days
// (today included) and that are not yet accepted. The contractor who prepared it, the
// assigned engineer and the site's reviewers hear about it, unless they turned reminders
// off. One reminder per package, person and day. And the review's due date: from the day
// before it, the assigned engineer and the site's coordinators are reminded while it is owed.
import type { DataSource } from 'typeorm';
import { In } from 'typeorm';
import { PACKAGE_STATUS_LABELS, type PackageStatus } from '@shared/schemas/common';
import { REVIEW_OWED } from '@shared/rules/review-due';
import { LiftPackage } from '../packages/package.entity';
import { Site } from '../sites/site.entity';
import { User } from '../users/user.entity';
import { siteReviewers, stageMail, type MailDraft } from './service';
import { templates } from './templates';

/** today: the calendar day (YYYY-MM-DD) the reminder run is for. */
export async function stageReminders(
  ds: DataSource,
  today: string,
  days: number,
  appUrl: string,
): Promise<string[]> {
  const due: LiftPackage[] = await ds
    .getRepository(LiftPackage)
    .createQueryBuilder('p')
    .where('p.planned_lift_date >= :today::date AND p.planned_lift_date <= :today::date + :days::int', {
      today,
      days,
    })
    .andWhere(`NOT (p.status = 'returned' AND p.decision IN ('accepted', 'accepted_as_noted'))`)
    .getMany();
  const reviewDue = await stageReviewDueReminders(ds, today, appUrl);
  if (!due.length) return reviewDue;
  const liftDue = await ds.transaction(async (m) => {
    const sites = new Map(
      (await m.getRepository(Site).findBy({ id: In([...new Set(due.map((p) => p.siteId))]) })).map((s) => [
        s.id,
        s,
      ]),
    );
    const drafts: MailDraft[] = [];
    for (const p of due) {
      const people = new Map<string, User>();
      const direct = await m
        .getRepository(User)
        .findBy({ id: In([p.createdById, p.assignedEngineerId].filter(Boolean) as string[]) });
      for (const u of [...direct, ...(p.status === 'draft' ? [] : await siteReviewers(m, p.siteId))])
        people.set(u.id, u);
      const daysLeft = Math.round((Date.parse(p.plannedLiftDate!) - Date.parse(today)) / 86_400_000);
      for (const u of people.values()) {
        if (!u.active || !u.notifyReminders) continue;
        drafts.push({
          event: 'reminder',
          dedupeKey: `reminder:${p.id}:${today}:${u.id}`,
          packageId: p.id,
          recipient: u,
          content: templates.reminder(
            u.name,
            {
              reference: p.reference,
              title: p.title,
              site: sites.get(p.siteId)?.name ?? '',
              plannedLiftDate: p.plannedLiftDate,
              url: `${appUrl}/packages/${p.id}`,
            },
            daysLeft,
            PACKAGE_STATUS_LABELS[p.status as PackageStatus],
          ),
        });
      }
    }
    return stageMail(m, drafts);
  });
  return [...liftDue, ...reviewDue];
}

/**
 * Reviews due today or tomorrow (or overdue) and still owed: the assigned engineer and the
 * site's coordinators hear about it, once per package, person and day.
 */
async function stageReviewDueReminders(ds: DataSource, today: string, appUrl: string): Promise<string[]> {
  const owed: LiftPackage[] = await ds
    .getRepository(LiftPackage)
    .createQueryBuilder('p')
    .where('p.review_due_on <= :today::date + 1', { today })
    .andWhere('p.status IN (:...owed)', { owed: [...REVIEW_OWED] })
    .getMany();
  if (!owed.length) return [];
  return ds.transaction(async (m) => {
    const drafts: MailDraft[] = [];
    for (const p of owed) {
      const site = await m.getRepository(Site).findOneBy({ id: p.siteId });
      const people = new Map<string, User>();
      if (p.assignedEngineerId) {
        const engineer = await m.getRepository(User).findOneBy({ id: p.assignedEngineerId });
        if (engineer) people.set(engineer.id, engineer);
      }
      for (const u of await siteReviewers(m, p.siteId)) people.set(u.id, u);
      for (const u of people.values()) {
        if (!u.active || !u.notifyReminders) continue;
        drafts.push({
          event: 'review_due',
          dedupeKey: `review-due:${p.id}:${today}:${u.id}`,
          packageId: p.id,
          recipient: u,
          content: templates.review_due(
            u.name,
            {
              reference: p.reference,
              title: p.title,
              site: site?.name ?? '',
              plannedLiftDate: p.plannedLiftDate,
              url: `${appUrl}/packages/${p.id}`,
            },
            p.reviewDueOn!,
            today,
            PACKAGE_STATUS_LABELS[p.status as PackageStatus],
          ),
        });
      }
    }
    return stageMail(m, drafts);
  });
}
