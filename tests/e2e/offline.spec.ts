/**
 * In the garden with no signal, on a phone, with the built app's service worker: harvests logged
 * offline wait on the phone, the form is free at once, and they reach the server once each, in the
 * order logged; the Log page opens offline after one visit and its queue survives a reload; a page
 * never visited shows the offline page; a refused entry is shown, not retried; and a session that
 * ended holds the queue until the grower signs in again.
 */
import type { BrowserContext, Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { allHarvests, allPurchases, foodId, makeCrop } from '../support/entries';
import { testPool } from '../support/env';
import { startSignalProxy, type Signal } from '../support/signal-proxy';
import { apiAs, createHousehold, newVerifiedUser, signIn, BASE_URL, type TestUser } from '../support/users';

// The browser reaches the app only through a proxy the tests can cut (tests/support/signal-proxy.ts).
let signal: Signal;

test.use({
  viewport: { width: 390, height: 844 },
  isMobile: true,
  hasTouch: true,
  deviceScaleFactor: 2,
  serviceWorkers: 'allow',
  proxy: async ({}, use) => {
    signal = await startSignalProxy(BASE_URL);
    await use({ server: signal.url });
    await signal.close();
  },
});

async function signInAs(context: BrowserContext, user: TestUser) {
  await context.addCookies(
    user.cookie.split('; ').map((pair) => {
      const i = pair.indexOf('=');
      return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
    }),
  );
}

async function potatoPlot(context: BrowserContext, name: string) {
  const owner = await newVerifiedUser({ name: 'Oona Offline' });
  const h = await createHousehold(owner.cookie, { name, timezone: 'Europe/London', units: 'metric' });
  // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
  const crop = await makeCrop(owner.cookie, h.id, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  await signInAs(context, owner);
  return { owner, h, crop };
}

/** The page has heard it has no signal (Chromium tells it a moment after setOffline returns). */
async function offlineHeard(page: Page) {
  await page.waitForFunction(() => !navigator.onLine);
  // One more turn of the page's event loop: the `offline` event the app listens to has run.
  await page.evaluate(() => new Promise((resolve) => setTimeout(resolve, 0)));
}

/**
 * No signal: nothing reaches the app (the proxy is cut), and the browser says it is offline, as a
 * phone does. The emulation alone is not enough: a request from a page the service worker controls
 * has been seen to reach the server under it.
 */
async function noSignal(context: BrowserContext, page: Page) {
  signal.cut();
  await context.setOffline(true);
  await offlineHeard(page);
}

async function signalBack(context: BrowserContext) {
  signal.restore();
  await context.setOffline(false);
}

/** Opens the Log page and waits until the service worker controls it and has kept the page and its crops. */
async function visitLogOnline(page: Page, hid: number) {
  await page.goto(`/households/${hid}/log`);
  await expect(page.getByText('Potato', { exact: true })).toBeVisible();
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
  // The first visit is kept once the worker controls the page (app-caches.ts keepFirstVisit).
  const kept = () =>
    page.evaluate(async () => {
      const urls = async (name: string) => (await (await caches.open(name)).keys()).map((r) => new URL(r.url).pathname);
      return [...(await urls('selfsown-pages')), ...(await urls('selfsown-api'))];
    });
  await expect.poll(kept).toEqual(expect.arrayContaining([`/households/${hid}/log`, `/api/households/${hid}/crops`]));
}

async function logHarvest(page: Page, kg: string) {
  await page.getByText('Potato', { exact: true }).tap();
  await page.getByLabel('Weight', { exact: true }).fill(kg);
  await page.getByRole('button', { name: 'Save harvest' }).tap();
}

/** The form is ready for the next weighing: weight cleared, Save enabled — within a second, not after a request. */
async function expectFormFree(page: Page) {
  await expect(page.getByLabel('Weight', { exact: true })).toHaveValue('', { timeout: 1_000 });
  await expect(page.getByRole('button', { name: 'Save harvest' })).toBeEnabled({ timeout: 1_000 });
}

const quantitiesInOrder = (hs: { id: number; quantity: number }[]) => [...hs].sort((a, b) => a.id - b.id).map((h) => h.quantity);

test('three harvests logged offline wait on the phone and reach the server once each, in order', async ({ page, context }) => {
  const { owner, h } = await potatoPlot(context, 'No-signal plot');
  await visitLogOnline(page, h.id);

  await noSignal(context, page);
  const waiting = page.getByTestId('waiting');
  const weights = ['1.5', '2', '0.25'];
  for (const [i, kg] of weights.entries()) {
    await logHarvest(page, kg);
    await expectFormFree(page);
    await expect(waiting).toContainText(i === 0 ? '1 entry is waiting to send' : `${i + 1} entries are waiting to send`);
    await expect(waiting).toContainText(`${kg} kg Potato — fresh`);
  }
  // Kept on the device, under this person and household.
  const stored = await page.evaluate(() => Object.keys(localStorage).filter((k) => k.startsWith('selfsown:queue:')));
  expect(stored).toEqual([`selfsown:queue:v1:${encodeURIComponent(owner.id)}:${h.id}`]);
  expect((await allHarvests(owner.cookie, h.id)).total).toBe(0);

  await signalBack(context);
  await expect(waiting).toHaveCount(0, { timeout: 20_000 });
  await expect(page.getByTestId('just-saved')).toContainText('Sent and saved');
  const after = await allHarvests(owner.cookie, h.id);
  expect(after.total).toBe(3);
  expect(quantitiesInOrder(after.harvests)).toEqual([1.5, 2, 0.25]);
  expect(await page.evaluate(() => Object.keys(localStorage).filter((k) => k.startsWith('selfsown:queue:')))).toEqual([]);
});

test('the Log page opens offline after one visit, its queue survives a reload, and an unvisited page shows the offline page', async ({ page, context }) => {
  const { owner, h } = await potatoPlot(context, 'Reload plot');
  await visitLogOnline(page, h.id);
  await noSignal(context, page);
  // A page never opened: the worker's offline page (proves the worker's own requests are offline too).
  await page.goto(`/households/${h.id}/share`);
  await expect(page.getByTestId('offline-page')).toContainText('No connection');
  // The browser's requests do go through the proxy (the visit before the cut was passed on).
  expect(signal.counts.passed).toBeGreaterThan(0);

  // The Log page, from the worker's copy, with the crop chips from the kept crops list.
  await page.goto(`/households/${h.id}/log`);
  await expect(page.getByRole('heading', { name: 'Log a harvest' })).toBeVisible();
  await offlineHeard(page);
  await expect(page.getByText('Potato', { exact: true })).toBeVisible();
  await logHarvest(page, '4');
  await expectFormFree(page);
  await expect(page.getByTestId('waiting')).toContainText('4 kg Potato — fresh');

  await page.reload();
  await expect(page.getByTestId('waiting')).toContainText('1 entry is waiting to send');
  await expect(page.getByTestId('waiting')).toContainText('4 kg Potato — fresh');
  expect((await allHarvests(owner.cookie, h.id)).total).toBe(0);

  await signalBack(context);
  await expect(page.getByTestId('waiting')).toHaveCount(0, { timeout: 20_000 });
  await expect(page.getByTestId('just-saved')).toContainText('4 kg Potato — fresh');
  const after = await allHarvests(owner.cookie, h.id);
  expect(after.total).toBe(1);
  expect(after.harvests[0].quantity).toBe(4);
});

test('a split weighing and a staple’s one tap logged offline are sent once each, by whichever entry page is open', async ({ page, context }) => {
  const { owner, h } = await potatoPlot(context, 'Split and staples plot');
  // USDA SR28, NDB 20081 "Wheat flour, white, all-purpose, enriched, bleached"
  const staple = await apiAs(owner.cookie, 'POST', `/api/households/${h.id}/staples`, { foodId: await foodId('20081'), label: 'Flour sack', quantity: 25, unit: 'kg', spreadMonths: 6 });
  expect(staple.status).toBe(201);
  await visitLogOnline(page, h.id);
  await page.goto(`/households/${h.id}/bought`);
  await expect(page.getByTestId('staples')).toContainText('Flour sack');

  await noSignal(context, page);
  await page.getByTestId('staples').getByRole('button').first().tap();
  await expect(page.getByTestId('purchase-waiting')).toContainText('25 kg Flour sack — over 6 months');
  await expect(page.getByTestId('purchase-waiting')).toContainText('waiting to send');

  await page.goto(`/households/${h.id}/log`);
  await offlineHeard(page);
  await page.getByText('Potato', { exact: true }).tap();
  await page.getByLabel('Weight', { exact: true }).fill('10');
  await page.getByRole('button', { name: 'Split this weighing between uses' }).tap();
  await page.getByLabel('Part 1', { exact: true }).fill('3');
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expectFormFree(page);
  await expect(page.getByTestId('waiting')).toContainText('10 kg Potato — 3 kg fresh, 7 kg stored');
  expect((await allPurchases(owner.cookie, h.id)).total).toBe(0);

  // Back online on the Log page: the split and the staple waiting from the Bought page both go.
  await signalBack(context);
  await expect(page.getByTestId('waiting')).toHaveCount(0, { timeout: 20_000 });
  await expect.poll(async () => (await allPurchases(owner.cookie, h.id)).total, { timeout: 20_000 }).toBe(1);
  const harvests = await allHarvests(owner.cookie, h.id);
  expect(harvests.total).toBe(2);
  expect(new Set(harvests.harvests.map((x: { splitGroup: string | null }) => x.splitGroup)).size).toBe(1);
  expect(harvests.harvests[0].splitGroup).not.toBeNull();
  const purchase = (await allPurchases(owner.cookie, h.id)).purchases[0];
  expect(purchase).toMatchObject({ quantity: 25, unit: 'kg', spreadMonths: 6 });
});

test('an entry the server refuses after waiting is shown with its reason and not sent again', async ({ page, context }) => {
  const { owner, h, crop } = await potatoPlot(context, 'Refused plot');
  await visitLogOnline(page, h.id);
  let posts = 0;
  page.on('request', (r) => {
    if (r.method() === 'POST' && r.url().endsWith(`/api/households/${h.id}/harvests`)) posts += 1;
  });

  await noSignal(context, page);
  await logHarvest(page, '3');
  await expect(page.getByTestId('waiting')).toContainText('1 entry is waiting to send');
  // Meanwhile, on another phone, the crop is deleted: the waiting entry names a crop that is gone.
  expect((await apiAs(owner.cookie, 'DELETE', `/api/households/${h.id}/crops/${crop.id}`)).status).toBe(204);

  await signalBack(context);
  const refused = page.getByTestId('waiting').getByRole('alert');
  await expect(refused).toContainText('Not saved: 3 kg Potato — fresh');
  await page.waitForTimeout(3_000);
  expect(posts).toBe(1);
  await page.getByRole('button', { name: 'Discard it' }).tap();
  await expect(page.getByTestId('waiting')).toHaveCount(0);
  expect((await allHarvests(owner.cookie, h.id)).total).toBe(0);
});

test('a session that ended holds the queue until the grower signs in again, then it is sent once', async ({ page, context }) => {
  const { owner, h } = await potatoPlot(context, 'Expired plot');
  await visitLogOnline(page, h.id);

  // The session ends while the page is open.
  const pool = testPool();
  try {
    await pool.query('UPDATE session SET expires_at = NOW(3) - INTERVAL 1 MINUTE WHERE user_id = ?', [owner.id]);
  } finally {
    await pool.end();
  }

  await logHarvest(page, '2.5');
  await expectFormFree(page);
  const waiting = page.getByTestId('waiting');
  await expect(waiting).toContainText('2.5 kg Potato — fresh');
  await expect(page.getByTestId('queue-sign-in')).toContainText('You are signed out');

  await page.getByRole('link', { name: 'Sign in to send them' }).tap();
  await expect(page).toHaveURL(/\/sign-in\?next=/);
  await page.getByLabel('E-mail').fill(owner.email);
  await page.getByLabel('Password').fill(owner.password);
  await page.getByRole('button', { name: 'Sign in' }).tap();

  await expect(page).toHaveURL(new RegExp(`/households/${h.id}/log$`));
  await expect(page.getByTestId('just-saved')).toContainText('Sent and saved');
  await expect(waiting).toHaveCount(0);
  const fresh = await signIn(owner.email, owner.password);
  const after = await allHarvests(fresh.cookie, h.id);
  expect(after.total).toBe(1);
  expect(after.harvests[0].quantity).toBe(2.5);
  // Sent once: another visit sends nothing more.
  await page.reload();
  await expect(page.getByRole('heading', { name: 'Log a harvest' })).toBeVisible();
  expect((await allHarvests(fresh.cookie, h.id)).total).toBe(1);
});
