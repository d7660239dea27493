// One unit system per document, chosen by the job: the stamped return of a metric package is
// metric throughout whoever decides and issues it (an engineer and a coordinator set to US units),
// the reverse for a package created by a contractor set to US units; a site's own setting
// overrides the package's; the system is fixed when the return is issued. Quantities typed into
// findings and conditions print as typed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '@server/config';
import { buildReturn } from '@server/modules/returns/service';
import { signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { desk, pdftotext, submitted } from '../support/review-desk';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

const sql = (text: string, params: unknown[] = []) => t.ctx.dataSource.query(text, params);
const flat = (text: string) => text.replace(/\s+/g, ' ');

/** US customary units as the sheet writes them, after a number or in a unit position. */
const US_UNITS = /\b(kip|kips|ft|psf|psi|lb|mph|ton)\b|ft²|lb·ft|kip·ft/;
/** Metric units written after a number ("12.0 m", "16.0 t", "85 kPa", "3.2 kN·m"). */
const METRIC_UNITS = /\d\s?(m|mm|kg|t|kN|kPa|Pa|m²|m\/s|km\/h|kN·m|t·m)(?![A-Za-z])/;

const FINDING = 'Mats 1.2 m; fence 3 ft.';
const CONDITIONS = 'Lift only with 20 mph of wind or less; a 6 t test weight first.';

async function setUnits(email: string, system: 'metric' | 'imperial') {
  await sql(`UPDATE users SET unit_system = $2 WHERE email = $1`, [email, system]);
}

/** A package decided Accepted as noted with a typed finding and conditions, issued and built. */
async function issuedReturn(d: Awaited<ReturnType<typeof desk>>, beforeBuild?: () => Promise<void>) {
  const p = await submitted(t, d.w, d.contractor);
  await d.reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: d.w.engineer.id });
  const finding = await d.engineer
    .post(`/api/packages/${p.id}/findings`)
    .send({ text: FINDING, severity: 'minor', checkId: 'ground-bearing' });
  expect(finding.status).toBe(201);
  const version = (await d.engineer.get(`/api/packages/${p.id}`)).body.package.version;
  const decided = await d.engineer.post(`/api/packages/${p.id}/decision`).send({
    decision: 'accepted_as_noted',
    conditions: CONDITIONS,
    password: TEST_PASSWORD,
    baseVersion: version,
  });
  expect(decided.status).toBe(200);
  const issued = await d.reviewer.post(`/api/packages/${p.id}/returns`);
  expect(issued.status).toBe(202);
  await beforeBuild?.();
  await buildReturn(t.ctx.dataSource, t.ctx.storage, issued.body.id, appUrl(t.ctx.config));
  const file = await d.contractor.get(`/api/packages/${p.id}/returns/${issued.body.id}/file`).buffer(true);
  expect(file.status).toBe(200);
  const listed = await d.reviewer.get(`/api/packages/${p.id}/returns`);
  const detail = await d.reviewer.get(`/api/packages/${p.id}`);
  return { p, file: file.body as Buffer, listed: listed.body.items[0], detail: detail.body };
}

/** The calculation sheet's text (the plan has 2 pages) and the stamp page's, typed texts left out. */
async function documentText(file: Buffer) {
  const all = flat(await pdftotext(file));
  const stamp = flat(await pdftotext(file, 1));
  const sheet = all.slice(all.indexOf(flat(await pdftotext(file, 3)).slice(0, 40)));
  return { all, stamp, sheet };
}

const withoutTyped = (text: string) =>
  [FINDING, CONDITIONS].reduce((out, typed) => out.split(typed).join(' '), text);

describe('the unit system of the stamped return', () => {
  it('when a metric package is decided by an engineer and issued by a coordinator both set to US units, then the whole return is metric and the typed texts print as typed', async () => {
    const d = await desk(t);
    await setUnits(d.w.engineer.email, 'imperial');
    await setUnits(d.w.reviewer.email, 'imperial');
    // Sign in again so the sessions carry the new setting.
    const engineer = await signedIn(t.app, d.w.engineer.email);
    const reviewer = await signedIn(t.app, d.w.reviewer.email);
    const r = await issuedReturn({ ...d, engineer, reviewer });
    expect(r.detail.documentUnits).toEqual({ system: 'metric', source: 'package' });
    expect(r.listed.unitSystem).toBe('metric');
    const { all, sheet } = await documentText(r.file);
    expect(all).toContain(FINDING);
    expect(all).toContain(CONDITIONS);
    expect(sheet).toContain('figures in metric (m, t, kN, kPa) units');
    expect(sheet).toMatch(/\d t\b/);
    expect(sheet).toMatch(/\d kPa\b/);
    expect(withoutTyped(all).match(US_UNITS)).toBeNull();
  }, 60_000);

  it('when the contractor set to US units creates the package, then the return is US customary throughout, inputs entered in metres converted', async () => {
    const d = await desk(t);
    await setUnits(d.w.plannerA.email, 'imperial');
    const contractor = await signedIn(t.app, d.w.plannerA.email);
    const r = await issuedReturn({ ...d, contractor });
    expect(r.detail.documentUnits).toEqual({ system: 'imperial', source: 'package' });
    expect(r.listed.unitSystem).toBe('imperial');
    const { all, sheet } = await documentText(r.file);
    expect(all).toContain(FINDING);
    expect(all).toContain(CONDITIONS);
    expect(sheet).toContain('figures in US customary (ft, lb, kip, psf) units');
    expect(sheet).toContain("converted to this document's US customary (ft, lb, kip, psf) units");
    // The boom of 30.5 m entered prints as 100.1 ft; the recomputed figures are in kip and ft.
    expect(sheet).toContain('100.1 ft');
    expect(sheet).toMatch(/\d kip\b/);
    expect(sheet).toMatch(/\d psf\b/);
    expect(withoutTyped(all).match(METRIC_UNITS)).toBeNull();
  }, 60_000);

  it("when the site's admin sets US units, then the site's packages are issued in them; a change after the return is issued does not move it", async () => {
    const d = await desk(t);
    const admin = await signedIn(t.app, d.w.admin.email);
    const patched = await admin.patch(`/api/admin/sites/${d.w.site.id}`).send({ unitSystem: 'imperial' });
    expect(patched.status).toBe(200);
    expect(patched.body).toMatchObject({ unitSystem: 'imperial', timeZone: 'UTC' });
    const r = await issuedReturn(d, async () => {
      // Issued in US units; the admin changes the site back before the return is built.
      await admin.patch(`/api/admin/sites/${d.w.site.id}`).send({ unitSystem: null });
    });
    expect(r.listed.unitSystem).toBe('imperial');
    expect(r.detail.documentUnits).toEqual({ system: 'metric', source: 'package' });
    const { all } = await documentText(r.file);
    expect(withoutTyped(all).match(METRIC_UNITS)).toBeNull();
    const bad = await admin.patch(`/api/admin/sites/${d.w.site.id}`).send({ unitSystem: 'furlongs' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual([
      { path: 'unitSystem', message: expect.stringContaining('metric') },
    ]);
  }, 60_000);

  it('when a site is renamed, then its other settings stay as they were', async () => {
    const d = await desk(t);
    const admin = await signedIn(t.app, d.w.admin.email);
    await admin
      .patch(`/api/admin/sites/${d.w.site.id}`)
      .send({ unitSystem: 'imperial', timeZone: 'America/Chicago', address: '1 Quay Road' });
    const renamed = await admin.patch(`/api/admin/sites/${d.w.site.id}`).send({ name: 'Renamed site' });
    expect(renamed.body).toMatchObject({
      name: 'Renamed site',
      unitSystem: 'imperial',
      timeZone: 'America/Chicago',
      address: '1 Quay Road',
    });
  });
});
