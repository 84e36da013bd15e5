/**
 * Accounts as a site administrator sees them: search by address or name, disable and enable
 * (disabled_accounts; sign-in is refused by the session hook in auth.ts and the account's sessions
 * are deleted at once), and a new confirmation mail for an address not yet confirmed.
 */
import { count, eq, like, or, sql } from 'drizzle-orm';
import { APIError } from 'better-auth/api';
import { getDb } from '@/db/client';
import { disabledAccounts, memberships, session, siteAdmins, user } from '@/db/schema';
import { recordAction, type Admin } from './admin';
import { HttpError } from './http';

export interface AccountRow {
  id: string;
  name: string;
  email: string;
  emailVerified: boolean;
  createdAt: Date;
  disabled: boolean;
  admin: boolean;
  households: number;
}

/** Accounts whose address or name contains `q` (all when empty), newest first, at most 50. */
export async function searchAccounts(q: string): Promise<AccountRow[]> {
  const words = q.trim();
  const rows = await getDb()
    .select({
      id: user.id,
      name: user.name,
      email: user.email,
      emailVerified: user.emailVerified,
      createdAt: user.createdAt,
      disabled: sql<number>`${disabledAccounts.userId} IS NOT NULL`,
      admin: sql<number>`${siteAdmins.userId} IS NOT NULL`,
      households: sql<number>`(SELECT COUNT(*) FROM ${memberships} WHERE ${memberships.userId} = ${user.id})`,
    })
    .from(user)
    .leftJoin(disabledAccounts, eq(disabledAccounts.userId, user.id))
    .leftJoin(siteAdmins, eq(siteAdmins.userId, user.id))
    .where(words ? or(like(user.email, `%${words}%`), like(user.name, `%${words}%`)) : undefined)
    .orderBy(sql`${user.createdAt} DESC`)
    .limit(50);
  return rows.map((r) => ({ ...r, disabled: Number(r.disabled) === 1, admin: Number(r.admin) === 1, households: Number(r.households) }));
}

async function accountOf(userId: string) {
  const [u] = await getDb().select({ id: user.id, email: user.email, emailVerified: user.emailVerified, name: user.name }).from(user).where(eq(user.id, userId));
  if (!u) throw new HttpError(404, 'not_found', 'No account has that id.');
  return u;
}

/** Disables (sessions deleted, sign-in refused) or enables an account; an administrator cannot disable themself. */
export async function setAccountDisabled(admin: Admin, userId: string, disabled: boolean): Promise<void> {
  const u = await accountOf(userId);
  if (disabled && u.id === admin.id) throw new HttpError(422, 'own_account', 'You cannot disable your own account.');
  await getDb().transaction(async (tx) => {
    if (disabled) {
      await tx.insert(disabledAccounts).ignore().values({ userId: u.id, disabledBy: admin.id });
      await tx.delete(session).where(eq(session.userId, u.id));
    } else {
      await tx.delete(disabledAccounts).where(eq(disabledAccounts.userId, u.id));
    }
    await recordAction(admin, disabled ? 'account.disable' : 'account.enable', u.email, '', tx);
  });
}

/** True when the account is disabled. */
export async function isDisabled(userId: string): Promise<boolean> {
  const [r] = await getDb().select({ n: count() }).from(disabledAccounts).where(eq(disabledAccounts.userId, userId));
  return (r?.n ?? 0) > 0;
}

/** better-auth's session hook: a disabled account gets no session, so it cannot sign in (403). */
export async function refuseDisabledSession(s: { userId: string }): Promise<void> {
  if (await isDisabled(s.userId)) {
    throw APIError.from('FORBIDDEN', { message: 'This account is disabled. Ask the site administrator.', code: 'ACCOUNT_DISABLED' });
  }
}

/** Sends a new confirmation mail through better-auth (only for an address not yet confirmed). */
export async function resendConfirmation(admin: Admin, userId: string, send: (email: string) => Promise<void>): Promise<void> {
  const u = await accountOf(userId);
  if (u.emailVerified) throw new HttpError(409, 'already_confirmed', `${u.email} is already confirmed.`);
  await send(u.email);
  await recordAction(admin, 'account.resend_confirmation', u.email);
}

