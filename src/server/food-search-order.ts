/**
 * Whose dataset order a food search follows: the household named in ?household= (the caller must
 * be a member: 401/404 otherwise), else the signed-in person's current household (the `household`
 * cookie the household pages set), else none (datasets in the order they were loaded).
 */
import type { APIContext } from 'astro';
import { getPool } from '@/db/client';
import { householdAccess, requireUser } from './authz';
import { householdDatasetOrder } from './datasets';
import { HttpError } from './http';

export async function searchOrderFor(ctx: Pick<APIContext, 'locals' | 'cookies'>, householdParam?: string): Promise<string[] | undefined> {
  if (householdParam) {
    const user = requireUser(ctx);
    const a = await householdAccess(user.id, householdParam, 'read');
    return householdDatasetOrder(getPool(), a.household);
  }
  const remembered = ctx.cookies.get('household')?.value;
  if (!ctx.locals.user || !remembered) return undefined;
  try {
    const a = await householdAccess(ctx.locals.user.id, remembered, 'read');
    return householdDatasetOrder(getPool(), a.household);
  } catch (e) {
    // A remembered household the person has left: search without an order.
    if (e instanceof HttpError && e.status === 404) return undefined;
    throw e;
  }
}
