// A local SMTP catcher: accepts every message on loopback and keeps it as one JSON file in a folder, so the
// development page and the tests can read what the app sent. Never used in production.
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import type { CaughtMail } from '@/shared/schemas';

const addresses = (a: AddressObject | AddressObject[] | undefined) =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((x) => x.value.map((v) => v.address ?? '')).filter(Boolean);

export function linksIn(text: string): string[] {
  return [...new Set(text.match(/https?:\/\/[^\s"'<>]+/g) ?? [])];
}

export function startMailCatcher(opts: { port: number; dir: string; host?: string }): Promise<SMTPServer> {
  fs.mkdirSync(opts.dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const text = parsed.text ?? '';
          const mail: CaughtMail = {
            id: `${Date.now()}-${crypto.randomBytes(4).toString('hex')}`,
            to: addresses(parsed.to),
            from: addresses(parsed.from)[0] ?? '',
            subject: parsed.subject ?? '',
            text,
            html: typeof parsed.html === 'string' ? parsed.html : null,
            links: linksIn(text),
            receivedAt: new Date().toISOString(),
          };
          // Write under a temporary name, then rename: a reader never sees half a message.
          const file = path.join(opts.dir, `${mail.id}.json`);
          fs.writeFileSync(`${file}.tmp`, JSON.stringify(mail));
          fs.renameSync(`${file}.tmp`, file);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, opts.host ?? '127.0.0.1', () => resolve(server));
  });
}

/** Caught mails, newest first, optionally only those addressed to `to`. */
export function readCaughtMails(dir: string, to?: string): CaughtMail[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .reverse()
    .map((f) => JSON.parse(fs.readFileSync(path.join(dir, f), 'utf8')) as CaughtMail)
    .filter((m) => !to || m.to.some((addr) => addr.toLowerCase() === to.toLowerCase()));
}
