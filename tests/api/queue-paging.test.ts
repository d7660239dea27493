// The package list at scale, at small scale: keyset paging walks every row exactly once in every
// sort (ties and missing dates included) both ways, the search finds references and titles through
// the trigram indexes, the counts agree with a real count (kept by the trigger, or bounded beyond
// the limit), and the scope still holds (a contractor sees their organisation's packages, a
// reviewer their desk's sites, an engineer their assignments).
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PACKAGE_STATUSES } from '@shared/schemas/common';
import { PACKAGE_SORTS } from '@shared/schemas/packages';
import { COUNT_LIMIT } from '@server/modules/packages/list-packages';
import { startTestApp, signedIn, type TestApp } from '../support/app';
import { makePackage, makeSite, makeWorld } from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

type Agent = Awaited<ReturnType<typeof signedIn>>;
interface Item {
  id: string;
  reference: string;
  plannedLiftDate: string | null;
  reviewDueOn: string | null;
  updatedAt: string;
  openDiscrepancies: number;
  revisionNumber: number;
}

const DATES = ['2027-05-01', '2027-05-01', null, '2027-04-20', null, '2027-05-03'];
// Microseconds the JSON's milliseconds do not show: a cursor that lost them would repeat rows.
const STAMPS = ['2027-01-01 10:00:00.123456+00', '2027-01-01 10:00:00.124567+00'];

/** 13 packages on the world's site whose every sort key has ties, with references in a known order. */
async function tiedQueue() {
  const w = await makeWorld(t.ctx.dataSource);
  const prefix = `K${randomUUID()
    .slice(0, 6)
    .toUpperCase()
    .replace(/[^A-Z0-9]/g, 'Z')}`;
  const ids: string[] = [];
  for (let i = 0; i < 13; i++) {
    const p = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
    });
    await t.ctx.dataSource.query(
      `UPDATE lift_packages SET reference = $2, planned_lift_date = $3, open_discrepancies = $4,
         current_revision = $5, updated_at = $6, review_due_on = $7 WHERE id = $1`,
      [
        p.id,
        `${prefix}${String(i).padStart(3, '0')}`,
        DATES[i % 6],
        i % 3,
        1 + (i % 2),
        STAMPS[i % 2],
        DATES[(i + 2) % 6],
      ],
    );
    ids.push(p.id);
  }
  return { w, ids };
}

const KEY: Record<string, (i: Item) => string | number | null> = {
  plannedLiftDate: (i) => i.plannedLiftDate,
  reviewDue: (i) => i.reviewDueOn,
  updatedAt: (i) => i.updatedAt,
  reference: (i) => i.reference,
  openDiscrepancies: (i) => i.openDiscrepancies,
  revision: (i) => i.revisionNumber,
};

/** The list's order worked out here: the key (missing last either way), then the reference, same direction. */
function expectedOrder(items: Item[], sort: string): string[] {
  const desc = sort.startsWith('-');
  const key = KEY[sort.replace(/^-/, '')];
  const cmp = (a: string | number, b: string | number) => (a < b ? -1 : a > b ? 1 : 0);
  return [...items]
    .sort((a, b) => {
      const ka = key(a);
      const kb = key(b);
      if (ka === null || kb === null) {
        if (ka !== kb) return ka === null ? 1 : -1;
      } else if (ka !== kb) return desc ? -cmp(ka, kb) : cmp(ka, kb);
      return desc ? -cmp(a.reference, b.reference) : cmp(a.reference, b.reference);
    })
    .map((i) => i.id);
}

async function get(agent: Agent, query: string) {
  const res = await agent.get(`/api/packages?${query}`);
  expect(res.status, `${query}: ${JSON.stringify(res.body)}`).toBe(200);
  return res.body;
}

describe('keyset paging', () => {
  it('when every sort is walked by cursor four rows at a time, then each row comes once, in order, both ways', async () => {
    const { w, ids } = await tiedQueue();
    const reviewer = await signedIn(t.app, w.reviewer.email);
    const all: Item[] = (await get(reviewer, 'pageSize=100')).items;
    expect(all.map((i) => i.id).sort()).toEqual([...ids].sort());
    for (const sort of PACKAGE_SORTS) {
      const forward: string[] = [];
      const cursors: (string | null)[] = [];
      let body = await get(reviewer, `sort=${sort}&pageSize=4`);
      expect(body.previousCursor, sort).toBeNull();
      for (;;) {
        forward.push(...body.items.map((i: Item) => i.id));
        expect(body.total, sort).toBe(13);
        if (!body.nextCursor) break;
        cursors.push(body.nextCursor);
        body = await get(reviewer, `sort=${sort}&pageSize=4&cursor=${body.nextCursor}`);
      }
      expect(cursors.length, sort).toBe(3);
      expect(forward, sort).toEqual(expectedOrder(all, sort));
      // And back again from the last page, by the previous cursors.
      const backward: string[][] = [body.items.map((i: Item) => i.id)];
      while (body.previousCursor) {
        body = await get(reviewer, `sort=${sort}&pageSize=4&cursor=${body.previousCursor}`);
        backward.unshift(body.items.map((i: Item) => i.id));
      }
      expect(backward.flat(), sort).toEqual(forward);
      expect(
        backward.map((page) => page.length),
        sort,
      ).toEqual([4, 4, 4, 1]);
      // The offset pages (no cursor) still give the same rows.
      const third = await get(reviewer, `sort=${sort}&pageSize=4&page=3`);
      expect(
        third.items.map((i: Item) => i.id),
        sort,
      ).toEqual(forward.slice(8, 12));
    }
  });

  it('when a cursor is not one the list gave out, or belongs to another sort, then 400 names the cursor', async () => {
    const { w } = await tiedQueue();
    const reviewer = await signedIn(t.app, w.reviewer.email);
    const broken = await reviewer.get('/api/packages?cursor=bm90LWEtY3Vyc29y');
    expect(broken.status).toBe(400);
    expect(broken.body.error.fields).toEqual([
      { path: 'query.cursor', message: 'Cursor must be one the list gave out' },
    ]);
    const { nextCursor } = await get(reviewer, 'sort=reference&pageSize=4');
    const other = await reviewer.get(`/api/packages?sort=-updatedAt&cursor=${nextCursor}`);
    expect(other.status).toBe(400);
    expect(other.body.error.fields[0].path).toBe('query.cursor');
    const junk = await reviewer.get('/api/packages?cursor=a%20b');
    expect(junk.status).toBe(400);
  });
});

describe('search', () => {
  it('when the reviewer searches part of a reference or of a title, then the trigram search finds it', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const word = `Gantry${randomUUID().slice(0, 6)}`;
    const a = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
    });
    const b = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorB,
      site: w.site,
      createdBy: w.plannerB,
    });
    await t.ctx.dataSource.query(`UPDATE lift_packages SET title = $2 WHERE id = $1`, [
      a.id,
      `Tandem lift of the ${word} girder`,
    ]);
    const reviewer = await signedIn(t.app, w.reviewer.email);
    const ids = async (q: string) =>
      (await get(reviewer, `q=${encodeURIComponent(q)}`)).items.map((i: Item) => i.id);
    expect(await ids(word.toLowerCase())).toEqual([a.id]);
    expect(await ids(`${word} gir`)).toEqual([a.id]);
    expect(await ids(b.reference.slice(2).toUpperCase())).toEqual([b.id]);
    expect(await ids('no such lift anywhere')).toEqual([]);
    // The search can be answered from the trigram indexes (the planner takes them at scale).
    const plan = await t.ctx.dataSource.transaction(async (m) => {
      await m.query('SET LOCAL enable_seqscan = off');
      return m.query(`EXPLAIN SELECT id FROM lift_packages WHERE reference ILIKE $1 OR title ILIKE $1`, [
        `%${word}%`,
      ]);
    });
    const text = plan.map((r: { 'QUERY PLAN': string }) => r['QUERY PLAN']).join('\n');
    expect(text).toContain('lift_packages_reference_trgm_idx');
    expect(text).toContain('lift_packages_title_trgm_idx');
  });
});

/** A real count by status of the packages on these sites that owner-side people see. */
async function realCounts(siteIds: string[], extra = 'true') {
  const rows: { status: string; n: number }[] = await t.ctx.dataSource.query(
    `SELECT status, count(*)::int AS n FROM lift_packages p
     WHERE site_id = ANY($1) AND NOT (status = 'draft' AND current_revision = 1) AND ${extra}
     GROUP BY status`,
    [siteIds],
  );
  return Object.fromEntries(rows.map((r) => [r.status, r.n]));
}

describe('counts', () => {
  it('when packages are added, change status, move site and are deleted, then the kept counts agree with a real count', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const second = await makeSite(t.ctx.dataSource, w.owner, [w.reviewer]);
    const make = (status: 'ready_for_review' | 'draft' | 'decided', site = w.site) =>
      makePackage(t.ctx.dataSource, { contractor: w.contractorA, site, createdBy: w.plannerA, status });
    const ready = await Promise.all([make('ready_for_review'), make('ready_for_review'), make('decided')]);
    await make('draft');
    await make('ready_for_review', second);
    const reviewer = await signedIn(t.app, w.reviewer.email);
    const sites = [w.site.id, second.id];
    const check = async () => {
      const body = await get(reviewer, '');
      expect(body.countsByStatus).toEqual(await realCounts(sites));
      expect(body.countsOverLimit).toEqual([]);
      const one = await get(reviewer, `siteId=${second.id}`);
      expect(one.countsByStatus).toEqual(await realCounts([second.id]));
      return body;
    };
    expect((await check()).countsByStatus).toEqual({ ready_for_review: 3, decided: 1 });
    await t.ctx.dataSource.query(`UPDATE lift_packages SET status = 'with_engineer' WHERE id = $1`, [
      ready[0].id,
    ]);
    await t.ctx.dataSource.query(`UPDATE lift_packages SET site_id = $2 WHERE id = $1`, [
      ready[1].id,
      second.id,
    ]);
    // A returned package's next revision in draft is seen by owner-side people; a first draft is not.
    await t.ctx.dataSource.query(
      `UPDATE lift_packages SET status = 'draft', current_revision = 2 WHERE id = $1`,
      [ready[2].id],
    );
    expect((await check()).countsByStatus).toEqual({ ready_for_review: 2, with_engineer: 1, draft: 1 });
    await t.ctx.dataSource.query(`DELETE FROM revisions WHERE package_id = $1`, [ready[0].id]);
    await t.ctx.dataSource.query(`DELETE FROM lift_packages WHERE id = $1`, [ready[0].id]);
    const after = await check();
    expect(after.countsByStatus).toEqual({ ready_for_review: 2, draft: 1 });
    expect(after.total).toBe(3);
    // A filter the kept counts cannot answer is counted over the packages themselves.
    const filtered = await get(reviewer, 'critical=false&status=draft');
    expect(filtered.countsByStatus).toEqual(await realCounts(sites, 'NOT critical'));
    expect(filtered.total).toBe(1);
  });

  it(`when more than ${COUNT_LIMIT} packages match a filter, then the counts are lower bounds past the limit`, async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const prefix = randomUUID().slice(0, 8);
    await t.ctx.dataSource.query(
      `INSERT INTO lift_packages (reference, title, contractor_organisation_id, site_id, created_by_id, status, critical)
       SELECT $1 || '-' || i, 'Bulk lift ' || i, $2, $3, $4, CASE WHEN i <= $5 THEN 'ready_for_review' ELSE 'decided' END, true
       FROM generate_series(1, $5 + 5) AS i`,
      [prefix, w.contractorA.id, w.site.id, w.plannerA.id, COUNT_LIMIT + 1],
    );
    const reviewer = await signedIn(t.app, w.reviewer.email);
    const bounded = await get(reviewer, 'critical=true');
    // COUNT_LIMIT + 1 packages counted, shared between the statuses in the order the scan met them.
    const counted = Object.values(bounded.countsByStatus as Record<string, number>);
    expect(counted.reduce((a, b) => a + b, 0)).toBe(COUNT_LIMIT + 1);
    expect(bounded.countsByStatus.ready_for_review).toBeLessThanOrEqual(COUNT_LIMIT + 1);
    expect(bounded.countsOverLimit).toEqual([...PACKAGE_STATUSES]);
    expect(bounded.total).toBe(COUNT_LIMIT + 1);
    expect(bounded.totalOverLimit).toBe(true);
    expect(bounded.countLimit).toBe(COUNT_LIMIT);
    // Within the limit the same filter counts exactly.
    const few = await get(
      reviewer,
      `critical=true&siteId=${w.site.id}&q=${encodeURIComponent('Bulk lift 100')}`,
    );
    expect(few.countsByStatus).toEqual({ ready_for_review: 3, decided: 5 }); // 100, 1000–1006
    expect(few.countsOverLimit).toEqual([]);
    expect(few.totalOverLimit).toBe(false);
    // Without such a filter the kept counts are exact at any size.
    const kept = await get(reviewer, '');
    expect(kept.countsByStatus).toEqual({ ready_for_review: COUNT_LIMIT + 1, decided: 5 });
    expect(kept.totalOverLimit).toBe(false);
  });
});

describe('scope', () => {
  it('when a contractor, a reviewer of another desk and an engineer list, then each sees only their own, counts included', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const other = await makeWorld(t.ctx.dataSource);
    const mine = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
    });
    const myDraft = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'draft',
    });
    const theirs = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorB,
      site: w.site,
      createdBy: w.plannerB,
      engineer: w.engineer,
    });
    const elsewhere = await makePackage(t.ctx.dataSource, {
      contractor: other.contractorA,
      site: other.site,
      createdBy: other.plannerA,
    });
    const list = async (email: string, query = 'pageSize=100') => {
      const body = await get(await signedIn(t.app, email), query);
      return {
        ids: body.items.map((i: Item) => i.id).sort(),
        counts: body.countsByStatus,
        total: body.total,
      };
    };
    const a = await list(w.plannerA.email);
    expect(a.ids).toEqual([mine.id, myDraft.id].sort());
    expect(a.counts).toEqual({ ready_for_review: 1, draft: 1 });
    // A contractor's filter naming another organisation finds nothing of it.
    expect((await list(w.plannerA.email, `contractorId=${w.contractorB.id}`)).total).toBe(0);
    const reviewer = await list(w.reviewer.email);
    expect(reviewer.ids).toEqual([mine.id, theirs.id].sort());
    expect(reviewer.counts).toEqual({ ready_for_review: 2 });
    const otherReviewer = await list(other.reviewer.email);
    expect(otherReviewer.ids).toEqual([elsewhere.id]);
    expect(otherReviewer.total).toBe(1);
    expect((await list(other.reviewer.email, `siteId=${w.site.id}`)).total).toBe(0);
    const engineer = await list(w.engineer.email);
    expect(engineer.ids).toEqual([theirs.id]);
    expect(engineer.counts).toEqual({ ready_for_review: 1 });
    // A cursor carries no scope: followed by someone else, it pages through their own list only.
    const { nextCursor } = await get(await signedIn(t.app, w.reviewer.email), 'sort=reference&pageSize=1');
    const borrowed = await list(other.reviewer.email, `sort=reference&pageSize=100&cursor=${nextCursor}`);
    expect(borrowed.ids.every((id: string) => id === elsewhere.id)).toBe(true);
  });
});
