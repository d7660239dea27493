// A crane removed from a lift with several cranes: its library use goes and the uses of the cranes
// after it move up one slot, in one transaction (no orphan use, no use left in the wrong slot),
// serialised against a second removal, refused for a submitted revision or another contractor.
import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makePackage, makeWorld } from '../support/factories';
import { signedIn, startTestApp, type TestApp } from '../support/app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

const example = JSON.parse(fs.readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'));
type Row = { radius: { value: number }; boomLength: { value: number }; capacity: { value: number } };
const grid = (first: number) => ({
  units: { radius: 'm', boomLength: 'm', capacity: 't' },
  boomLengths: [30.5],
  radii: (example.chart.rows as Row[]).map((r) => r.radius.value),
  capacities: (example.chart.rows as Row[]).map((r, i) => [i === 0 ? first : r.capacity.value]),
});
const versionBody = (first: number) => ({
  details: { workingArea: 'full_circle' },
  notes: { deductions: [], blockIncluded: false, interpolationAllowed: false },
  document: { title: 'Invented chart for the test' },
  chart: grid(first),
});

/** A four-crane draft whose cranes 1 to 4 (slots 0 to 3) each use their own library version. */
async function fourCraneDraft() {
  const w = await makeWorld(t.ctx.dataSource);
  const a = await signedIn(t.app, w.plannerA.email);
  const crane = await a.post('/api/library/cranes').send({
    fleetNumber: `RM-${Math.random().toString(36).slice(2, 7)}`,
    make: 'Harbour Row',
    model: 'HR-60',
    type: 'mobile_outriggers',
    fixed: { pivotOffset: example.crane.pivotOffset },
  });
  expect(crane.status).toBe(201);
  const config = await a
    .post(`/api/library/cranes/${crane.body.id}/configurations`)
    .send({ name: 'Main boom', version: versionBody(28) });
  expect(config.status).toBe(201);
  const versions: string[] = [config.body.versions[0].id];
  for (const first of [27, 26, 25]) {
    const v = await a.post(`/api/library/configurations/${config.body.id}/versions`).send(versionBody(first));
    expect(v.status).toBe(201);
    versions.push(v.body.id);
  }
  const pkg = await makePackage(t.ctx.dataSource, {
    contractor: w.contractorA,
    site: w.site,
    createdBy: w.plannerA,
    status: 'draft',
  });
  for (const [slot, versionId] of versions.entries()) {
    const put = await a
      .put(`/api/packages/${pkg.id}/library-uses`)
      .send({ versionId, slot, detached: slot === 2 });
    expect(put.status).toBe(200);
  }
  return { w, a, pkg, versions };
}

/** The stored uses of the package's revisions, as [slot, version, detached], in slot order. */
async function stored(packageId: string) {
  const rows: { slot: number; version_id: string; detached: boolean }[] = await t.ctx.dataSource.query(
    `SELECT slot, version_id, detached FROM library_uses WHERE package_id = $1 ORDER BY slot`,
    [packageId],
  );
  return rows.map((r) => [r.slot, r.version_id, r.detached]);
}

describe('a crane removed from a lift with several cranes', () => {
  it('when crane 2 of four is removed, then its use goes and cranes 3 and 4 move up one slot with their own versions', async () => {
    const {
      a,
      pkg,
      versions: [v0, v1, v2, v3],
    } = await fourCraneDraft();
    void v1;
    const res = await a.post(`/api/packages/${pkg.id}/library-uses/crane-removed`).send({ slot: 1 });
    expect(res.status).toBe(200);
    expect(
      res.body.items.map((u: { slot: number; version: { id: string }; detached: boolean }) => [
        u.slot,
        u.version.id,
        u.detached,
      ]),
    ).toEqual([
      [0, v0, false],
      [1, v2, true],
      [2, v3, false],
    ]);
    expect(await stored(pkg.id)).toEqual([
      [0, v0, false],
      [1, v2, true],
      [2, v3, false],
    ]);
    const [event] = await t.ctx.dataSource.query(
      `SELECT detail FROM audit_events WHERE package_id = $1 AND action = 'library.crane_removed'`,
      [pkg.id],
    );
    expect(event.detail).toEqual({
      revision: 1,
      slot: 1,
      removed: [1],
      moved: [
        { from: 2, to: 1 },
        { from: 3, to: 2 },
      ],
    });
  });

  it('when the lift goes back to one crane, then every other crane’s use goes and the lead crane’s stays', async () => {
    const { a, pkg, versions } = await fourCraneDraft();
    const res = await a.post(`/api/packages/${pkg.id}/library-uses/crane-removed`).send({ slot: null });
    expect(res.status).toBe(200);
    expect(await stored(pkg.id)).toEqual([[0, versions[0], false]]);
  });

  it('when a crane without a library use is removed, then the later cranes’ uses still move up', async () => {
    const { a, pkg, versions } = await fourCraneDraft();
    expect((await a.delete(`/api/packages/${pkg.id}/library-uses/2`)).status).toBe(204);
    const res = await a.post(`/api/packages/${pkg.id}/library-uses/crane-removed`).send({ slot: 2 });
    expect(res.status).toBe(200);
    expect(await stored(pkg.id)).toEqual([
      [0, versions[0], false],
      [1, versions[1], false],
      [2, versions[3], false],
    ]);
  });

  it('when two removals of crane 2 arrive together, then they run one after the other and no use is lost or doubled', async () => {
    const { a, pkg, versions } = await fourCraneDraft();
    // Hold crane 2's use row so both removals are under way before either can write: without the
    // lock on the revision both would read the same uses and move them from stale slots.
    const holder = t.ctx.dataSource.createQueryRunner();
    await holder.connect();
    await holder.startTransaction();
    let both: Promise<{ status: number }[]>;
    try {
      await holder.query(`SELECT 1 FROM library_uses WHERE package_id = $1 AND slot = 1 FOR UPDATE`, [
        pkg.id,
      ]);
      const remove = () =>
        a
          .post(`/api/packages/${pkg.id}/library-uses/crane-removed`)
          .send({ slot: 1 })
          .then((r) => r);
      both = Promise.all([remove(), remove()]);
      await new Promise((resolve) => setTimeout(resolve, 400));
    } finally {
      await holder.commitTransaction();
      await holder.release();
    }
    const [one, two] = await both;
    expect([one.status, two.status]).toEqual([200, 200]);
    // The first removes crane 2 (v1) and moves v2, v3 up; the second removes the new crane 2 (v2).
    expect(await stored(pkg.id)).toEqual([
      [0, versions[0], false],
      [1, versions[3], false],
    ]);
  });

  it('when moving a use up fails part way, then nothing of the removal is kept', async () => {
    const { a, pkg, versions } = await fourCraneDraft();
    const before = await stored(pkg.id);
    const [rev] = await t.ctx.dataSource.query(`SELECT id FROM revisions WHERE package_id = $1`, [pkg.id]);
    // A refusal on the second move only (slot 3 → 2), for this revision only, after the delete and
    // the first move have run inside the transaction.
    const fn = `refuse_move_${String(rev.id).replace(/-/g, '')}`;
    await t.ctx.dataSource.query(
      `CREATE FUNCTION ${fn}() RETURNS trigger AS $$
       BEGIN
         IF NEW.revision_id = '${rev.id}' AND OLD.slot = 3 THEN RAISE EXCEPTION 'refused by the test'; END IF;
         RETURN NEW;
       END $$ LANGUAGE plpgsql`,
    );
    await t.ctx.dataSource.query(
      `CREATE TRIGGER ${fn} BEFORE UPDATE ON library_uses FOR EACH ROW EXECUTE FUNCTION ${fn}()`,
    );
    try {
      const res = await a.post(`/api/packages/${pkg.id}/library-uses/crane-removed`).send({ slot: 1 });
      expect(res.status).toBe(500);
    } finally {
      await t.ctx.dataSource.query(`DROP TRIGGER ${fn} ON library_uses`);
      await t.ctx.dataSource.query(`DROP FUNCTION ${fn}()`);
    }
    expect(await stored(pkg.id)).toEqual(before);
    expect(before.map((r) => r[1])).toEqual(versions);
    const events = await t.ctx.dataSource.query(
      `SELECT 1 FROM audit_events WHERE package_id = $1 AND action = 'library.crane_removed'`,
      [pkg.id],
    );
    expect(events).toEqual([]);
  });

  it('when the slot is the lead crane or out of range, then 400 names the field and nothing changes', async () => {
    const { a, pkg, versions } = await fourCraneDraft();
    const lead = await a.post(`/api/packages/${pkg.id}/library-uses/crane-removed`).send({ slot: 0 });
    expect(lead.status).toBe(400);
    expect(lead.body.error.fields).toEqual([
      { path: 'slot', message: 'Slot must be 1 to 3: the lead crane (0) is not removed this way' },
    ]);
    const missing = await a.post(`/api/packages/${pkg.id}/library-uses/crane-removed`).send({});
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields[0].path).toBe('slot');
    expect((await stored(pkg.id)).map((r) => r[1])).toEqual(versions);
  });

  it('when the revision is submitted, or the package is another contractor’s, then the uses stay as they were', async () => {
    const { w, a, pkg, versions } = await fourCraneDraft();
    const b = await signedIn(t.app, w.plannerB.email);
    const theirs = await b.post(`/api/packages/${pkg.id}/library-uses/crane-removed`).send({ slot: 1 });
    expect(theirs.status).toBe(404);
    const reviewer = await signedIn(t.app, w.reviewer.email);
    expect(
      (await reviewer.post(`/api/packages/${pkg.id}/library-uses/crane-removed`).send({ slot: 1 })).status,
    ).toBe(403);
    await t.ctx.dataSource.query(
      `UPDATE revisions SET state = 'submitted', submitted_at = now() WHERE package_id = $1`,
      [pkg.id],
    );
    const frozen = await a.post(`/api/packages/${pkg.id}/library-uses/crane-removed`).send({ slot: 1 });
    expect(frozen.status).toBe(409);
    expect(frozen.body.error.message).toBe(
      'Revision 1 is submitted; the crane it used can no longer change.',
    );
    expect((await stored(pkg.id)).map((r) => r[1])).toEqual(versions);
  });
});
