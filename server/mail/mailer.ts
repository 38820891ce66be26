// Outgoing e-mail through nodemailer. Locally it reaches the SMTP catcher on loopback (scripts/ start it).
import nodemailer from 'nodemailer';
import { config } from '@/server/config';

const transport = nodemailer.createTransport({
  host: config.mail.host,
  port: config.mail.port,
  secure: false,
  ignoreTLS: true,
});

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  await transport.sendMail({ from: config.mail.from, ...mail });
}

/** Text made safe to put into HTML (mail bodies, the development mail page). */
export const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** A plain message with one button-like link, in both text and HTML. */
export function linkMail(
  to: string,
  subject: string,
  greeting: string,
  body: string,
  label: string,
  url: string,
): OutgoingMail {
  return {
    to,
    subject,
    text: `${greeting}\n\n${body}\n\n${label}: ${url}\n\nIf you did not ask for this, you can ignore this message.\n— Tactus`,
    html:
      `<p>${escapeHtml(greeting)}</p><p>${escapeHtml(body)}</p>` +
      `<p><a href="${escapeHtml(url)}" style="background:#1f5f5b;color:#fff;padding:10px 16px;border-radius:8px;text-decoration:none">${escapeHtml(label)}</a></p>` +
      `<p style="color:#666">If you did not ask for this, you can ignore this message.<br>— Tactus</p>`,
  };
}
