// Two people on one package: the coordinator has the package page open while another
// coordinator's session assigns the engineer; the open page shows the assignment without a
// reload. The engineer's open desk counts the hand-off in the rail and lists it.
import type { APIRequestContext, Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { close, launch, screenshot, screenshotOnFailure, signedIn, unique, WAIT } from './support/browser';
import { apiAs, assign, engineerId, submittedPackage } from './support/api';

let browser: Browser;
let contractor: APIRequestContext;
let otherCoordinator: APIRequestContext;

screenshotOnFailure();
beforeAll(async () => {
  browser = await launch();
  [contractor, otherCoordinator] = await Promise.all([apiAs('contractor'), apiAs('reviewer')]);
});
afterAll(async () => {
  await Promise.all([contractor?.dispose(), otherCoordinator?.dispose()]);
  await close(browser);
});

describe('live updates', () => {
  it("when someone else assigns the package, then the open package page and the engineer's rail show it without a reload", async () => {
    const pkg = await submittedPackage(contractor, unique('E2E live'), 1);
    const coordinator = await signedIn(browser, 'reviewer');
    const engineer = await signedIn(browser, 'engineer');
    await coordinator.page.goto(`/packages/${pkg.id}`);
    const heading = coordinator.page.getByRole('heading', { level: 1 });
    await heading.waitFor();
    await coordinator.page.getByText('Ready for review').first().waitFor({ timeout: WAIT.ui });
    await engineer.page.goto('/assigned');
    const rail = engineer.page.getByRole('navigation', { name: 'Main' });
    const handOffs = rail.getByRole('button', { name: /^Hand-offs/ });
    await handOffs.waitFor();
    const before = Number(/(\d+) unread/.exec((await handOffs.textContent()) ?? '')?.[1] ?? 0);
    // Both pages are listening before the change is made.
    await coordinator.page.waitForTimeout(500);
    let reloads = 0;
    coordinator.page.on('load', () => (reloads += 1));

    await assign(otherCoordinator, [pkg.id], await engineerId(otherCoordinator, 'Dev Marsh'));

    await coordinator.page.getByText('With engineer').first().waitFor({ timeout: WAIT.ui });
    await coordinator.page
      .getByText(/Dev Marsh/)
      .first()
      .waitFor({ timeout: WAIT.ui });
    expect(reloads).toBe(0);
    await screenshot(coordinator.page, 'live-package-assigned');

    await expect
      .poll(async () => Number(/(\d+)/.exec((await handOffs.textContent()) ?? '')?.[1] ?? 0), {
        timeout: WAIT.ui,
      })
      .toBeGreaterThan(before);
    await handOffs.click();
    const dialog = engineer.page.getByRole('dialog', { name: 'Hand-offs to you' });
    const item = dialog.getByRole('listitem').filter({ hasText: pkg.reference }).first();
    await item.waitFor();
    await expect(item.textContent()).resolves.toContain('Assigned to you');
    await screenshot(engineer.page, 'hand-offs-dialog');
    await item.getByRole('link').click();
    await engineer.page.waitForURL(new RegExp(`/packages/${pkg.id}$`));
    await Promise.all([coordinator.context.close(), engineer.context.close()]);
  });
});
