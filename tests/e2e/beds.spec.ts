/**
 * The beds page on a phone: a grower adds a bed and a garlic planting in it, the harvest window is
 * prefilled from the reference row and the default frost dates, and both are listed.
 */
import { expect, test } from './fixtures';
import { householdLink } from './nav';
import { apiAs, BASE_URL, householdWithRoles } from '../support/users';

test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });

function cookiesFor(header: string) {
  return header.split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
  });
}

test('a grower adds a bed and a planting on a phone and sees them listed', async ({ page, context }) => {
  const f = await householdWithRoles({ name: 'Beds e2e plot', timezone: 'Europe/Berlin' });
  await context.addCookies(cookiesFor(f.grower.cookie));

  await page.goto(`/households/${f.household.id}/beds`);
  await expect(await householdLink(page, 'Beds')).toHaveAttribute('aria-current', 'page');
  await page.keyboard.press('Escape');
  // common practice (no published source): northern default frost dates 1 May and 1 October
  await expect(page.getByTestId('frost-dates')).toContainText('05-01 (default)');

  const bedForm = page.getByRole('form', { name: 'Add a bed' });
  await bedForm.getByLabel('Bed name').fill('Sunny bed');
  await bedForm.getByLabel('Area, m²').fill('8');
  await bedForm.getByRole('button', { name: 'Add bed' }).click();
  await expect(page.getByText('Added Sunny bed.')).toBeVisible();
  await expect(page.getByTestId('bed').filter({ hasText: 'Sunny bed' })).toContainText('8 m²');

  await page.getByRole('button', { name: 'Add a planting' }).click();
  const plantingForm = page.getByRole('form', { name: 'Add a planting' });
  await plantingForm.getByRole('button', { name: 'Add planting' }).click();
  // The endpoint's own rules, shown beside the crop and area fields before anything is sent.
  await expect(plantingForm.getByText('Choose the crop this planting grows.')).toBeVisible();
  await expect(plantingForm.getByText('Enter the area.')).toBeVisible();
  await plantingForm.getByLabel('Area, m²').fill('3');

  await plantingForm.getByLabel('Crop').selectOption({ label: 'Garlic' });
  // reference-data/crops.csv, garlic: from 10 weeks after the last spring frost (1 May + 70 days = 10 July)
  await expect(plantingForm.getByLabel('Harvest expected from')).toHaveValue(/^\d{4}-07-10$/);
  await plantingForm.getByLabel('Bed').selectOption({ label: 'Sunny bed' });
  await plantingForm.getByRole('button', { name: 'Add planting' }).click();
  await expect(page.getByText('Planting added.')).toBeVisible();

  const group = page.getByTestId('planting-group').filter({ hasText: 'Sunny bed' });
  await expect(group.getByTestId('planting')).toContainText('Garlic');
  await expect(group.getByTestId('planting')).toContainText('3 m²');
  await expect(group.getByTestId('planting')).toContainText(/Harvest expected \d{4}-07-10 to \d{4}-08-07/);
  // A phone never scrolls sideways.
  const wide = await page.evaluate(() => document.documentElement.scrollWidth > window.innerWidth);
  expect(wide).toBe(false);

  // A garlic weighing names its planting on the Log page, so it counts toward the own yield per m².
  await page.goto(`/households/${f.household.id}/log`);
  await page.getByText('Garlic', { exact: true }).tap();
  await expect(page.getByRole('radio', { name: 'Garlic' })).toBeChecked();
  await page.getByLabel('Weight', { exact: true }).fill('1.5');
  await page.getByLabel(/From planting/).selectOption({ index: 1 });
  await page.getByRole('button', { name: 'Save harvest' }).tap();
  await expect(page.getByTestId('saved-label').first()).toContainText('Garlic');
  const list = await apiAs(f.grower.cookie, 'GET', `/api/households/${f.household.id}/harvests`);
  expect(list.body.harvests[0].plantingId).toEqual(expect.any(Number));
});
