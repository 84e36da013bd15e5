/**
 * Invitations to a household by e-mail. The mailed token is 32 random bytes (base64url); only its
 * SHA-256 is stored. A token works once, for INVITATION_DAYS days, and not after it is revoked.
 *
 * Accepting needs a signed-in account with a confirmed e-mail address; the address need not be
 * the one invited (mail gets forwarded, people have several addresses), so the invitation records
 * who accepted it (accepted_by). Whoever holds the link can join: owners should revoke links that
 * went astray.
 */
import { createHash, randomBytes } from 'node:crypto';
import { and, desc, eq, gt, isNull } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { households, invitations, memberships, user, type Household, type Role } from '@/db/schema';
import { ROLE_LABELS } from '@/lib/household-schemas';
import { publicOrigin } from './config';
import { HttpError } from './http';
import { linkMail, sendMail } from './mail';

export const INVITATION_DAYS = 7;

export type InvitationStatus = 'pending' | 'accepted' | 'revoked' | 'expired';
export type Invitation = typeof invitations.$inferSelect;

/** SHA-256 of a token, hex: what the database keeps. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export function newToken(): string {
  return randomBytes(32).toString('base64url');
}

export function invitationLink(token: string): string {
  return `${publicOrigin()}/invite/${token}`;
}

export function invitationStatus(inv: Invitation, now = new Date()): InvitationStatus {
  if (inv.acceptedAt) return 'accepted';
  if (inv.revokedAt) return 'revoked';
  if (inv.expiresAt <= now) return 'expired';
  return 'pending';
}

export function invitationJson(inv: Invitation) {
  return { id: inv.id, email: inv.email, role: inv.role, status: invitationStatus(inv), expiresAt: inv.expiresAt.toISOString(), createdAt: inv.createdAt.toISOString() };
}

/**
 * Creates an invitation (an older pending one to the same address in this household is revoked,
 * so only the newest link works) and mails the link. Someone already a member is refused with 409.
 */
export async function inviteByEmail(household: Household, inviterId: string, email: string, role: Role): Promise<Invitation> {
  const db = getDb();
  const [me] = await db.select({ name: user.name }).from(user).where(eq(user.id, inviterId));
  const inviter = { id: inviterId, name: me?.name ?? 'A Selfsown user' };
  const existing = await db
    .select({ userId: memberships.userId })
    .from(memberships)
    .innerJoin(user, eq(user.id, memberships.userId))
    .where(and(eq(memberships.householdId, household.id), eq(user.email, email)))
    .limit(1);
  if (existing.length) throw new HttpError(409, 'already_member', `${email} is already a member of this household.`, { email: 'Already a member.' });

  const token = newToken();
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 60 * 60 * 1000);
  const id = await db.transaction(async (tx) => {
    await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(and(eq(invitations.householdId, household.id), eq(invitations.email, email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
    const [res] = await tx.insert(invitations).values({ householdId: household.id, email, role, tokenHash: hashToken(token), invitedBy: inviter.id, expiresAt });
    return res.insertId;
  });
  try {
    await sendMail(
      linkMail(
        email,
        `${inviter.name} invites you to ${household.name} on Selfsown`,
        `${inviter.name} invites you to join the household "${household.name}" on Selfsown as ${ROLE_LABELS[role].replace(' — ', ': ')}.`,
        'See the invitation',
        invitationLink(token),
        `The link works once and for ${INVITATION_DAYS} days. If you do not know ${inviter.name}, ignore this mail.`,
      ),
    );
  } catch (e) {
    // No mail, no invitation: the owner sees the failure and can try again.
    await db.delete(invitations).where(and(eq(invitations.id, id), eq(invitations.householdId, household.id)));
    console.error('invitation mail failed', e);
    throw new HttpError(502, 'mail_failed', 'The invitation mail could not be sent. Please try again later.');
  }
  const [inv] = await db.select().from(invitations).where(and(eq(invitations.id, id), eq(invitations.householdId, household.id)));
  return inv!;
}

/** Invitations of a household that can still be accepted, newest first. */
export async function listPendingInvitations(householdId: number): Promise<Invitation[]> {
  return getDb()
    .select()
    .from(invitations)
    .where(and(eq(invitations.householdId, householdId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
    .orderBy(desc(invitations.createdAt), desc(invitations.id));
}

/** Revokes an invitation of this household (404 for another household's; 409 once accepted). */
export async function revokeInvitation(householdId: number, invitationId: number): Promise<void> {
  const db = getDb();
  const [inv] = await db.select().from(invitations).where(and(eq(invitations.id, invitationId), eq(invitations.householdId, householdId)));
  if (!inv) throw new HttpError(404, 'not_found', 'No such invitation in this household.');
  if (inv.acceptedAt) throw new HttpError(409, 'invitation_used', 'This invitation was already accepted; remove the member instead.');
  if (inv.revokedAt) return;
  await db.update(invitations).set({ revokedAt: new Date() }).where(and(eq(invitations.id, invitationId), eq(invitations.householdId, householdId)));
}

export interface InvitationView {
  invitation: Invitation;
  household: Household;
  invitedByName: string | null;
  status: InvitationStatus;
}

/** What the /invite/{token} page shows; null for a token that never existed. */
export async function findInvitation(token: string): Promise<InvitationView | null> {
  if (!/^[A-Za-z0-9_-]{43}$/.test(token)) return null;
  const rows = await getDb()
    .select({ invitation: invitations, household: households, invitedByName: user.name })
    .from(invitations)
    .innerJoin(households, eq(households.id, invitations.householdId))
    .leftJoin(user, eq(user.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, hashToken(token)))
    .limit(1);
  const r = rows[0];
  return r ? { ...r, status: invitationStatus(r.invitation) } : null;
}

const GONE: Record<Exclude<InvitationStatus, 'pending'>, [string, string]> = {
  accepted: ['invitation_used', 'This invitation has already been used. Ask the household owner for a new one.'],
  revoked: ['invitation_revoked', 'This invitation was withdrawn by the household owner. Ask them for a new one.'],
  expired: ['invitation_expired', `This invitation has expired (they last ${INVITATION_DAYS} days). Ask the household owner for a new one.`],
};

/**
 * Accepts an invitation for a signed-in person whose confirmed address is the invited one: adds the membership with
 * the invited role, marks the token used — both or neither. Someone already a member keeps the
 * role they have (an invitation never demotes or promotes).
 */
export async function acceptInvitation(token: string, who: { id: string; email: string; emailVerified: boolean }): Promise<{ householdId: number; role: Role; alreadyMember: boolean }> {
  if (!who.emailVerified) throw new HttpError(403, 'email_unverified', 'Confirm your e-mail address before joining a household.');
  const tokenHash = hashToken(token);
  return getDb().transaction(async (tx) => {
    // FOR UPDATE: two tabs accepting the same link cannot both succeed.
    const [inv] = await tx.select().from(invitations).where(eq(invitations.tokenHash, tokenHash)).for('update');
    if (!inv) throw new HttpError(404, 'invitation_not_found', 'This invitation link is not valid. Check that you copied all of it.');
    const status = invitationStatus(inv);
    if (status !== 'pending') {
      const [code, message] = GONE[status];
      throw new HttpError(410, code, message);
    }
    // The link is for the address it was sent to: a forwarded or leaked link lets nobody else in.
    if (inv.email.trim().toLowerCase() !== who.email.trim().toLowerCase()) {
      throw new HttpError(403, 'invitation_other_address', `This invitation was sent to ${inv.email}. Sign in with that address to accept it, or ask the owner to invite the address you use.`);
    }
    await tx.update(invitations).set({ acceptedAt: new Date(), acceptedBy: who.id }).where(eq(invitations.id, inv.id));
    const [member] = await tx
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.householdId, inv.householdId), eq(memberships.userId, who.id)));
    if (member) return { householdId: inv.householdId, role: member.role, alreadyMember: true };
    await tx.insert(memberships).values({ householdId: inv.householdId, userId: who.id, role: inv.role, monthlyLetter: inv.role !== 'viewer' });
    return { householdId: inv.householdId, role: inv.role, alreadyMember: false };
  });
}
