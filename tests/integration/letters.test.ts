/**
 * The monthly letter end to end: households logged through the API, `npm run letters` run as real
 * CLI processes (tsx src/cli/letters.ts) against the test database, mail received by the test run's
 * fake SMTP server. Each run names its households (--household) so letters of other test files'
 * households are never sent here.
 */
import { execFile } from 'node:child_process';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { simpleParser } from 'mailparser';
import type { Pool, RowDataPacket } from 'mysql2/promise';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dayText } from '@/lib/letter-text';
import { percentText } from '@/lib/share-scale';
import { formatWeight } from '@/lib/units';
import { mailConfig } from '@/server/config';
import { listMail } from '@/server/mail-outbox';
import { foodId, logHarvest, makeCrop } from '../support/entries';
import { api, testPool } from '../support/env';
import { linkTo, waitForMail } from '../support/mail';
import { addMember, apiAs, createHousehold, householdWithRoles, newVerifiedUser, type RoleFixture, type TestUser } from '../support/users';
import { freeLoopbackPort } from '@/cli/processes';

const root = new URL('../..', import.meta.url).pathname;

interface CliRun {
  code: number;
  stdout: string;
  stderr: string;
}

/** Runs `npm run letters -- …args` as its own process (tsx directly, as npm would). */
function letters(args: string[], env: NodeJS.ProcessEnv = {}): Promise<CliRun> {
  return new Promise((resolve) => {
    execFile(join(root, 'node_modules/.bin/tsx'), ['src/cli/letters.ts', ...args], { cwd: root, env: { ...process.env, ...env }, timeout: 60_000 }, (err, stdout, stderr) => {
      const code = err ? (typeof err.code === 'number' ? err.code : 1) : 0;
      resolve({ code, stdout, stderr });
    });
  });
}

const sentLines = (out: string) => out.split('\n').filter((l) => l.startsWith('sent '));

/** Letters in the outbox to `email` about `month` ('November 2026'). */
async function lettersTo(email: string, month: string): Promise<number> {
  return (await listMail()).filter((m) => m.to.includes(email.toLowerCase()) && m.subject.includes(month)).length;
}

/** A crop matched to USDA SR28 11352 (potatoes, raw), a harvest on each date and a person who eats. */
async function stock(owner: TestUser, householdId: number, dates: string[]): Promise<void> {
  const potato = await makeCrop(owner.cookie, householdId, { name: 'Potato', foodId: await foodId('11352'), category: 'root_tuber' });
  for (const date of dates) await logHarvest(owner.cookie, householdId, { date, cropId: potato.id, quantity: 6, unit: 'kg' });
  // Bought wheat flour (USDA SR28 20081) so the home share of intake is below 100 %.
  const bought = await apiAs(owner.cookie, 'POST', `/api/households/${householdId}/purchases`, { date: dates[0], foodId: await foodId('20081'), quantity: 2, unit: 'kg' });
  expect(bought.status).toBe(201);
  const person = await apiAs(owner.cookie, 'POST', `/api/households/${householdId}/people`, { name: 'Ada', sex: 'female', ageYears: 34, kcalPerDay: 2000 });
  expect(person.status).toBe(201);
}

async function letterRows(pool: Pool, householdId: number, month: string) {
  const [rows] = await pool.query<RowDataPacket[]>('SELECT user_id, status, attempts, error FROM letters WHERE household_id = ? AND month = ? ORDER BY user_id', [householdId, month]);
  return rows as { user_id: string; status: string; attempts: number; error: string | null }[];
}

let pool: Pool;
let t: RoleFixture;
let hid: number;

beforeAll(async () => {
  pool = testPool();
  t = await householdWithRoles({ name: 'Letter Hill' });
  hid = t.household.id;
  await stock(t.owner, hid, ['2026-11-05', '2026-12-01']);
  // A stored lot eaten over four months, so the larder has something to tell.
  await logHarvest(t.owner.cookie, hid, { date: '2026-11-20', foodId: await foodId('11352'), quantity: 20, unit: 'kg', use: 'stored', spreadMonths: 4 });
});

afterAll(async () => {
  await pool.end();
});

describe('npm run letters -- --month', () => {
  it('sends one letter to the owner and the grower, none to the viewer, with the share report numbers of that month', async () => {
    const run = await letters(['--month', '2026-11', '--household', String(hid)]);
    expect(run.code, run.stderr).toBe(0);
    expect(sentLines(run.stdout).sort()).toEqual([`sent 2026-11 to ${t.grower.email} for Letter Hill`, `sent 2026-11 to ${t.owner.email} for Letter Hill`].sort());
    expect(run.stdout).toContain('2 sent, 0 skipped, 0 failed, 0 uncertain');

    const share = await apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/share?from=2026-11&to=2026-11`);
    expect(share.status).toBe(200);
    const v = share.body.months[0].values;
    expect(v.energy_kcal.shareOfIntake).toBeGreaterThan(0);
    expect(v.energy_kcal.shareOfIntake).toBeLessThan(1);
    const msg = await waitForMail(t.owner.email, { subject: /November 2026/ });
    expect(msg.text).toContain(`Calories: ${percentText(v.energy_kcal.shareOfIntake)} of what you ate was home-grown; that is ${percentText(v.energy_kcal.shareOfNeed)} of what the household needs.`);
    expect(msg.text).toContain(`Protein: ${percentText(v.protein_g.shareOfIntake)} of what you ate was home-grown; that is ${percentText(v.protein_g.shareOfNeed)} of what the household needs.`);
    expect(msg.subject).toBe(`Letter Hill · November 2026: ${percentText(v.energy_kcal.shareOfIntake)} of calories home-grown`);
    expect(msg.text).toContain('Potato:'); // the crop that did most
    // The larder as its own API reckons it today.
    const larder = await apiAs(t.owner.cookie, 'GET', `/api/households/${hid}/larder`);
    expect(larder.status).toBe(200);
    const lot = larder.body.byCrop[0];
    expect(lot.remainingGrams).toBeGreaterThan(0);
    expect(msg.text).toContain(`- ${lot.label}: ${formatWeight(lot.remainingGrams, 'metric')}, runs out about ${dayText(lot.runsOut)}.`);
    expect(msg.html).toContain('Letter Hill');
    expect(await lettersTo(t.viewer.email, 'November 2026')).toBe(0);
  });

  it('carries the unsubscribe link in the List-Unsubscribe headers, with one-click POST', async () => {
    const msg = await waitForMail(t.owner.email, { subject: /November 2026/ });
    const parsed = await simpleParser(await readFile(join(mailConfig().mailDir, `${msg.id}.eml`)));
    const header = (key: string) => parsed.headerLines.find((h) => h.key === key)?.line.replace(/\r?\n\s+/g, ' ') ?? '';
    expect(header('list-unsubscribe')).toContain(`<${linkTo(msg, '/letters/unsubscribe')}>`);
    expect(header('list-unsubscribe-post')).toBe('List-Unsubscribe-Post: List-Unsubscribe=One-Click');
  });

  it('sends nothing more on a second run', async () => {
    const run = await letters(['--month', '2026-11', '--household', String(hid)]);
    expect(run.code).toBe(0);
    expect(sentLines(run.stdout)).toEqual([]);
    expect(run.stdout).toContain('0 sent, 2 skipped');
    expect(await lettersTo(t.owner.email, 'November 2026')).toBe(1);
    expect(await lettersTo(t.grower.email, 'November 2026')).toBe(1);
  });

  it('writes to a viewer once they switch the letter on (and only to them)', async () => {
    const on = await apiAs(t.viewer.cookie, 'PATCH', `/api/households/${hid}/letter`, { monthlyLetter: true });
    expect(on.status).toBe(200);
    expect(on.body).toEqual({ monthlyLetter: true });
    const bad = await apiAs(t.viewer.cookie, 'PATCH', `/api/households/${hid}/letter`, { monthlyLetter: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('monthlyLetter');
    const run = await letters(['--month', '2026-11', '--household', String(hid)]);
    expect(sentLines(run.stdout)).toEqual([`sent 2026-11 to ${t.viewer.email} for Letter Hill`]);
  });

  it('skips a household with nothing eaten in the month', async () => {
    const owner = await newVerifiedUser({ name: 'Quiet Owner' });
    const quiet = await createHousehold(owner.cookie, { name: 'Quiet plot' });
    const run = await letters(['--month', '2026-11', '--household', String(quiet.id)]);
    expect(run.code).toBe(0);
    expect(run.stdout).toContain('0 sent, 0 skipped, 0 failed, 0 uncertain');
    expect(run.stdout).toContain('1 household(s) with nothing eaten in the month: no letter');
    expect(await lettersTo(owner.email, 'November 2026')).toBe(0);
  });
});

describe('at most once, retried when it failed', () => {
  it('two processes started at the same moment send each letter once', async () => {
    const owner = await newVerifiedUser({ name: 'Twin Owner' });
    const grower = await newVerifiedUser({ name: 'Twin Grower' });
    const h = await createHousehold(owner.cookie, { name: 'Twin beds' });
    await addMember(owner, h.id, grower, 'grower');
    await stock(owner, h.id, ['2026-11-10']);
    const args = ['--month', '2026-11', '--household', String(h.id)];
    const [a, b] = await Promise.all([letters(args), letters(args)]);
    expect(a.code).toBe(0);
    expect(b.code).toBe(0);
    const sent = [...sentLines(a.stdout), ...sentLines(b.stdout)].sort();
    expect(sent).toEqual([`sent 2026-11 to ${grower.email} for Twin beds`, `sent 2026-11 to ${owner.email} for Twin beds`].sort());
    expect(await lettersTo(owner.email, 'November 2026')).toBe(1);
    expect(await lettersTo(grower.email, 'November 2026')).toBe(1);
    expect((await letterRows(pool, h.id, '2026-11')).map((r) => r.status)).toEqual(['sent', 'sent']);
  });

  it('marks a send the SMTP server refused as failed, and the next run sends it', async () => {
    const owner = await newVerifiedUser({ name: 'Retry Owner' });
    const h = await createHousehold(owner.cookie, { name: 'Retry row' });
    await stock(owner, h.id, ['2026-11-12']);
    const args = ['--month', '2026-11', '--household', String(h.id)];

    const down = await letters(args, { SMTP_URL: `smtp://127.0.0.1:${await freeLoopbackPort()}` });
    expect(down.code).toBe(1);
    expect(down.stdout).toContain(`failed 2026-11 to ${owner.email} for Retry row`);
    expect(down.stdout).toContain('0 sent, 0 skipped, 1 failed');
    const [failed] = await letterRows(pool, h.id, '2026-11');
    expect(failed).toMatchObject({ status: 'failed', attempts: 1 });
    expect(failed!.error).toMatch(/ECONNREFUSED|connect/i);
    expect(await lettersTo(owner.email, 'November 2026')).toBe(0);

    const up = await letters(args);
    expect(up.code).toBe(0);
    expect(sentLines(up.stdout)).toEqual([`sent 2026-11 to ${owner.email} for Retry row`]);
    expect((await letterRows(pool, h.id, '2026-11'))[0]).toMatchObject({ status: 'sent', attempts: 2, error: null });
    expect(await lettersTo(owner.email, 'November 2026')).toBe(1);
  });
});

describe('unsubscribe', () => {
  it("stops the next month's letter from the mailed link, without signing in", async () => {
    const msg = await waitForMail(t.owner.email, { subject: /November 2026/ });
    const link = linkTo(msg, '/letters/unsubscribe');
    const path = link.slice(new URL(link).origin.length);
    const page = await api(path);
    expect(page.status).toBe(200);
    expect(page.body).toContain('Stop the monthly letter?');
    expect(page.body).toContain('Letter Hill');
    const done = await api(path, { method: 'POST', headers: { origin: new URL(link).origin, 'content-type': 'application/x-www-form-urlencoded' }, body: '' });
    expect(done.status).toBe(200);
    expect(done.body).toContain('The letter is off');

    const run = await letters(['--month', '2026-12', '--household', String(hid)]);
    const sent = sentLines(run.stdout);
    expect(sent).toContain(`sent 2026-12 to ${t.grower.email} for Letter Hill`);
    expect(sent.some((l) => l.includes(t.owner.email))).toBe(false);
  });

  it('answers the one-click POST of a mail program (RFC 8058) from another origin', async () => {
    const msg = await waitForMail(t.grower.email, { subject: /December 2026/ });
    const link = linkTo(msg, '/letters/unsubscribe');
    const t2 = new URL(link).searchParams.get('t')!;
    const r = await api(`/api/letters/unsubscribe?t=${t2}`, { method: 'POST', headers: { origin: 'https://mail.example', 'content-type': 'application/x-www-form-urlencoded' }, body: 'List-Unsubscribe=One-Click' });
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ monthlyLetter: false, household: { id: hid, name: 'Letter Hill' } });
    const [row] = await pool.query<RowDataPacket[]>('SELECT monthly_letter FROM memberships WHERE household_id = ? AND user_id = ?', [hid, t.grower.id]);
    expect(Boolean(row[0]!.monthly_letter)).toBe(false);
  });

  it('refuses a tampered token with a clear 400, on the page and the API', async () => {
    const msg = await waitForMail(t.owner.email, { subject: /November 2026/ });
    const token = new URL(linkTo(msg, '/letters/unsubscribe')).searchParams.get('t')!;
    const [payload, mac] = token.split('.') as [string, string];
    const forged = `${Buffer.from(`${hid}.${t.viewer.id}`).toString('base64url')}.${mac}`;
    for (const bad of [forged, `${payload}.${mac.slice(0, -2)}xx`, 'nonsense']) {
      const page = await api(`/letters/unsubscribe?t=${encodeURIComponent(bad)}`);
      expect(page.status).toBe(400);
      expect(page.body).toContain('This link does not work');
      const r = await api(`/api/letters/unsubscribe?t=${encodeURIComponent(bad)}`, { method: 'POST' });
      expect(r.status).toBe(400);
      expect(r.body.error.code).toBe('invalid_token');
    }
    const [row] = await pool.query<RowDataPacket[]>('SELECT monthly_letter FROM memberships WHERE household_id = ? AND user_id = ?', [hid, t.viewer.id]);
    expect(Boolean(row[0]!.monthly_letter)).toBe(true); // the forged token named the viewer: still on
  });
});

describe('npm run letters -- --due', () => {
  it("sends each household's letter on its own first day of the month", async () => {
    const [kiwi, angeleno] = await Promise.all([newVerifiedUser({ name: 'Kiri' }), newVerifiedUser({ name: 'Lupe' })]);
    const auckland = await createHousehold(kiwi.cookie, { name: 'Waitakere garden', timezone: 'Pacific/Auckland' });
    const la = await createHousehold(angeleno.cookie, { name: 'Echo Park yard', timezone: 'America/Los_Angeles' });
    await stock(kiwi, auckland.id, ['2026-12-01']);
    await stock(angeleno, la.id, ['2026-12-01']);
    const ids = `${auckland.id},${la.id}`;

    // 2027-01-01T02:00Z is 15:00 on 1 January in Auckland (NZDT, UTC+13) and 18:00 on 31 December
    // in Los Angeles (PST, UTC−8) (IANA tz database).
    const first = await letters(['--due', '--now', '2027-01-01T02:00:00Z', '--household', ids]);
    expect(first.code, first.stderr).toBe(0);
    expect(sentLines(first.stdout)).toEqual([`sent 2026-12 to ${kiwi.email} for Waitakere garden`]);

    // 08:30Z is 00:30 on 1 January in Los Angeles; Auckland's letter is already sent.
    const second = await letters(['--due', '--now', '2027-01-01T08:30:00Z', '--household', ids]);
    expect(sentLines(second.stdout)).toEqual([`sent 2026-12 to ${angeleno.email} for Echo Park yard`]);
    expect(await lettersTo(kiwi.email, 'December 2026')).toBe(1);
  });

  it('refuses a bad command line with the usage', async () => {
    const r = await letters(['--month', '2026-13']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('month must be YYYY-MM');
    expect(r.stderr).toContain('usage: npm run letters');
  });
});
