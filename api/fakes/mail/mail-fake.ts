import { randomUUID } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { renderMailbox, renderMessage } from './mailbox-page';

/** One message as the fake's JSON shows it (GET /api/messages, newest first). */
export interface CaughtMessage {
  id: string;
  messageId: string | null;
  to: string[];
  from: string | null;
  subject: string;
  text: string;
  html: string | null;
  date: string;
  /** The SMTP envelope, which may differ from the To header (Bcc, say). */
  envelope: { from: string | null; to: string[] };
  attachments: { filename: string | null; contentType: string; size: number; content: string }[];
}

export interface MailFake {
  smtpPort: number;
  httpPort: number;
  messages: CaughtMessage[];
  stop: () => Promise<void>;
  /** After stop(): the fake again on the same ports, with the same box (a mail server back from an outage). */
  restart: () => Promise<MailFake>;
}

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(value) ? value : value ? [value] : [];
  return list.flatMap((group) => group.value.map((a) => a.address ?? '').filter(Boolean));
}

/**
 * A local stand-in for a mail server: accepts every message over SMTP (no TLS, any or no login)
 * and keeps it in memory for the mailbox page and the JSON API. Nothing leaves the machine.
 * `messages` survives stop() so a test can take the fake down and bring it back with the same box (restart()).
 */
export async function startMailFake(options: {
  smtpPort: number;
  httpPort: number;
  host?: string;
  messages?: CaughtMessage[];
}): Promise<MailFake> {
  const host = options.host ?? '127.0.0.1';
  const messages: CaughtMessage[] = options.messages ?? [];

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Loomwright local mail catcher',
    size: 25 * 1024 * 1024,
    onAuth: (_auth, _session, callback) => callback(null, { user: 'local' }),
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          messages.unshift({
            id: randomUUID(),
            messageId: parsed.messageId ?? null,
            to: addresses(parsed.to),
            from: addresses(parsed.from)[0] ?? null,
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            date: (parsed.date ?? new Date()).toISOString(),
            envelope: {
              from: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
              to: session.envelope.rcptTo.map((r) => r.address),
            },
            attachments: parsed.attachments.map((a) => ({
              filename: a.filename ?? null,
              contentType: a.contentType,
              size: a.size,
              content: a.content.toString('base64'),
            })),
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  smtp.on('error', (error) => console.error(`[mail fake] SMTP: ${error.message}`));

  const web = http.createServer((req, res) => handle(messages, req, res));

  await new Promise<void>((resolve, reject) => {
    smtp.server.once('error', reject);
    smtp.listen(options.smtpPort, host, () => resolve());
  });
  await new Promise<void>((resolve, reject) => {
    web.once('error', reject);
    web.listen(options.httpPort, host, () => resolve());
  });

  const smtpPort = (smtp.server.address() as AddressInfo).port;
  const httpPort = (web.address() as AddressInfo).port;
  return {
    smtpPort,
    httpPort,
    messages,
    stop: async () => {
      web.closeAllConnections();
      await new Promise<void>((resolve) => web.close(() => resolve()));
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
    },
    restart: () => startMailFake({ ...options, smtpPort, httpPort, messages }),
  };
}

function send(res: http.ServerResponse, status: number, type: string, body: string) {
  res.writeHead(status, { 'content-type': type, 'cache-control': 'no-store' });
  res.end(body);
}

const json = (res: http.ServerResponse, status: number, value: unknown) =>
  send(res, status, 'application/json; charset=utf-8', JSON.stringify(value));

function handle(messages: CaughtMessage[], req: http.IncomingMessage, res: http.ServerResponse) {
  const url = new URL(req.url ?? '/', 'http://localhost');
  const parts = url.pathname.split('/').filter(Boolean);
  const method = req.method ?? 'GET';

  if (parts[0] === 'api' && parts[1] === 'messages') {
    if (parts.length === 2 && method === 'GET') {
      const to = url.searchParams.get('to')?.toLowerCase();
      return json(res, 200, to ? messages.filter((m) => m.to.some((a) => a.toLowerCase() === to)) : messages);
    }
    if (parts.length === 2 && method === 'DELETE') {
      messages.splice(0, messages.length);
      return json(res, 200, { deleted: true });
    }
    if (parts.length === 3 && method === 'GET') {
      const found = messages.find((m) => m.id === parts[2]);
      return found ? json(res, 200, found) : json(res, 404, { message: `No message has the id ${parts[2]}.` });
    }
    return json(res, 405, { message: `${method} is not answered here; use GET or DELETE /api/messages.` });
  }
  if (method !== 'GET') return json(res, 405, { message: 'The mailbox page only answers GET.' });
  if (parts.length === 0) return send(res, 200, 'text/html; charset=utf-8', renderMailbox(messages));
  if (parts[0] === 'messages' && parts.length === 2) {
    const found = messages.find((m) => m.id === parts[1]);
    if (found) return send(res, 200, 'text/html; charset=utf-8', renderMessage(found));
  }
  if (parts[0] === 'messages' && parts.length === 4 && parts[2] === 'attachments') {
    const found = messages.find((m) => m.id === parts[1])?.attachments[Number(parts[3])];
    if (found) {
      res.writeHead(200, {
        'content-type': found.contentType,
        'content-disposition': `attachment; filename="${(found.filename ?? 'attachment').replace(/"/g, '')}"`,
      });
      return res.end(Buffer.from(found.content, 'base64'));
    }
  }
  return send(res, 404, 'text/plain; charset=utf-8', 'Nothing here. The mailbox is at /.');
}
