/**
 * The monthly letter once per member across both servers. Both run the letter job at the same
 * instants (LETTERS_SCHEDULE=every 10 s, src/cli/test-cluster.ts) and both find last month's letters
 * due (days 1–7 of a month, src/lib/letter-due.ts: the servers' LETTERS_NOW is the 2nd). The claim is a row under a unique key
 * (src/server/letters.ts): on Galera the loser gets a duplicate key or a certification conflict,
 * never a second mail. Mail goes to the run's fake SMTP server.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { dueLetterMonthIn } from '@/lib/letter-due';
import { monthText } from '@/lib/letter-text';
import { listMail } from '@/server/mail-outbox';
import { makeCrop } from '../support/entries';
import { addMember, createHousehold, newVerifiedUser, type TestUser } from '../support/users';
import { call, CLUSTER, lastMonth, logLines, onNode, sleep } from './support';

const ZONE = 'Europe/Berlin';
const { day, month } = lastMonth();
let members: TestUser[] = [];
let hid: number;

beforeAll(async () => {
  const [owner, grower] = await Promise.all([newVerifiedUser({ name: 'Lena Letter' }), newVerifiedUser({ name: 'Gil Letter' })]);
  hid = (await createHousehold(owner.cookie, { name: 'Letter row', timezone: ZONE })).id;
  await addMember(owner, hid, grower, 'grower');
  members = [owner, grower];
  const foods = await call(0, '', 'GET', '/api/foods?q=potato&dataset=ifct2017');
  const crop = await makeCrop(owner.cookie, hid, { name: 'Potato', foodId: foods.body.foods[0].id, category: 'root_tuber' });
  // Food eaten last month: without it the household gets no letter.
  for (const server of [0, 1]) {
    const h = await call(server, owner.cookie, 'POST', `/api/households/${hid}/harvests`, { date: day, cropId: crop.id, quantity: 5, unit: 'kg', use: 'fresh' });
    expect(h.status).toBe(201);
  }
});

const lettersTo = async (email: string) => (await listMail()).filter((m) => m.to.includes(email.toLowerCase()) && m.subject.includes(monthText(month))).length;

describe('the monthly letter with two servers', () => {
  it('is sent once to each member although both servers run the job at the same moments', async () => {
    expect(dueLetterMonthIn(ZONE, new Date(process.env.LETTERS_NOW!))).toBe(month);
    const runsBefore = [0, 1].map((s) => logLines(s, /^letters: \d+ sent/).length);
    // Wait until both letters are marked sent, then three more runs of both servers.
    for (let i = 0; i < 60; i++) {
      const rows = await onNode<{ status: string }>(CLUSTER.nodes[1]!, 'SELECT status FROM letters WHERE household_id = ? AND month = ?', [hid, month]);
      if (rows.length === members.length && rows.every((r) => r.status === 'sent')) break;
      await sleep(1000);
    }
    await sleep(31_000);

    for (const m of members) expect(await lettersTo(m.email)).toBe(1);
    const rows = await onNode<{ status: string; attempts: number }>(CLUSTER.nodes[2]!, 'SELECT status, attempts FROM letters WHERE household_id = ? AND month = ?', [hid, month]);
    expect(rows).toEqual(members.map(() => ({ status: 'sent', attempts: 1 })));
    // Both servers ran the job meanwhile (each logs a line when a letter was sent or skipped).
    const runsAfter = [0, 1].map((s) => logLines(s, /^letters: \d+ sent/).length);
    expect(runsAfter[0]! - runsBefore[0]!).toBeGreaterThan(0);
    expect(runsAfter[1]! - runsBefore[1]!).toBeGreaterThan(0);
    const sentBy = [0, 1].map((s) => logLines(s, /^letters: sent /).filter((l) => members.some((m) => l.includes(m.email))).length);
    console.log(`letters: ${members.length} members, ${members.length} mails; sent by A ${sentBy[0]}, by B ${sentBy[1]}; job runs A ${runsAfter[0]! - runsBefore[0]!}, B ${runsAfter[1]! - runsBefore[1]!}`);
  });
});
