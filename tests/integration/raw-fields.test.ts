/**
 * A raw read (src/server/raw-query.ts: selectList + readFields over the binary protocol) gives a
 * row exactly as Drizzle's own select gives it: the household gate (src/server/authz.ts) reads the
 * household and the session this way, and every route after it relies on their types — a Date for
 * a TIMESTAMP (to the millisecond), a boolean for a BOOLEAN, null for an empty column, numbers.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { eq, getTableColumns, sql } from 'drizzle-orm';
import { households, people, session, user } from '@/db/schema';
import { dbOn } from '@/server/db-on';
import { listPeople } from '@/server/people';
import { rawQuery, readFields, selectList } from '@/server/raw-query';
import { TEST_DB_URL, testPool } from '../support/env';
import { apiAs, createHousehold, newVerifiedUser } from '../support/users';

const pool = testPool();
afterAll(() => pool.end());

describe('readFields', () => {
  it('reads a household as Drizzle does, the empty columns as null and some set', async () => {
    const u = await newVerifiedUser();
    const bare = await createHousehold(u.cookie);
    const set = await createHousehold(u.cookie, { name: 'Set plot' });
    await pool.query("UPDATE households SET records_since = '2025-03', last_spring_frost = '04-20', currency = 'EUR', dataset_order = 'sr28,ifct2017' WHERE id = ?", [set.id]);
    // Every column, as the gate reads them.
    const columns = getTableColumns(households);
    const read = rawQuery<Record<string, unknown>>(sql`SELECT ${selectList(columns, 'h.')} FROM ${households} WHERE ${eq(households.id, sql.placeholder('id'))}`);
    for (const id of [bare.id, set.id]) {
      const [viaDrizzle] = await dbOn(pool).select().from(households).where(eq(households.id, id));
      const [raw] = await read.run(pool, { id });
      const viaRaw = readFields(columns, raw!, 'h.');
      expect(viaRaw).toEqual(viaDrizzle);
      expect(viaRaw.createdAt).toBeInstanceOf(Date);
      expect(typeof viaRaw.yearStartMonth).toBe('number');
    }
  });

  it('reads a session and its user as Drizzle does: a millisecond TIMESTAMP and a BOOLEAN', async () => {
    const u = await newVerifiedUser();
    const columns = { sessionId: session.id, expiresAt: session.expiresAt, userId: user.id, email: user.email, emailVerified: user.emailVerified };
    const [{ id }] = (await dbOn(pool).select({ id: session.id }).from(session).innerJoin(user, eq(user.id, session.userId)).where(eq(user.email, u.email)).limit(1)) as [{ id: string }];
    // A time with milliseconds, and the flag both ways.
    await pool.query("UPDATE session SET expires_at = '2031-05-06 07:08:09.123' WHERE id = ?", [id]);
    const read = rawQuery<Record<string, unknown>>(sql`SELECT ${selectList(columns)} FROM ${session} JOIN ${user} ON ${eq(user.id, session.userId)} WHERE ${eq(session.id, sql.placeholder('id'))}`);
    for (const verified of [true, false]) {
      await pool.query('UPDATE user SET email_verified = ? WHERE email = ?', [verified, u.email]);
      const [viaDrizzle] = await dbOn(pool).select(columns).from(session).innerJoin(user, eq(user.id, session.userId)).where(eq(session.id, id));
      const [raw] = await read.run(pool, { id });
      const viaRaw = readFields(columns, raw!);
      expect(viaRaw).toEqual(viaDrizzle);
      expect(viaRaw.emailVerified).toBe(verified);
      expect(viaRaw.expiresAt.toISOString()).toBe('2031-05-06T07:08:09.123Z');
    }
  });

  it("reads a household's people as Drizzle does: doubles, 'YYYY-MM' and date columns, a BOOLEAN, nulls (listPeople)", async () => {
    const u = await newVerifiedUser();
    const h = await createHousehold(u.cookie);
    const adult = { name: 'Ada', sex: 'female', ageYears: 41.5, heightCm: 168.2, weightKg: 61.4, activity: 'active', presentFrom: '2026-03-01' };
    const baby = { name: 'Bo', sex: 'male', birthMonth: '2026-09', fedFromHousehold: true };
    for (const p of [adult, baby]) expect((await apiAs(u.cookie, 'POST', `/api/households/${h.id}/people`, p)).status).toBe(201);
    const viaDrizzle = await dbOn(pool).select().from(people).where(eq(people.householdId, h.id)).orderBy(people.name, people.id);
    expect(process.env.DATABASE_URL).toBe(TEST_DB_URL); // listPeople reads through the app's shared client
    const viaRaw = await listPeople(h.id);
    expect(viaRaw).toEqual(viaDrizzle);
    expect(viaRaw.map((p) => [p.name, p.fedFromHousehold, p.presentFrom, p.heightCm])).toEqual([['Ada', false, '2026-03-01', 168.2], ['Bo', true, null, null]]);
  });
});
