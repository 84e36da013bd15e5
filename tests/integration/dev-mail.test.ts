import { spawn } from 'node:child_process';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { api, BASE_URL } from '../support/env';
import { waitForMail } from '../support/mail';
import { signUp, TEST_PASSWORD, uniqueEmail } from '../support/users';

describe('the local outbox (/dev/mail, fake SMTP in use)', () => {
  it('lists the mail the fake received and shows a message with its links clickable', async () => {
    const email = uniqueEmail('outbox');
    await signUp({ name: 'Outbox Reader', email, password: TEST_PASSWORD });
    const msg = await waitForMail(email, { subject: /Confirm/ });

    const list = await api(`/dev/mail?to=${encodeURIComponent(email)}`);
    expect(list.status).toBe(200);
    expect(list.body).toContain(`href="/dev/mail/${msg.id}"`);
    expect(list.body).toContain('Confirm your e-mail for Selfsown');

    const one = await api(`/dev/mail/${msg.id}`);
    expect(one.status).toBe(200);
    const link = msg.links.find((l) => l.includes('/api/auth/verify-email'))!;
    // (an & in an attribute may be written as &amp; or &#38;)
    expect(one.body.replace(/&(amp|#38);/g, '&')).toContain(`<a href="${link}"`);
    // The HTML part is shown only inside a sandboxed frame.
    expect(one.body).toMatch(/<iframe[^>]*sandbox=""/);
  });

  it('answers 404 for a message id that is not one', async () => {
    expect((await api('/dev/mail/1700000000000-00000000')).status).toBe(404);
    expect((await api('/dev/mail/..%2Findex')).status).toBe(404);
  });
});

describe('the local outbox with a real SMTP server configured', () => {
  it('does not exist: /dev/mail answers 404', async () => {
    // A second app server from the same build, told to use a (non-existent) real SMTP server.
    const port = Number(new URL(BASE_URL).port) + 20000;
    const entry = resolve(process.env.SELFSOWN_OUT_DIR || 'dist', 'server/entry.mjs');
    const child = spawn('node', [entry], { env: { ...process.env, PORT: String(port), PUBLIC_ORIGIN: `http://127.0.0.1:${port}`, SMTP_URL: 'smtp://127.0.0.1:9' }, stdio: 'ignore' });
    try {
      let status = 0;
      for (let i = 0; i < 100 && !status; i += 1) {
        status = await fetch(`http://127.0.0.1:${port}/dev/mail`).then((r) => r.status, () => 0);
        if (!status) await new Promise((r) => setTimeout(r, 100));
      }
      expect(status).toBe(404);
      expect((await fetch(`http://127.0.0.1:${port}/`)).status).toBe(200);
    } finally {
      child.kill('SIGTERM');
    }
  });
});
