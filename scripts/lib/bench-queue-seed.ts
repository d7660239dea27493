// The 100,000 packages npm run bench:queue measures the queue over, written by PostgreSQL itself
// (INSERT … SELECT over generate_series, a few statements), so that seeding takes seconds: one
// owner's desk with 20 sites (the reviewer serves 10 of them, so half the packages are in their
// scope), 40 contractors with a planner each, 30 engineers; statuses, revisions (1–4, each with a
// whole example lift as its inputs; the current one, once checked, with that lift's evaluated
// result, 30–70 kB of JSON: older revisions' results are left out to keep seeding within two
// minutes, and the queue reads neither), planned
// lift dates (a few missing), criticality, discrepancies and engineers spread as on a busy desk.
// The names and figures are invented demo data.
import fs from 'node:fs';
import type { DataSource } from 'typeorm';
import { evaluateLift } from '../../shared/engineering/evaluate';
import { LiftInput } from '../../shared/schemas/lift-input';

export interface SeededQueue {
  reviewerEmail: string;
  siteId: string;
  contractorId: string;
  engineerId: string;
  /** A reference and a title word that the search can look for. */
  referencePart: string;
  titleWord: string;
  packages: number;
}

const EXAMPLES = ['caution-tandem.json', 'caution-discrepancies.json', 'fail-capacity.json'];

export async function seedQueue(ds: DataSource, packages: number): Promise<SeededQueue> {
  const step = (() => {
    let t = performance.now();
    return (what: string) => {
      const now = performance.now();
      process.stdout.write(`  seed: ${what} ${((now - t) / 1000).toFixed(1)} s\n`);
      t = now;
    };
  })();
  const { makeOrganisation, makeSite, makeUser, makeWorld } = await import('../../tests/support/factories');
  const w = await makeWorld(ds);
  const contractors = [w.contractorA, w.contractorB];
  const planners = [w.plannerA, w.plannerB];
  for (let i = contractors.length; i < 40; i++) {
    const org = await makeOrganisation(ds, 'contractor', `Contractor ${i + 1}`, w.owner.id);
    contractors.push(org);
    planners.push(await makeUser(ds, org, 'contractor'));
  }
  const sites = [w.site];
  for (let i = 1; i < 20; i++) sites.push(await makeSite(ds, w.owner, i < 10 ? [w.reviewer] : []));
  const engineers = [w.engineer];
  for (let i = 1; i < 30; i++) engineers.push(await makeUser(ds, w.owner, 'engineer'));

  const inputs = EXAMPLES.map((name) =>
    JSON.parse(
      fs.readFileSync(new URL(`../../shared/engineering/examples/${name}`, import.meta.url), 'utf8'),
    ),
  );
  const results = inputs.map((x) => evaluateLift(LiftInput.parse(x)));

  step('people and sites');
  // One session for the seed: the random seed holds in it, and lz4 compresses the JSON quicker
  // than the default pglz.
  const session = ds.createQueryRunner();
  await session.connect();
  await session.query(`SET default_toast_compression = 'lz4'`);
  await session.query(`SELECT setseed(0.16)`);
  await session.query(
    `INSERT INTO lift_packages (reference, title, contractor_organisation_id, site_id, created_by_id, status,
       planned_lift_date, current_revision, assigned_engineer_id, critical, worst_status, open_discrepancies,
       decision, created_at, updated_at)
     SELECT 'CP-' || lpad(i::text, 6, '0'),
       (ARRAY['Tandem lift of', 'Single-crane lift of', 'Night lift of', 'Crawler lift of', 'Pick and carry of'])[1 + i % 5]
         || ' ' || (ARRAY['the precast stair core', 'a transfer girder', 'the rooftop chiller', 'a bridge beam',
           'a generator set', 'the tower crane jib', 'a steel truss', 'the water tank', 'a modular plant room',
           'the atrium glazing'])[1 + (i * 7) % 10]
         || ', ' || (ARRAY['north', 'south', 'east', 'west'])[1 + (i * 3) % 4] || ' bay ' || (i % 97),
       ($1::uuid[])[1 + c], ($3::uuid[])[1 + (i % 20)], ($2::uuid[])[1 + c], status,
       CASE WHEN d < 0.05 THEN NULL ELSE current_date + (d * 400 - 200)::int END,
       rev, CASE WHEN status IN ('with_engineer', 'decided', 'returned') AND e < 0.95
         THEN ($4::uuid[])[1 + (i % 30)] END,
       e < 0.15,
       CASE WHEN status IN ('draft', 'checking') THEN NULL WHEN f < 0.6 THEN 'pass' WHEN f < 0.9 THEN 'caution' ELSE 'fail' END,
       CASE WHEN status IN ('draft', 'checking') OR f < 0.75 THEN 0 ELSE 1 + (f * 24)::int % 6 END,
       CASE WHEN status IN ('decided', 'returned') THEN
         (ARRAY['accepted', 'accepted_as_noted', 'revise_and_resubmit', 'rejected'])[1 + (i % 4)] END,
       now() - (a * 200 + 1) * interval '1 day', now() - a * 120 * interval '1 day'
     FROM (
       SELECT i, a, d, e, f, (b * 40)::int % 40 AS c,
         CASE WHEN g < 0.6 THEN 1 WHEN g < 0.9 THEN 2 WHEN g < 0.98 THEN 3 ELSE 4 END AS rev,
         CASE WHEN s < 0.08 THEN 'draft' WHEN s < 0.10 THEN 'checking' WHEN s < 0.13 THEN 'check_failed'
           WHEN s < 0.33 THEN 'ready_for_review' WHEN s < 0.48 THEN 'with_engineer' WHEN s < 0.60 THEN 'decided'
           ELSE 'returned' END AS status
       FROM (SELECT i, random() a, random() b, random() d, random() e, random() f, random() g, random() s
             FROM generate_series(1, $5::int) AS i) r
     ) x`,
    [
      contractors.map((c) => c.id),
      planners.map((p) => p.id),
      sites.map((s) => s.id),
      engineers.map((e) => e.id),
      packages,
    ],
  );
  step(`${packages} packages`);
  // Every revision up to the current one; the current one of a draft package is the draft.
  await session.query(
    `INSERT INTO revisions (package_id, number, state, inputs, submitted_at, submitted_by_id, check_status,
       check_progress, result_version, results, checked_at, created_at, updated_at)
     SELECT p.id, n, CASE WHEN p.status = 'draft' AND n = p.current_revision THEN 'draft' ELSE 'submitted' END,
       ($1::jsonb[])[1 + (n + length(p.reference)) % 3],
       CASE WHEN p.status = 'draft' AND n = p.current_revision THEN NULL ELSE p.created_at END,
       CASE WHEN p.status = 'draft' AND n = p.current_revision THEN NULL ELSE p.created_by_id END,
       CASE WHEN p.status = 'draft' AND n = p.current_revision THEN 'none'
         WHEN p.status = 'checking' AND n = p.current_revision THEN 'running'
         WHEN p.status = 'check_failed' AND n = p.current_revision THEN 'failed' ELSE 'done' END,
       100, 1,
       CASE WHEN n < p.current_revision OR p.status IN ('draft', 'checking', 'check_failed') THEN NULL
         ELSE ($2::jsonb[])[1 + (n + length(p.reference)) % 3] END,
       p.updated_at, p.created_at, p.updated_at
     FROM lift_packages p CROSS JOIN LATERAL generate_series(1, p.current_revision) AS n
     WHERE p.site_id = ANY($3::uuid[])`,
    [inputs.map((x) => JSON.stringify(x)), results.map((x) => JSON.stringify(x)), sites.map((s) => s.id)],
  );
  step('revisions');
  await session.release();
  // The seed's one transaction left 100,000 dead versions of the few thousand count rows (none
  // could be pruned while it ran); a desk's own updates, each its own transaction, leave few.
  await ds.query(`VACUUM FULL package_status_counts`);
  await ds.query(`VACUUM ANALYZE`);
  step('vacuum and analyse');
  return {
    reviewerEmail: w.reviewer.email,
    siteId: w.site.id,
    contractorId: contractors[3].id,
    engineerId: engineers[2].id,
    referencePart: 'CP-04213',
    titleWord: 'chiller',
    packages,
  };
}
