/**
 * A site administrator uploads a small FoodData Central CSV download (SR Legacy layout; the food
 * and its figures are made up for the test), watches it being read and checked, applies it, and
 * finds the new food in the reference food search. A grower gets 404 on the same page.
 */
import { expect, test } from './fixtures';
import { BASE_URL, testPool } from '../support/env';
import { householdWithRoles, newVerifiedUser } from '../support/users';

function cookiesFor(header: string) {
  return header.split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
  });
}

const csv = (rows: (string | number)[][]) => Buffer.from(rows.map((r) => r.map((c) => `"${c}"`).join(',')).join('\n') + '\n');

test('an administrator uploads an FDC CSV, applies it and finds its food in search', async ({ page, context }) => {
  const admin = await newVerifiedUser({ name: 'Upload Admin' });
  // What `npm run admin:grant` writes (tests/integration/admin-grant.test.ts covers the command).
  const pool = testPool();
  await pool.query('INSERT IGNORE INTO site_admins (user_id) VALUES (?)', [admin.id]);
  await pool.end();
  await context.addCookies(cookiesFor(admin.cookie));
  const slug = `e2e-fdc-${Date.now().toString(36)}`;

  await page.goto('/admin/uploads');
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Upload FoodData Central data');
  const form = page.getByTestId('upload-form');
  await form.getByLabel(/^Slug/).fill(slug);
  await form.getByLabel('Dataset name').fill('E2E test table');
  await form.getByLabel(/^Release/).fill('April 2026 test');
  await form.getByLabel('CSV files of the download').setInputFiles([
    { name: 'nutrient.csv', mimeType: 'text/csv', buffer: csv([['id', 'name', 'unit_name', 'nutrient_nbr', 'rank'], [1008, 'Energy', 'KCAL', '208', 300]]) },
    { name: 'food.csv', mimeType: 'text/csv', buffer: csv([['fdc_id', 'data_type', 'description', 'food_category_id', 'publication_date'], [991001, 'sr_legacy_food', 'Zebrabean, mature seeds, raw', '', '2019-04-01']]) },
    {
      name: 'food_nutrient.csv',
      mimeType: 'text/csv',
      buffer: csv([['id', 'fdc_id', 'nutrient_id', 'amount', 'data_points', 'derivation_id', 'min', 'max', 'median', 'footnote', 'min_year_acquired'], [1, 991001, 1008, 333, '', '', '', '', '', '', '']]),
    },
  ]);
  await form.getByRole('button', { name: 'Upload and check' }).click();

  const job = page.getByTestId('upload-job');
  await expect(job).toHaveAttribute('data-status', 'ready', { timeout: 15_000 });
  await expect(job).toContainText('1 food, 1 nutrient amount');
  await expect(page.getByTestId('upload-changes')).toContainText('A new dataset');
  await job.getByRole('button', { name: 'Apply this release' }).click();
  await expect(job).toHaveAttribute('data-status', 'applied', { timeout: 15_000 });

  await job.getByRole('link', { name: 'Search its foods' }).click();
  await page.getByLabel('Search reference foods').fill('zebrabean');
  await page.getByRole('button', { name: 'Search' }).click();
  const hit = page.getByTestId('food-results').getByRole('link').first();
  await expect(hit).toContainText('Zebrabean, mature seeds, raw');
  await expect(hit).toContainText('E2E test table');
  await hit.click();
  await expect(page.locator('tr[data-key="energy_kcal"] td')).toHaveText('333 kcal');
  await expect(page.getByTestId('edible-basis')).toContainText('gives no refuse percentage');
});

test('a grower who is not a site administrator gets 404 on the admin pages', async ({ page, context }) => {
  const f = await householdWithRoles({ name: 'No admin here' });
  await context.addCookies(cookiesFor(f.grower.cookie));
  for (const path of ['/admin', '/admin/uploads', '/admin/accounts', '/admin/outbox']) {
    const r = await page.goto(path);
    expect(r?.status(), path).toBe(404);
  }
});
