import type { APIRoute } from 'astro';
import { errorResponse, handle, json } from '@/server/http';
import { readLetterToken } from '@/server/letter-token';
import { unsubscribe } from '@/server/letter-settings';

/**
 * POST /api/letters/unsubscribe?t=TOKEN — the one-click unsubscribe of RFC 8058 (a mail program
 * POSTs "List-Unsubscribe=One-Click" here, with no cookie): the signed token alone says whose letter
 * stops. 200 { monthlyLetter: false, household }; a bad or tampered token is 400, a membership
 * that is gone 404.
 */
export const POST: APIRoute = handle(async (ctx) => {
  const subject = readLetterToken(ctx.url.searchParams.get('t'));
  if (!subject) return errorResponse(400, 'invalid_token', 'This unsubscribe link is not valid: it may have been cut short or changed. Open it again from the letter, or switch the letter off on your account page.');
  const done = await unsubscribe(subject);
  if (!done) return errorResponse(404, 'not_found', 'This letter is no longer sent: the membership it belonged to is gone.');
  return json({ monthlyLetter: false, household: { id: done.householdId, name: done.householdName } });
});
