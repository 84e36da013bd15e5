/**
 * The people form: a person is added with the shared schema's checks shown beside the fields,
 * then changed, and the card shows the stated energy need.
 */
import { expect, test } from './fixtures';
import { BASE_URL, createHousehold, newVerifiedUser } from '../support/users';

function cookiesFor(header: string) {
  return header.split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
  });
}

test('a grower adds a person, is told beside the field what is missing, and changes them later', async ({ page, context }) => {
  const owner = await newVerifiedUser({ name: 'Pia People' });
  const h = await createHousehold(owner.cookie, { name: 'People e2e plot' });
  await context.addCookies(cookiesFor(owner.cookie));

  await page.goto(`/households/${h.id}/people`);
  await page.getByRole('button', { name: 'Add a person' }).click();
  await page.getByLabel('Name', { exact: true }).fill('Ada');
  await page.getByLabel('Birth year (the age then follows the calendar)').check();
  await page.getByRole('button', { name: 'Save' }).click();

  // No birth year: the rule of people-schemas.ts stands beside the birth year box, which gets the focus.
  const birthYear = page.getByLabel('Birth year', { exact: true });
  await expect(birthYear).toHaveAttribute('aria-invalid', 'true');
  await expect(birthYear).toBeFocused();
  await expect(page.getByText('Give the age in years, the birth year or the birth month.')).toBeVisible();

  await birthYear.fill('1990');
  await page.getByLabel('Energy need, kcal a day (optional)').fill('2000');
  await page.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByText('Added Ada.')).toBeVisible();
  const card = page.getByTestId('person').filter({ hasText: 'Ada' });
  await expect(card.getByTestId('person-kcal')).toHaveText(/^2,000 kcal$/);
  await expect(card.getByTestId('person-basis')).toHaveText('as you stated');
  await expect(card).toContainText('born 1990');

  await card.getByRole('button', { name: 'Change' }).click();
  await expect(page.getByLabel('Birth year', { exact: true })).toHaveValue('1990');
  await page.getByLabel('Share of meals from the household’s food, %').fill('150');
  await page.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByText('The share of meals at home is at most 100 %.')).toBeVisible();
  await page.getByLabel('Share of meals from the household’s food, %').fill('50');
  await page.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByText('Saved Ada.')).toBeVisible();
  await expect(page.getByTestId('person').filter({ hasText: 'Ada' })).toContainText('50 %');
});
