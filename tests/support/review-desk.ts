// A review desk for API tests: a world with everyone signed in, a package taken through
// draft, upload, submit and the check run, and the text of a PDF through pdftotext.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type TestAgent from 'supertest/lib/agent';
import { expect } from 'vitest';
import { runCheckRun } from '@server/modules/check-runs/service';
import { signedIn, type TestApp } from './app';
import { makeWorld } from './factories';
import { makePdf } from './pdfs';

export const passing = JSON.parse(
  fs.readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'),
);

export type World = Awaited<ReturnType<typeof makeWorld>>;
export type Agent = InstanceType<typeof TestAgent>;

/** A contractor's package through draft, upload, submit and the check run. */
export async function submitted(
  t: TestApp,
  w: World,
  contractor: Agent,
  inputs: unknown = passing,
  title = 'Set the drive unit',
  date = '2027-03-14',
  /** Names of one-page supporting PDFs uploaded beside the plan. */
  supporting: string[] = [],
) {
  const created = await contractor
    .post('/api/packages')
    .send({ title, siteId: w.site.id, plannedLiftDate: date });
  const id = created.body.package.id as string;
  await contractor.put(`/api/packages/${id}/draft`).send({ inputs });
  const up = await contractor
    .post(`/api/packages/${id}/files`)
    .field('kind', 'lift_plan')
    .attach('file', Buffer.from(await makePdf(2)), 'plan.pdf');
  expect(up.status).toBe(201);
  for (const name of supporting) {
    const added = await contractor
      .post(`/api/packages/${id}/files`)
      .field('kind', 'supporting')
      .attach('file', Buffer.from(await makePdf(1, name)), name);
    expect(added.status).toBe(201);
  }
  const sub = await contractor.post(`/api/packages/${id}/submit`);
  expect(sub.status).toBe(202);
  await runCheckRun(t.ctx.dataSource, sub.body.current.id);
  return { id, fileId: up.body.id as string, revisionId: sub.body.current.id as string };
}

/** A new world with its contractor, reviewer and engineer signed in. */
export async function desk(t: TestApp) {
  const w = await makeWorld(t.ctx.dataSource);
  const [contractor, reviewer, engineer] = await Promise.all([
    signedIn(t.app, w.plannerA.email),
    signedIn(t.app, w.reviewer.email),
    signedIn(t.app, w.engineer.email),
  ]);
  return { w, contractor, reviewer, engineer };
}

/** The text of a PDF (or of one page of it), laid out as on the page. */
export async function pdftotext(bytes: Buffer, first?: number): Promise<string> {
  const file = path.join(os.tmpdir(), `return-${Date.now()}-${Math.random()}.pdf`);
  fs.writeFileSync(file, bytes);
  try {
    return execFileSync(
      'pdftotext',
      [...(first ? ['-f', String(first), '-l', String(first)] : []), '-layout', file, '-'],
      { encoding: 'utf8' },
    );
  } finally {
    fs.rmSync(file, { force: true });
  }
}
