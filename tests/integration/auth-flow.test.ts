import { describe, expect, it } from 'vitest';
import { api, BASE_URL } from '../support/env';
import { lastMailId, linkTo, waitForMail } from '../support/mail';
import { apiAs, followVerificationLink, newVerifiedUser, signIn, signUp, TEST_PASSWORD, uniqueEmail } from '../support/users';

async function session(cookie: string) {
  return (await apiAs(cookie, 'GET', '/api/auth/get-session')).body;
}

describe('sign-up, e-mail verification and sign-in', () => {
  it('mails a verification link to the fake SMTP server; following it confirms the address and signs in', async () => {
    const email = uniqueEmail('newcomer');
    const up = await signUp({ name: 'Nia Newcomer', email, password: TEST_PASSWORD, next: '/invite/abc' });
    expect(up.status).toBe(200);
    expect(up.body.user.emailVerified).toBe(false);
    // No session before the address is confirmed.
    expect(up.headers.getSetCookie().some((c) => c.includes('session_token=') && !c.includes('session_token=;'))).toBe(false);

    const mail = await waitForMail(email, { subject: /Confirm your e-mail/ });
    expect(mail.text).toContain('Nia Newcomer');
    const link = linkTo(mail, '/api/auth/verify-email');
    expect(new URL(link).origin).toBe(BASE_URL);

    const v = await followVerificationLink(link);
    expect(v.status).toBe(302);
    // Lands on our own result page, carrying where to go next.
    expect(v.location).toBe('/verify?next=%2Finvite%2Fabc');
    const s = await session(v.cookie);
    expect(s.user.email).toBe(email);
    expect(s.user.emailVerified).toBe(true);

    const page = await api('/verify?next=%2Finvite%2Fabc', { headers: { cookie: v.cookie } });
    expect(page.status).toBe(200);
    expect(page.body).toContain('Your address is confirmed');
    expect(page.body).toContain('href="/invite/abc"');

    const inAgain = await signIn(email, TEST_PASSWORD);
    expect(inAgain.status).toBe(200);
    expect((await session(inAgain.cookie)).user.email).toBe(email);
  });

  it('refuses to sign in an unconfirmed address with 403 and mails a fresh link', async () => {
    const email = uniqueEmail('unconfirmed');
    await signUp({ name: 'Uma', email, password: TEST_PASSWORD });
    const first = await waitForMail(email, { subject: /Confirm/ });
    const r = await signIn(email, TEST_PASSWORD);
    expect(r.status).toBe(403);
    expect(r.body.code).toBe('EMAIL_NOT_VERIFIED');
    expect(r.cookie).toBe('');
    const second = await waitForMail(email, { subject: /Confirm/, after: first.id });
    expect(second.id).not.toBe(first.id);
  });

  it('answers a sign-up with a known address like any other, and tells the owner by mail', async () => {
    const u = await newVerifiedUser({ name: 'Known' });
    const r = await signUp({ name: 'Impostor', email: u.email, password: 'another-password-1' });
    expect(r.status).toBe(200);
    const mail = await waitForMail(u.email, { subject: /already have a Selfsown account/ });
    expect(mail.links.some((l) => l.endsWith('/sign-in'))).toBe(true);
    // The old password still works; the attempt changed nothing.
    expect((await signIn(u.email, u.password)).status).toBe(200);
  });

  it('sends a broken verification link to /verify with the reason', async () => {
    const v = await followVerificationLink(`${BASE_URL}/api/auth/verify-email?token=not-a-token&callbackURL=%2Fverify`);
    expect(v.status).toBe(302);
    expect(v.location).toBe('/verify?error=INVALID_TOKEN');
    expect(v.cookie).not.toContain('session_token');
    const page = await api('/verify?error=INVALID_TOKEN');
    expect(page.body).toContain('not valid');
  });

  it('rejects a wrong password with 401 and sets no session', async () => {
    const u = await newVerifiedUser();
    const r = await signIn(u.email, 'not-the-password');
    expect(r.status).toBe(401);
    expect(r.cookie).toBe('');
  });

  it('rejects a password shorter than 10 characters at sign-up', async () => {
    const r = await signUp({ name: 'Shorty', email: uniqueEmail('short'), password: 'short' });
    expect(r.status).toBe(400);
    expect(r.body.code).toBe('PASSWORD_TOO_SHORT');
  });

  it('ends the session on sign-out', async () => {
    const u = await newVerifiedUser();
    expect((await session(u.cookie)).user.id).toBe(u.id);
    const out = await apiAs(u.cookie, 'POST', '/api/auth/sign-out', {}, { origin: BASE_URL });
    expect(out.status).toBe(200);
    expect(await session(u.cookie)).toBeNull();
    expect((await apiAs(u.cookie, 'GET', '/api/households')).status).toBe(401);
  });
});

describe('password reset by e-mail', () => {
  it('mails a link that lands on /reset-password with a token; the new password works, the old one and old sessions do not', async () => {
    const u = await newVerifiedUser({ name: 'Forgetful' });
    const before = await lastMailId();
    const ask = await apiAs('', 'POST', '/api/auth/request-password-reset', { email: u.email, redirectTo: '/reset-password' });
    expect(ask.status).toBe(200);
    const mail = await waitForMail(u.email, { subject: /new Selfsown password/, after: before });
    const link = linkTo(mail, '/api/auth/reset-password/');

    const hop = await fetch(link, { redirect: 'manual' });
    expect(hop.status).toBe(302);
    const landing = new URL(hop.headers.get('location')!, BASE_URL);
    expect(landing.origin).toBe(BASE_URL);
    expect(landing.pathname).toBe('/reset-password');
    const token = landing.searchParams.get('token')!;
    expect(token).toBeTruthy();
    const page = await api(landing.pathname + landing.search);
    expect(page.status).toBe(200);
    expect(page.body).toContain('Choose a new password');

    const reset = await apiAs('', 'POST', '/api/auth/reset-password', { token, newPassword: 'a-fresh-long-password' });
    expect(reset.status).toBe(200);
    expect((await signIn(u.email, u.password)).status).toBe(401);
    expect((await signIn(u.email, 'a-fresh-long-password')).status).toBe(200);
    // revokeSessionsOnPasswordReset: the session from before the reset is gone.
    expect(await session(u.cookie)).toBeNull();

    // The token works once.
    const again = await apiAs('', 'POST', '/api/auth/reset-password', { token, newPassword: 'yet-another-password' });
    expect(again.status).toBe(400);
    const hopAgain = await fetch(link, { redirect: 'manual' });
    expect(hopAgain.headers.get('location')).toContain('error=INVALID_TOKEN');
  });

  it('refuses a reset request that asks to send the token to another site', async () => {
    const u = await newVerifiedUser();
    const r = await apiAs('', 'POST', '/api/auth/request-password-reset', { email: u.email, redirectTo: 'https://elsewhere.example/catch' });
    expect(r.status).toBe(403);
    await expect(waitForMail(u.email, { subject: /new Selfsown password/, timeoutMs: 500 })).rejects.toThrow(/no mail/);
  });

  it('answers the same for an address without an account and sends nothing', async () => {
    const email = uniqueEmail('nobody');
    const r = await apiAs('', 'POST', '/api/auth/request-password-reset', { email, redirectTo: '/reset-password' });
    expect(r.status).toBe(200);
    await expect(waitForMail(email, { timeoutMs: 500 })).rejects.toThrow(/no mail/);
  });
});
