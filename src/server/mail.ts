/** Outgoing mail through nodemailer over SMTP (SMTP_URL; the local fake when it is empty). */
import nodemailer, { type Transporter } from 'nodemailer';
import { escapeHtml } from '@/lib/html-escape';
import { mailConfig } from './config';

let transport: Transporter | null = null;

function getTransport(): Transporter {
  if (!transport) transport = nodemailer.createTransport(mailConfig().smtpUrl);
  return transport;
}

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** Extra header lines, e.g. List-Unsubscribe. */
  headers?: Record<string, string>;
}

export async function sendMail(mail: Mail): Promise<void> {
  await getTransport().sendMail({ from: mailConfig().from, ...mail });
}

/** A plain-text + HTML message with one button-like link, in Selfsown's own wording. */
export function linkMail(to: string, subject: string, intro: string, linkLabel: string, url: string, outro: string): Mail {
  return {
    to,
    subject,
    text: `${intro}\n\n${linkLabel}:\n${url}\n\n${outro}\n\n— Selfsown`,
    html:
      `<div style="font-family:sans-serif;max-width:32rem;color:#2e2218">` +
      `<p>${escapeHtml(intro)}</p>` +
      `<p><a href="${escapeHtml(url)}" style="display:inline-block;padding:12px 20px;background:#3b6a24;color:#fff;border-radius:10px;text-decoration:none">${escapeHtml(linkLabel)}</a></p>` +
      `<p style="font-size:13px">Or paste this address into your browser: ${escapeHtml(url)}</p>` +
      `<p>${escapeHtml(outro)}</p><p>— Selfsown</p></div>`,
  };
}
