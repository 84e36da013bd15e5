/**
 * The harvest form on a phone: a grower logs a weighing, finds it in the harvest log and undoes it;
 * an entry whose request fails is kept on the phone, sent later, and stored exactly once; and the
 * other record pages (crops, bought food and staples, CSV import, the log's edit and delete) work
 * from a phone, read-only for a viewer.
 */
import type { BrowserContext, Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { allHarvests, allPurchases, foodId, makeCrop } from '../support/entries';
import { addMember, BASE_URL, createHousehold, newVerifiedUser, type TestUser } from '../support/users';

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
  // Choosing "preserved" brings up the canning caution; back to fresh, it goes.
  await expect(page.getByTestId('use-caution')).toHaveCount(0);
  await page.getByText(/^Preserved/).tap();
  // common practice (USDA Complete Guide to Home Canning): low-acid food needs a pressure canner
  await expect(page.getByTestId('use-caution')).toContainText('pressure canner');
  await page.getByText(/^Eaten fresh/).tap();
  await expect(page.getByTestId('use-caution')).toHaveCount(0);
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
  // The edible portion is written in the weighing's own unit beside it (0.9 kg, not 900 g).
  await expect(row).toContainText('edible 0.9 kg');
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

  // The queue tries again by itself (2 s later) with the same Idempotency-Key.
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
  expect(await page.evaluate(() => Object.keys(localStorage).filter((k) => k.startsWith('selfsown:queue:')))).toEqual([]);
});

test('a grower keeps crops, bought food and old logs from a phone; a viewer only reads', async ({ page, context }) => {
  const { owner, h } = await potatoPlot(context, 'Records plot');

  // A crop added with a suggested reference food, then archived: it leaves the catalogue list.
  await page.goto(`/households/${h.id}/crops`);
  await page.getByRole('button', { name: 'Add a crop' }).tap();
  await page.getByLabel('Name', { exact: true }).fill('Carrot');
  // Raw, whole forms are suggested first, with the figures to judge the match by.
  await expect(page.getByRole('listbox').getByRole('option').first()).toContainText('Carrots, raw');
  await page.getByRole('listbox').getByRole('option').first().tap();
  // from memory: USDA SR28, NDB 11124 "Carrots, raw": 11 % refuse, 41 kcal per 100 g
  await expect(page.getByTestId('crop-new-food-chosen')).toContainText('11124');
  await expect(page.getByTestId('crop-new-food-chosen').getByTestId('facts-refuse')).toHaveText('11 %');
  await expect(page.getByTestId('crop-new-food-chosen')).toContainText('41 kcal');
  await page.getByLabel('Kind of crop').selectOption('root_tuber');
  await page.getByRole('button', { name: 'Add crop' }).tap();
  await expect(page.getByText('Carrot is added.')).toBeVisible();
  await expect(page.getByTestId('crop-card')).toHaveCount(2);
  await page.getByRole('button', { name: 'Archive Carrot' }).tap();
  await expect(page.getByText(/Carrot is archived/)).toBeVisible();
  await expect(page.getByTestId('crop-card')).toHaveCount(1);

  // A bulk buy saved as a staple, logged again with one tap, the repeat undone, the first edited.
  await page.goto(`/households/${h.id}/bought`);
  await page.getByLabel('Food bought').fill('wheat flour whole');
  await page.getByRole('listbox').getByRole('option').first().tap();
  await page.getByLabel('Weight', { exact: true }).fill('25');
  await page.getByLabel('Eaten over how many months?').fill('6');
  await page.getByLabel('Also save as a staple (one tap next time)').check();
  await page.getByRole('button', { name: 'Save bought food' }).tap();
  await expect(page.getByTestId('purchase-saved')).toContainText('25 kg');
  await expect(page.getByTestId('staples').getByRole('button').first()).toBeVisible();
  await page.getByTestId('staples').getByRole('button').first().tap();
  await expect(page.getByTestId('purchase-row')).toHaveCount(2);
  expect((await allPurchases(owner.cookie, h.id)).total).toBe(2);
  await page.getByTestId('purchase-saved').getByRole('button', { name: 'Undo' }).first().tap();
  await expect(page.getByTestId('purchase-row')).toHaveCount(1);
  await page.getByRole('button', { name: /^Edit/ }).tap();
  await page.locator('[id^="pedit-"][id$="-price"]').fill('31.5');
  await page.locator('[id^="pedit-"][id$="-currency"]').fill('EUR');
  await page.getByRole('button', { name: 'Save changes' }).tap();
  await expect(page.getByTestId('purchase-row')).toContainText('31.50 EUR');

  // An old log with a crop the household does not have: created with the import.
  await page.goto(`/households/${h.id}/import`);
  await page.setInputFiles('#import-file', { name: 'old.csv', mimeType: 'text/csv', buffer: Buffer.from('date,crop,quantity,unit,use\n2025-08-01,Onion,3,kg,fresh\n2025-08-02,Onion,2,kg,stored\n') });
  await page.getByRole('button', { name: 'Preview' }).tap();
  await expect(page.getByTestId('unknown-crops')).toBeVisible();
  await page.getByRole('listbox').getByRole('option').first().tap();
  await page.getByRole('button', { name: 'Create 1 crop and import' }).tap();
  await expect(page.getByText('Imported 2 harvests.')).toBeVisible();

  // The harvest log: filter by use, edit in place, delete with confirmation.
  await page.goto(`/households/${h.id}/harvests`);
  await expect(page.getByTestId('harvest-row')).toHaveCount(2);
  await page.getByLabel('Use', { exact: true }).selectOption('stored');
  await expect(page.getByTestId('harvest-row')).toHaveCount(1);
  await page.getByRole('button', { name: /^Edit/ }).tap();
  await page.locator('[id^="edit-"][id$="-quantity"]').fill('2.5');
  await page.getByRole('button', { name: 'Save changes' }).tap();
  await expect(page.getByTestId('harvest-row')).toContainText('2.5 kg');
  await page.getByRole('button', { name: /^Delete/ }).tap();
  await page.getByRole('button', { name: 'Yes, delete' }).tap();
  await expect(page.getByText('No harvests match these filters.')).toBeVisible();

  // A viewer sees the records but no forms or edit buttons; another household's page is a 404.
  const viewer = await newVerifiedUser({ name: 'Vi Ewer' });
  await addMember(owner, h.id, viewer, 'viewer');
  await context.clearCookies();
  await signInAs(context, viewer);
  await page.goto(`/households/${h.id}/harvests`);
  await expect(page.getByTestId('harvest-row')).toHaveCount(1);
  await expect(page.getByRole('button', { name: /^Edit/ })).toHaveCount(0);
  await page.goto(`/households/${h.id}/log`);
  await expect(page.getByTestId('log-viewer')).toContainText('logged by owners and growers');
  await expect(page.getByRole('button', { name: 'Save harvest' })).toHaveCount(0);
  await page.goto(`/households/${h.id}/bought`);
  await expect(page.getByRole('button', { name: 'Save bought food' })).toHaveCount(0);
  const r = await page.goto(`/households/999999/crops`);
  expect(r!.status()).toBe(404);
});

test('a preserved harvest names its method, and a weighing over 100 kg is questioned but can still be saved', async ({ page, context }) => {
  const { owner, h } = await potatoPlot(context, 'Preserving plot');
  await page.goto(`/households/${h.id}/log`);

  // Preserved, frozen: the method goes with the entry.
  await fillHarvest(page, '3');
  await expect(page.getByText('How was it preserved?')).toHaveCount(0);
  await page.getByText(/^Preserved/).tap();
  await expect(page.getByText('How was it preserved?')).toBeVisible();
  await page.getByText('Frozen', { exact: true }).tap();
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expect(page.getByTestId('saved-label').first()).toHaveText('3 kg Potato (Charlotte) — preserved');
  let list = await allHarvests(owner.cookie, h.id);
  expect(list.harvests).toEqual([expect.objectContaining({ use: 'preserved', preserveMethod: 'frozen', quantity: 3 })]);

  // 150 kg in one weighing: the form asks first and saves nothing.
  await page.getByLabel('Weight', { exact: true }).fill('150');
  await page.getByText(/^Eaten fresh/).tap();
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  // common practice (no published source): over 100 kg in one weighing is asked about
  await expect(page.getByTestId('weight-warning')).toContainText('150 kg is over 100 kg for one weighing.');
  expect((await allHarvests(owner.cookie, h.id)).total).toBe(1);
  await page.getByRole('button', { name: 'The weight is right: save it' }).tap();
  await expect(page.getByTestId('saved-label').first()).toHaveText('150 kg Potato (Charlotte) — fresh');
  await expect(page.getByTestId('weight-warning')).toHaveCount(0);
  list = await allHarvests(owner.cookie, h.id);
  expect(list.total).toBe(2);
  expect(list.harvests.map((x: { quantity: number }) => x.quantity).sort((a: number, b: number) => a - b)).toEqual([3, 150]);

  // The harvest log names the method beside the use.
  await page.goto(`/households/${h.id}/harvests`);
  await expect(page.getByTestId('preserve-method')).toHaveText(' (frozen)');
});

test('the harvest form refuses a date after today in the household’s zone', async ({ page, context }) => {
  const { owner, h } = await potatoPlot(context, 'Tomorrow plot');
  await page.goto(`/households/${h.id}/log`);
  await fillHarvest(page, '1');
  await page.getByLabel(/^Date/).fill('2199-12-31');
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expect(page.getByText(/The harvest date 2199-12-31 is after today \(\d{4}-\d{2}-\d{2} in the household's time zone\)/)).toBeVisible();
  expect((await allHarvests(owner.cookie, h.id)).total).toBe(0);
});
