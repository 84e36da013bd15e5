/**
 * The household Overview, the landing page and where sign-in lands (issue 12): the Overview shows
 * this month's home share as the share report counts it, the larder and the latest harvests; a new
 * household gets its next steps, ticked from its records, until skipped; viewers meet no harvest
 * entry; the landing page previews the demo household without member data, or nothing without one.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_EMAIL, DEMO_HOUSEHOLD, seedDemo } from '@/cli/seed-demo';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { TEST_DB_URL, testPool } from '../support/env';
import { apiAs, BASE_URL, createHousehold, householdWithRoles, newVerifiedUser, type RoleFixture } from '../support/users';

const pool = testPool();
afterAll(() => pool.end());

async function get(path: string, cookie = ''): Promise<{ status: number; html: string; location: string | null }> {
  const r = await fetch(`${BASE_URL}${path}`, { headers: cookie ? { cookie } : {}, redirect: 'manual' });
  return { status: r.status, html: await r.text(), location: r.headers.get('location') };
}

const today = () => new Date().toISOString().slice(0, 10);
const daysThisMonth = () => {
  const d = new Date();
  return new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 0)).getUTCDate();
};

describe('the Overview', () => {
  let t: RoleFixture;
  beforeAll(async () => {
    t = await householdWithRoles({ name: 'Overview plot', timezone: 'UTC' });
    const hid = t.household.id;
    expect((await apiAs(t.owner.cookie, 'POST', `/api/households/${hid}/people`, { name: 'Ada', sex: 'female', ageYears: 40, kcalPerDay: 2000 })).status).toBe(201);
    const potato = await makeCrop(t.owner.cookie, hid, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
    await logHarvest(t.grower.cookie, hid, { cropId: potato.id, date: today(), quantity: 10, unit: 'kg', use: 'fresh' });
    await logHarvest(t.grower.cookie, hid, { cropId: potato.id, date: today(), quantity: 20, unit: 'kg', use: 'stored', spreadMonths: 6 });
  });

  it('shows this month’s home share of the energy need as the share report counts it', async () => {
    const share = await apiAs(t.viewer.cookie, 'GET', `/api/households/${t.household.id}/share?from=${today().slice(0, 7)}&to=${today().slice(0, 7)}`);
    const expected = share.body.months[0].values.energy_kcal.shareOfNeed;
    // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw": 77 kcal per 100 g, refuse 25 %. 10 kg fresh → 7.5 kg edible
    // → 5,775 kcal, plus the stored 20 kg eaten evenly over 6 months from today; need 2,000 kcal a day (stated).
    expect(expected).toBeGreaterThan(5775 / (2000 * daysThisMonth()) - 1e-9);
    const { status, html } = await get(`/households/${t.household.id}`, t.viewer.cookie);
    expect(status).toBe(200);
    expect(html).toMatch(new RegExp(`data-testid="overview-energy-share"[^>]*>${Math.round(expected * 100)} %<`));
    expect(html).not.toContain('will show here');
    expect(html).toContain('data-testid="overview-larder"');
    expect(html).toMatch(/in store, in 1 lot/);
    // The latest harvests, newest first, with their weights in the household's units.
    expect(html).toContain('20 kg');
    expect(html).not.toContain('data-testid="next-steps"'); // every step is done
  });

  it('gives viewers no way to log a harvest, and /log a plain page instead of a form', async () => {
    const overview = (await get(`/households/${t.household.id}`, t.viewer.cookie)).html;
    expect(overview).not.toContain(`/households/${t.household.id}/log"`);
    const log = await get(`/households/${t.household.id}/log`, t.viewer.cookie);
    expect(log.status).toBe(200);
    expect(log.html).toContain('data-testid="log-viewer"');
    expect(log.html).not.toContain('astro-island');
    const growerView = (await get(`/households/${t.household.id}`, t.grower.cookie)).html;
    expect(growerView).toContain(`href="/households/${t.household.id}/log"`);
  });

  it('gives a new household its next steps, ticked from its records, until skipped', async () => {
    const u = await newVerifiedUser();
    const h = await createHousehold(u.cookie, { name: 'Fresh start' });
    let html = (await get(`/households/${h.id}`, u.cookie)).html;
    expect(html).toContain('data-testid="next-steps"');
    expect(html).toMatch(/data-testid="step-people" data-done="false"/);
    expect((await apiAs(u.cookie, 'POST', `/api/households/${h.id}/people`, { name: 'Bo', sex: 'male', ageYears: 30 })).status).toBe(201);
    html = (await get(`/households/${h.id}`, u.cookie)).html;
    expect(html).toMatch(/data-testid="step-people" data-done="true"/);
    expect(html).toMatch(/data-testid="step-crops" data-done="false"/);
    html = (await get(`/households/${h.id}`, `${u.cookie}; steps_skipped_${h.id}=1`)).html;
    expect(html).not.toContain('data-testid="next-steps"');
  });
});

describe('where sign-in lands', () => {
  it('opens the only household; the list stays one tap away', async () => {
    const u = await newVerifiedUser();
    const h = await createHousehold(u.cookie, { name: 'Only one' });
    const list = await get('/households', u.cookie);
    expect(list.status).toBe(303);
    expect(list.location).toBe(`/households/${h.id}`);
    expect((await get('/households?all=1', u.cookie)).status).toBe(200);
    const front = await get('/', u.cookie);
    expect(front.status).toBe(303);
    expect(front.location).toBe(`/households/${h.id}`);
    await createHousehold(u.cookie, { name: 'A second' });
    expect((await get('/households', u.cookie)).status).toBe(200);
  });
});

describe('the landing page', () => {
  const hideDemo = () => pool.query('UPDATE user SET email = ? WHERE email = ?', ['demo-hidden@selfsown.invalid', DEMO_EMAIL]);
  const showDemo = () => pool.query('UPDATE user SET email = ? WHERE email = ?', [DEMO_EMAIL, 'demo-hidden@selfsown.invalid']);

  it('says what Selfsown does and has no preview when there is no demo', async () => {
    await hideDemo();
    try {
      const { status, html } = await get('/');
      expect(status).toBe(200);
      expect(html).toContain('How much of what you eat comes from your own ground?');
      expect(html).toContain('href="/sign-up"');
      expect(html).not.toContain('data-testid="demo-preview"');
    } finally {
      await showDemo();
    }
  });

  it('previews the demo household’s growing year, without member data', async () => {
    await seedDemo(TEST_DB_URL, () => {});
    const { html } = await get('/');
    expect(html).toContain('data-testid="demo-preview"');
    expect(html).toContain(DEMO_HOUSEHOLD.name.replace('(', '(').slice(0, 12));
    expect(html).toMatch(/data-testid="demo-months"/);
    expect(html).not.toContain(DEMO_EMAIL);
    expect(html).not.toContain('Demo Grower');
  });
});
