/**
 * The account page: reached from the header, it shows the person's name and address and, for each
 * household, their role and the monthly letter switch, which keeps its position after a reload.
 * On a 390 px phone nothing scrolls sideways; the unsubscribe page's button turns the letter off.
 */
import { expect, test } from './fixtures';
import { addMember, BASE_URL, createHousehold, newVerifiedUser } from '../support/users';
import { linkTo, waitForMail } from '../support/mail';
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';

function cookiesFor(header: string) {
  return header.split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
  });
}

test('a viewer switches the monthly letter on from the account page, on a phone and on a desktop', async ({ page, context }) => {
  const owner = await newVerifiedUser({ name: 'Ola Owner' });
  const viewer = await newVerifiedUser({ name: 'Vic Viewer' });
  const h = await createHousehold(owner.cookie, { name: 'Account e2e plot' });
  await addMember(owner, h.id, viewer, 'viewer');
  await context.addCookies(cookiesFor(viewer.cookie));

  await page.setViewportSize({ width: 390, height: 844 });
  // One household: the list opens it. The account is in the header's one menu.
  await page.goto('/households');
  await expect(page).toHaveURL(new RegExp(`/households/${h.id}$`));
  await page.getByTestId('household-switcher').locator('summary').click();
  await page.getByTestId('signed-in-as').click();
  await expect(page).toHaveURL(/\/account$/);
  await expect(page.getByTestId('account-details')).toContainText('Vic Viewer');
  await expect(page.getByTestId('account-details')).toContainText(viewer.email);
  const row = page.getByTestId(`letter-row-${h.id}`);
  await expect(row).toContainText('Account e2e plot');
  await expect(row).toContainText('You are viewer');
  const toggle = page.getByRole('switch', { name: /Monthly letter/ });
  // Viewers choose the letter: it starts off.
  await expect(toggle).toHaveAttribute('aria-checked', 'false');
  expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).toBe(true);

  await toggle.click();
  await expect(toggle).toHaveAttribute('aria-checked', 'true');
  await expect(row).toContainText('Monthly letter: on');

  await page.setViewportSize({ width: 1280, height: 800 });
  await page.reload();
  await expect(page.getByRole('switch', { name: /Monthly letter/ })).toHaveAttribute('aria-checked', 'true');
});

test('the unsubscribe page says which letter it stops and turns it off with one button, without signing in', async ({ page }) => {
  const owner = await newVerifiedUser({ name: 'Una Unsub' });
  const h = await createHousehold(owner.cookie, { name: 'Unsubscribe e2e plot' });
  const potato = await fetch(`${BASE_URL}/api/foods?code=11352&dataset=usda-sr28`).then((r) => r.json() as Promise<{ foods: { id: number }[] }>);
  const post = (path: string, body: unknown) => fetch(`${BASE_URL}/api/households/${h.id}/${path}`, { method: 'POST', headers: { cookie: owner.cookie, 'content-type': 'application/json', origin: BASE_URL }, body: JSON.stringify(body) });
  expect((await post('harvests', { date: '2026-11-03', foodId: potato.foods[0]!.id, quantity: 3, unit: 'kg' })).status).toBe(201);
  const root = new URL('../..', import.meta.url).pathname;
  execFileSync(join(root, 'node_modules/.bin/tsx'), ['src/cli/letters.ts', '--month', '2026-11', '--household', String(h.id)], { cwd: root, env: process.env });
  const link = linkTo(await waitForMail(owner.email, { subject: /November 2026/ }), '/letters/unsubscribe');

  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto(link.slice(new URL(link).origin.length));
  await expect(page.getByRole('heading', { name: 'Stop the monthly letter?' })).toBeVisible();
  await expect(page.getByTestId('unsubscribe')).toContainText('Unsubscribe e2e plot');
  await page.getByTestId('unsubscribe-button').click();
  await expect(page.getByRole('heading', { name: 'The letter is off' })).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).toBe(true);
});
