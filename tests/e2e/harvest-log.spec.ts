/**
 * The harvest form on a phone: a grower logs a weighing, finds it in the harvest log and undoes it;
 * and an entry whose request fails is kept on the phone, sent later, and stored exactly once.
 */
import { expect, test, type BrowserContext, type Page } from '@playwright/test';
import { allHarvests, foodId, makeCrop } from '../support/entries';
import { BASE_URL, createHousehold, newVerifiedUser, type TestUser } from '../support/users';

test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });

async function signInAs(context: BrowserContext, user: TestUser) {
  await context.addCookies(
    user.cookie.split('; ').map((pair) => {
      const i = pair.indexOf('=');
      return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
    }),
  );
}

async function potatoPlot(context: BrowserContext, name: string) {
  const owner = await newVerifiedUser({ name: 'Pia Grower' });
  const h = await createHousehold(owner.cookie, { name, timezone: 'Europe/Berlin', units: 'metric' });
  // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 25 % refuse
  const crop = await makeCrop(owner.cookie, h.id, { name: 'Potato', variety: 'Charlotte', foodId: await foodId('11352'), category: 'root_tuber' });
  await signInAs(context, owner);
  return { owner, h, crop };
}

async function fillHarvest(page: Page, kg: string) {
  await page.getByText('Potato', { exact: true }).tap();
  await expect(page.getByRole('radio', { name: /Potato/ })).toBeChecked();
  await page.getByLabel('Weight', { exact: true }).fill(kg);
  // A metric household starts on kilograms.
  await expect(page.getByRole('radio', { name: 'kg', exact: true })).toBeChecked();
  await expect(page.getByRole('radio', { name: /Eaten fresh/ })).toBeChecked();
}

test('a grower logs a harvest on a phone, sees it in the log and undoes it', async ({ page, context }) => {
  const { owner, h } = await potatoPlot(context, 'Phone plot');
  await page.goto(`/households/${h.id}/log`);
  await expect(page.getByRole('heading', { name: 'Log a harvest' })).toBeVisible();
  await expect(page.getByText('(today)')).toBeVisible();

  // Big targets for a thumb: the weight field and the save button are at least 48 px tall.
  for (const el of [page.getByLabel('Weight', { exact: true }), page.getByRole('button', { name: 'Save harvest' })]) {
    expect((await el.boundingBox())!.height).toBeGreaterThanOrEqual(48);
  }

  // Nothing chosen yet: the form says what is missing, next to the field.
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expect(page.getByText('Choose the crop you harvested.')).toBeVisible();

  await fillHarvest(page, '1,2'); // a decimal comma, as typed on many phones
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expect(page.getByTestId('saved-label').first()).toHaveText('1.2 kg Potato (Charlotte) — fresh');
  // 1.2 kg × (1 − 25/100) = 0.9 kg edible (USDA SR28, NDB 11352: 25 % refuse)
  await expect(page.getByTestId('just-saved')).toContainText('edible portion 0.9 kg');

  // The harvest log, in a second tab, shows the entry with its edible portion and totals.
  const table = await context.newPage();
  await table.goto(`/households/${h.id}/harvests`);
  const row = table.getByTestId('harvest-row');
  await expect(row).toHaveCount(1);
  await expect(row).toContainText('Potato (Charlotte)');
  await expect(row).toContainText('1.2 kg');
  await expect(row).toContainText('900 g');
  await expect(table.getByTestId('totals')).toContainText('1.2 kg weighed');

  // Undo on the phone form; the log no longer has it.
  await page.getByRole('button', { name: 'Undo' }).tap();
  await expect(page.getByTestId('saved-label')).toHaveCount(0);
  await table.reload();
  await expect(table.getByText('No harvests logged yet.')).toBeVisible();
  expect((await allHarvests(owner.cookie, h.id)).total).toBe(0);
});

test('a harvest whose request fails waits on the phone and is stored exactly once when sent again', async ({ page, context }) => {
  const { owner, h } = await potatoPlot(context, 'Patchy signal plot');
  await page.goto(`/households/${h.id}/log`);

  // First POST: it reaches the server, but the answer is lost on the way back — the worst case
  // for a retry, since the entry is already stored.
  let posts = 0;
  await page.route('**/api/households/*/harvests', async (route) => {
    if (route.request().method() !== 'POST') return route.continue();
    posts += 1;
    if (posts === 1) {
      await route.fetch();
      return route.abort('internetdisconnected');
    }
    return route.continue();
  });

  await fillHarvest(page, '3');
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  const waiting = page.getByTestId('waiting');
  await expect(waiting).toContainText('1 entry is waiting to send');
  await expect(waiting).toContainText('3 kg Potato (Charlotte) — fresh');
  expect((await allHarvests(owner.cookie, h.id)).total).toBe(1);

  // The connection comes back: the outbox sends it again with the same Idempotency-Key.
  await page.evaluate(() => window.dispatchEvent(new Event('online')));
  await expect(waiting).toHaveCount(0);
  await expect(page.getByTestId('just-saved')).toContainText('Sent and saved');
  expect(posts).toBe(2);
  const after = await allHarvests(owner.cookie, h.id);
  expect(after.total).toBe(1);
  expect(after.harvests[0].quantity).toBe(3);

  // A second entry fails before it reaches the server; it is sent when the page is next opened.
  await page.unroute('**/api/households/*/harvests');
  await page.route('**/api/households/*/harvests', (route) => (route.request().method() === 'POST' ? route.abort('internetdisconnected') : route.continue()));
  await fillHarvest(page, '0.5');
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expect(waiting).toContainText('0.5 kg Potato (Charlotte) — fresh');
  expect((await allHarvests(owner.cookie, h.id)).total).toBe(1);
  await page.unroute('**/api/households/*/harvests');
  await page.reload();
  await expect(page.getByTestId('just-saved')).toContainText('0.5 kg Potato (Charlotte) — fresh');
  await expect(waiting).toHaveCount(0);
  const final = await allHarvests(owner.cookie, h.id);
  expect(final.total).toBe(2);
  expect(final.harvests.map((x: { quantity: number }) => x.quantity).sort()).toEqual([0.5, 3]);
  expect(await page.evaluate(() => Object.keys(localStorage).filter((k) => k.startsWith('selfsown:outbox:')))).toEqual([]);
});

