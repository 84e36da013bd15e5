/**
 * The app server restarted while a grower is logging (issue 15, faults), with the real entry queue
 * of the Log page (src/components/entries/entry-queue.ts): a harvest saved while the server is down
 * waits on the device and arrives once the server is back, and one whose first send reached the
 * server — which stored it, then died before its answer left — is sent again with the same
 * Idempotency-Key and stored once. The session cookie from before the restart still works.
 */
import type { BrowserContext, Page, Request } from '@playwright/test';
import { expect, test } from '../e2e/fixtures';
import { allHarvests, makeCrop } from '../support/entries';
import { createHousehold, newVerifiedUser, BASE_URL, type TestUser } from '../support/users';
import { startApp, type AppServer } from './harness';

test.describe.configure({ mode: 'serial' });

let app: AppServer;
test.beforeAll(async () => {
  app = await startApp();
});
test.afterAll(async () => {
  await app?.stop();
});

async function signInAs(context: BrowserContext, user: TestUser) {
  await context.addCookies(
    user.cookie.split('; ').map((pair) => {
      const i = pair.indexOf('=');
      return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
    }),
  );
}

async function plotWithPotatoes(context: BrowserContext, name: string) {
  const owner = await newVerifiedUser({ name: 'Quinn Queue' });
  const h = await createHousehold(owner.cookie, { name, timezone: 'Europe/London', units: 'metric' });
  await makeCrop(owner.cookie, h.id, { name: 'Potato', foodId: null, category: 'root_tuber' });
  await signInAs(context, owner);
  return { owner, h };
}

async function logHarvest(page: Page, kg: string) {
  await page.getByText('Potato', { exact: true }).click();
  await page.getByLabel('Weight', { exact: true }).fill(kg);
  await page.getByRole('button', { name: 'Save harvest' }).click();
}

const harvestPosts = (hid: number) => (r: Request) => r.method() === 'POST' && new URL(r.url()).pathname === `/api/households/${hid}/harvests`;

test('a harvest saved while the app server is down waits on the device and arrives once after the restart', async ({ page, context }) => {
  const { owner, h } = await plotWithPotatoes(context, 'Restart plot');
  await page.goto(`/households/${h.id}/log`);
  await expect(page.getByText('Potato', { exact: true })).toBeVisible();

  await app.stop();
  await logHarvest(page, '1.5');
  await expect(page.getByTestId('waiting')).toContainText('1 entry is waiting to send', { timeout: 15_000 });
  await expect(page.getByTestId('waiting')).toContainText('1.5 kg Potato — fresh');

  app = await startApp();
  // The queue's own retry (2 s doubling, at most 30 s) finds the server back.
  await expect(page.getByTestId('waiting')).toHaveCount(0, { timeout: 45_000 });
  const stored = await allHarvests(owner.cookie, h.id);
  expect(stored.total).toBe(1);
  expect(stored.harvests[0].quantity).toBe(1.5);
  // The session from before the restart still opens the page (no trip to sign-in).
  await page.reload();
  await expect(page).toHaveURL(new RegExp(`/households/${h.id}/log$`));
  await expect(page.getByText('Potato', { exact: true })).toBeVisible();
});

test('a harvest stored just before the server died, its answer lost, is sent again with its key and stored once', async ({ page, context }) => {
  const { owner, h } = await plotWithPotatoes(context, 'Lost answer plot');
  await page.goto(`/households/${h.id}/log`);
  await expect(page.getByText('Potato', { exact: true })).toBeVisible();

  const keys: string[] = [];
  page.on('request', (r) => {
    if (harvestPosts(h.id)(r)) keys.push(r.headers()['idempotency-key'] ?? '');
  });
  let firstStatus = 0;
  // The first send goes through to the server, which stores the harvest; then the server is
  // killed and the answer never reaches the page (the connection is reset).
  await page.route(`**/api/households/${h.id}/harvests`, async (route) => {
    if (route.request().method() !== 'POST' || firstStatus) return route.continue();
    const answer = await route.fetch();
    firstStatus = answer.status();
    await app.kill();
    await route.abort('connectionreset');
  });
  await logHarvest(page, '2');
  await expect(page.getByTestId('waiting')).toContainText('1 entry is waiting to send', { timeout: 15_000 });
  expect(firstStatus).toBe(201);

  app = await startApp();
  const stored = await allHarvests(owner.cookie, h.id);
  expect(stored.total).toBe(1); // the first send was stored before the server died
  const replayed = page.waitForResponse((r) => harvestPosts(h.id)(r.request()) && r.headers()['idempotency-replayed'] === 'true', { timeout: 45_000 });
  await page.unroute(`**/api/households/${h.id}/harvests`);
  await expect(page.getByTestId('waiting')).toHaveCount(0, { timeout: 45_000 });
  expect((await replayed).status()).toBe(201);
  expect(keys.length).toBeGreaterThanOrEqual(2);
  expect(new Set(keys).size).toBe(1);
  expect(keys[0]).not.toBe('');
  const after = await allHarvests(owner.cookie, h.id);
  expect(after.total).toBe(1);
  expect(after.harvests[0].quantity).toBe(2);
});
