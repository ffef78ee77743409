import http from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

export interface CaughtMail {
  id: number;
  from: string;
  to: string;
  subject: string;
  text: string;
  receivedAt: number;
}

export interface MailCatcher {
  smtpPort: number;
  /** The web inbox, when one was asked for. */
  inboxUrl?: string;
  messages(): readonly CaughtMail[];
  /** Resolves with the first mail (already caught or arriving later) that matches. */
  waitFor(match: (m: CaughtMail) => boolean, timeoutMs?: number): Promise<CaughtMail>;
  stop(): Promise<void>;
}

/**
 * A local stand-in for a mail provider: a real SMTP server on loopback that keeps every message in
 * memory, with an optional web inbox so a person trying the demo can open invites and reset links.
 */
export async function startMailCatcher(options: { smtpPort?: number; inboxPort?: number } = {}): Promise<MailCatcher> {
  const caught: CaughtMail[] = [];
  const waiters: { match: (m: CaughtMail) => boolean; resolve: (m: CaughtMail) => void }[] = [];

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const mail: CaughtMail = {
            id: caught.length + 1,
            from: parsed.from?.text ?? String(session.envelope.mailFrom && session.envelope.mailFrom.address),
            to: session.envelope.rcptTo.map((r) => r.address).join(', '),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            receivedAt: Date.now(),
          };
          caught.push(mail);
          for (const w of [...waiters]) {
            if (w.match(mail)) {
              waiters.splice(waiters.indexOf(w), 1);
              w.resolve(mail);
            }
          }
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(options.smtpPort ?? 0, '127.0.0.1', () => resolve());
  });
  const smtpPort = ((smtp as unknown as { server: http.Server }).server.address() as AddressInfo).port;

  let inbox: http.Server | undefined;
  let inboxUrl: string | undefined;
  if (options.inboxPort !== undefined) {
    inbox = http.createServer(inboxApp(() => caught));
    await new Promise<void>((resolve) => inbox!.listen(options.inboxPort, '127.0.0.1', () => resolve()));
    inboxUrl = `http://localhost:${(inbox.address() as AddressInfo).port}`;
  }

  return {
    smtpPort,
    inboxUrl,
    messages: () => caught,
    waitFor(match, timeoutMs = 10_000) {
      const found = caught.find(match);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const waiter = { match, resolve };
        waiters.push(waiter);
        setTimeout(() => {
          const i = waiters.indexOf(waiter);
          if (i >= 0) {
            waiters.splice(i, 1);
            reject(new Error(`No matching mail arrived within ${timeoutMs} ms (${caught.length} caught).`));
          }
        }, timeoutMs).unref();
      });
    },
    async stop() {
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
      if (inbox) await new Promise<void>((resolve) => inbox!.close(() => resolve()));
    },
  };
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const linkify = (s: string) => escapeHtml(s).replace(/https?:\/\/[^\s<]+/g, (url) => `<a href="${url}">${url}</a>`);

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title><style>
body{margin:0;font:16px/1.5 system-ui,sans-serif;background:#F5F1E8;color:#1E252B}
header{background:#1E252B;color:#F5F1E8;padding:14px 18px}header b{font-size:18px}header p{margin:2px 0 0;color:#C9C3B6;font-size:13px}
main{max-width:760px;margin:0 auto;padding:16px}a{color:#C4461F}
.mail{display:block;padding:14px;margin:0 0 10px;background:#FBF9F4;border:1px solid #D8D1C2;border-radius:10px;text-decoration:none;color:inherit;min-height:44px}
.mail small{color:#5A6670}pre{white-space:pre-wrap;background:#FBF9F4;border:1px solid #D8D1C2;border-radius:10px;padding:14px;font:15px/1.5 ui-monospace,monospace}
</style></head><body><header><b>Local inbox</b><p>Mail Treadle sent while running on this machine. Nothing here left the machine.</p></header><main>${body}</main></body></html>`;
}

function inboxApp(messages: () => readonly CaughtMail[]): express.Express {
  const app = express();
  app.get('/', (_req, res) => {
    const list = [...messages()].reverse();
    res.send(
      page(
        'Local inbox',
        list.length
          ? list
              .map(
                (m) =>
                  `<a class="mail" href="/mail/${m.id}"><b>${escapeHtml(m.subject)}</b><br><small>to ${escapeHtml(m.to)} · ${new Date(m.receivedAt).toLocaleString()}</small></a>`,
              )
              .join('')
          : '<p>No mail yet. Invite someone or ask for a password reset.</p>',
      ),
    );
  });
  app.get('/mail/:id', (req, res) => {
    const mail = messages().find((m) => m.id === Number(req.params.id));
    if (!mail) return void res.status(404).send(page('Not found', '<p>No such mail. <a href="/">Back to the inbox</a></p>'));
    res.send(
      page(
        mail.subject,
        `<p><a href="/">← Inbox</a></p><h2>${escapeHtml(mail.subject)}</h2><p><small>From ${escapeHtml(mail.from)} to ${escapeHtml(mail.to)}</small></p><pre>${linkify(mail.text)}</pre>`,
      ),
    );
  });
  return app;
}
