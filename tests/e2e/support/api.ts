// Setting the scene through the API, for tests whose subject is a later step (keyboard use of
// the queue and the workspace): packages submitted, assigned and commented on by the same
// routes the client uses. The flows test does all of this through the pages instead.
import fs from 'node:fs';
import { request, type APIRequestContext } from 'playwright-core';
import { DEMO_PASSWORD } from '@server/db/seed/demo-accounts';
import { env, eventually, PEOPLE, WAIT, type Person } from './browser';
import { liftPlanPdf } from './pdf';

export async function apiAs(person: Person): Promise<APIRequestContext> {
  // The desk's pages send the CSRF guard header with every change; so does this context.
  const api = await request.newContext({ baseURL: env().baseUrl, extraHTTPHeaders: { 'X-CSRF-Guard': '1' } });
  const res = await api.post('/api/auth/sign-in', {
    data: { email: PEOPLE[person], password: DEMO_PASSWORD },
  });
  if (res.status() !== 200) throw new Error(`sign-in of ${person} answered ${res.status()}`);
  return api;
}

async function ok<T>(what: string, response: Promise<import('playwright-core').APIResponse>): Promise<T> {
  const res = await response;
  if (!res.ok()) throw new Error(`${what} answered ${res.status()}: ${await res.text()}`);
  return (await res.json()) as T;
}

const INPUTS = {
  schemaVersion: 1,
  crane: {
    type: 'mobile_outriggers',
    name: 'Brackwater BL-60 all-terrain',
    boomLength: { value: 30.5, unit: 'm' },
    radius: { value: 12, unit: 'm' },
  },
  chart: {
    name: 'BL-60 main boom',
    rows: [
      {
        radius: { value: 10, unit: 'm' },
        boomLength: { value: 30.5, unit: 'm' },
        capacity: { value: 22.5, unit: 't' },
      },
      {
        radius: { value: 12, unit: 'm' },
        boomLength: { value: 30.5, unit: 'm' },
        capacity: { value: 18.2, unit: 't' },
      },
    ],
  },
  load: { description: 'Valve skid', weight: { value: 6, unit: 't' } },
};

type Detail = { package: { id: string; reference: string; status: string } };

/**
 * A package of the demo contractor at the refinery, submitted and checked (ready for review).
 * The lift plan is made here with `pages` sheets unless a PDF file of the test's own is given.
 */
export async function submittedPackage(
  contractor: APIRequestContext,
  title: string,
  pages = 3,
  planFile?: string,
) {
  const sites = await ok<{ items: { id: string; name: string }[] }>('sites', contractor.get('/api/sites'));
  const site = sites.items.find((s) => s.name.includes('Refinery')) ?? sites.items[0];
  const created = await ok<Detail>(
    'create',
    contractor.post('/api/packages', { data: { title, siteId: site.id, plannedLiftDate: null } }),
  );
  const id = created.package.id;
  await ok('draft', contractor.put(`/api/packages/${id}/draft`, { data: { inputs: INPUTS } }));
  const pdf = planFile ?? (await liftPlanPdf(`${id}.pdf`, pages, title));
  await ok(
    'upload',
    contractor.post(`/api/packages/${id}/files`, {
      multipart: {
        kind: 'lift_plan',
        file: { name: 'plan.pdf', mimeType: 'application/pdf', buffer: fs.readFileSync(pdf) },
      },
    }),
  );
  await ok('submit', contractor.post(`/api/packages/${id}/submit`));
  await eventually(
    `${title} to be ready for review`,
    async () =>
      (await ok<Detail>('package', contractor.get(`/api/packages/${id}`))).package.status ===
      'ready_for_review',
    WAIT.job,
  );
  return { id, reference: created.package.reference };
}

export async function engineerId(reviewer: APIRequestContext, name: string) {
  const list = await ok<{ items: { id: string; name: string }[] }>(
    'engineers',
    reviewer.get('/api/engineers'),
  );
  return list.items.find((e) => e.name.startsWith(name))!.id;
}

export async function assign(reviewer: APIRequestContext, packageIds: string[], engineer: string) {
  await ok('assign', reviewer.post('/api/assignments', { data: { packageIds, engineerId: engineer } }));
}

export async function addFinding(
  engineer: APIRequestContext,
  packageId: string,
  body: { text: string; severity: string; fileId?: string; pageNumber?: number },
) {
  return ok<{ id: string }>('finding', engineer.post(`/api/packages/${packageId}/findings`, { data: body }));
}

export async function planFileId(api: APIRequestContext, packageId: string) {
  const detail = await ok<{ current: { files: { id: string; kind: string }[] } }>(
    'package',
    api.get(`/api/packages/${packageId}`),
  );
  return detail.current.files.find((f) => f.kind === 'lift_plan')!.id;
}
