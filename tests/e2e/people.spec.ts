/**
 * The people form: a person is added with the shared schema's checks shown beside the fields,
 * then changed, and the card shows the stated energy need.
 */
import { expect, test } from './fixtures';
import { apiAs, BASE_URL, createHousehold, newVerifiedUser } from '../support/users';

function cookiesFor(header: string) {
  return header.split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
  });
}

test('an owner adds a person, is told beside the field what is missing, and changes them later', async ({ page, context }) => {
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

test('a US-units household types feet, inches and pounds; the API stores centimetres and kilograms', async ({ page, context }) => {
  const owner = await newVerifiedUser({ name: 'Uma Units' });
  const h = await createHousehold(owner.cookie, { name: 'US units plot', units: 'us' });
  await context.addCookies(cookiesFor(owner.cookie));

  await page.goto(`/households/${h.id}/people`);
  await page.getByRole('button', { name: 'Add a person' }).click();
  await page.getByLabel('Name', { exact: true }).fill('Sam');
  await page.getByRole('textbox', { name: 'Age in years' }).fill('40');
  await expect(page.getByLabel('Height, cm (optional)')).toHaveCount(0);
  await page.getByLabel('Height, feet (optional)').fill('5');
  await page.getByLabel('and inches').fill('10');
  await page.getByLabel('Weight, lb (optional)').fill('180');
  await page.getByRole('button', { name: 'Save' }).click();
  await expect(page.getByText('Added Sam.')).toBeVisible();
  const card = page.getByTestId('person').filter({ hasText: 'Sam' });
  await expect(card.getByTestId('person-body')).toHaveText('5 ft 10 in, 180 lb');

  const r = await apiAs(owner.cookie, 'GET', `/api/households/${h.id}/people`);
  // 70 in × 2.54 = 177.8 cm; 180 lb × 0.45359237 = 81.65 kg (International Yard and Pound Agreement, 1959)
  expect(r.body.people[0]).toMatchObject({ name: 'Sam', heightCm: 177.8, weightKg: 81.65 });

  // Changing Sam opens the same figures in feet, inches and pounds.
  await card.getByRole('button', { name: 'Change' }).click();
  await expect(page.getByLabel('Height, feet (optional)')).toHaveValue('5');
  await expect(page.getByLabel('and inches')).toHaveValue('10');
  await expect(page.getByLabel('Weight, lb (optional)')).toHaveValue('180');
});

test('a metric household typing 70 and 180 is asked whether they are inches and pounds before saving', async ({ page, context }) => {
  const owner = await newVerifiedUser({ name: 'Mia Metric' });
  const h = await createHousehold(owner.cookie, { name: 'Metric slip plot', units: 'metric' });
  await context.addCookies(cookiesFor(owner.cookie));

  await page.goto(`/households/${h.id}/people`);
  await page.getByRole('button', { name: 'Add a person' }).click();
  await page.getByLabel('Name', { exact: true }).fill('Lee');
  await page.getByRole('textbox', { name: 'Age in years' }).fill('35');
  await page.getByLabel('Height, cm (optional)').fill('70');
  await page.getByLabel('Weight, kg (optional)').fill('180');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  const warning = page.getByTestId('body-warning');
  // 70 in = 177.8 cm (International Yard and Pound Agreement, 1959)
  await expect(warning).toContainText('70 cm and 180 kg look like inches and pounds (70 in is 177.8 cm');
  expect((await apiAs(owner.cookie, 'GET', `/api/households/${h.id}/people`)).body.people).toEqual([]);

  // Corrected, it saves without a question.
  await page.getByLabel('Height, cm (optional)').fill('178');
  await page.getByLabel('Weight, kg (optional)').fill('82');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByText('Added Lee.')).toBeVisible();
  await expect(page.getByTestId('person').filter({ hasText: 'Lee' }).getByTestId('person-body')).toHaveText('178 cm, 82 kg');
});

test('a baby by birth month, fed from the household, and a dated pregnancy with the weight before it', async ({ page, context }) => {
  const owner = await newVerifiedUser({ name: 'Ida Dated' });
  const h = await createHousehold(owner.cookie, { name: 'Dated plot' });
  await context.addCookies(cookiesFor(owner.cookie));
  const now = new Date();
  const month = (n: number) => new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() + n, 1)).toISOString().slice(0, 7);

  await page.goto(`/households/${h.id}/people`);
  await page.getByRole('button', { name: 'Add a person' }).click();
  await page.getByLabel('Name', { exact: true }).fill('Ida');
  await page.getByRole('textbox', { name: 'Age in years' }).fill('31');
  await page.getByLabel('Pregnant', { exact: true }).check();
  await expect(page.getByLabel('Weight before pregnancy, kg (optional)')).toBeVisible();
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByText('Give the month the baby is due: the trimester of each month follows from it.')).toBeVisible();
  await page.getByLabel('Month the baby is due').fill(month(2));
  await page.getByLabel('Diet').selectOption('vegetarian');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByText('Added Ida.')).toBeVisible();
  await expect(page.getByTestId('person').filter({ hasText: 'Ida' })).toContainText(`due ${month(2)}`);

  await page.getByRole('button', { name: 'Add a person' }).click();
  await page.getByLabel('Name', { exact: true }).fill('Mo');
  await page.getByLabel('Birth month (for a child: the age counts in months)').check();
  await page.getByLabel('Birth month', { exact: true }).fill(month(-2));
  await page.getByLabel('Fed from the household’s food').check();
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByText('Added Mo.')).toBeVisible();

  const people = (await apiAs(owner.cookie, 'GET', `/api/households/${h.id}/people`)).body.people;
  expect(people.find((p: { name: string }) => p.name === 'Ida')).toMatchObject({ pregnancyDueMonth: month(2), condition: 'none', diet: 'vegetarian' });
  expect(people.find((p: { name: string }) => p.name === 'Mo')).toMatchObject({ birthMonth: month(-2), ageYears: null, fedFromHousehold: true });
});
