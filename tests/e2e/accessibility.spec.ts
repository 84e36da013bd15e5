/**
 * WCAG 2.2 AA with axe-core (@axe-core/playwright) on every main page, at a phone's and a desktop's
 * size: a serious or critical violation fails the test, named with its rule, its help text and the
 * elements it hit. The household has a little of everything (a person, a crop, a stored harvest,
 * a purchase), so the pages show their data views rather than only their empty states.
 */
import AxeBuilder from '@axe-core/playwright';
import type { Page } from '@playwright/test';
import { expect, test } from './fixtures';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { BASE_URL, apiAs, householdWithRoles } from '../support/users';

function cookiesFor(header: string) {
  return header.split('; ').map((pair) => {
    const i = pair.indexOf('=');
    return { name: pair.slice(0, i), value: pair.slice(i + 1), url: BASE_URL };
  });
}

/** The rules of WCAG 2.0–2.2 levels A and AA that axe checks. */
const WCAG_AA = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

async function seriousViolations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).withTags(WCAG_AA).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join(' | ')}`);
}

const SIGNED_OUT = ['/', '/sign-in', '/sign-up', '/forgot-password'];
const HOUSEHOLD_PAGES = ['', '/log', '/harvests', '/larder', '/bought', '/share', '/gaps', '/people', '/crops', '/beds', '/members', '/import', '/settings'];

for (const [label, viewport] of [
  ['phone', { width: 390, height: 844 }],
  ['desktop', { width: 1280, height: 800 }],
] as const) {
  test.describe(`axe at ${label} size`, () => {
    test.use({ viewport });

    test(`signed-out pages have no serious or critical violations (${label})`, async ({ page }) => {
      const found: string[] = [];
      for (const path of SIGNED_OUT) {
        await page.goto(path);
        for (const v of await seriousViolations(page)) found.push(`${path}: ${v}`);
      }
      expect(found, found.join('\n')).toEqual([]);
    });

    test(`household pages have no serious or critical violations (${label})`, async ({ page, context }) => {
      test.setTimeout(180_000);
      const f = await householdWithRoles({ name: `Axe plot ${label}`, timezone: 'UTC' });
      const hid = f.household.id;
      const potato = await makeCrop(f.owner.cookie, hid, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
      const month = new Date().toISOString().slice(0, 7);
      await logHarvest(f.owner.cookie, hid, { cropId: potato.id, date: `${month}-01`, quantity: 12, unit: 'kg', use: 'stored', spreadMonths: 4 });
      await apiAs(f.owner.cookie, 'POST', `/api/households/${hid}/purchases`, { foodId: await foodId('20081'), date: `${month}-01`, quantity: 1.5, unit: 'kg', spreadMonths: 1 });
      await apiAs(f.owner.cookie, 'POST', `/api/households/${hid}/people`, { name: 'Ash', sex: 'female', ageYears: 40 });
      await context.addCookies(cookiesFor(f.owner.cookie));
      const found: string[] = [];
      for (const path of [...HOUSEHOLD_PAGES.map((p) => `/households/${hid}${p}`), '/households', '/account', '/foods']) {
        await page.goto(path);
        for (const v of await seriousViolations(page)) found.push(`${path}: ${v}`);
      }
      expect(found, found.join('\n')).toEqual([]);
    });
  });
}
