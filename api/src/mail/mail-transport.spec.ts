import type { AddressInfo } from 'node:net';
import nodemailer from 'nodemailer';
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { classifySmtpError } from './mail-transport';

// Real nodemailer errors from a real SMTP conversation (smtp-server playing a picky relay).
// RFC 5321 §4.2.1: a 4yz reply is a transient negative completion (try again later), 5yz permanent.
describe('classifySmtpError on real SMTP failures', () => {
  let server: SMTPServer;
  let port: number;

  beforeAll(async () => {
    server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      onRcptTo(address, _session, callback) {
        const reply = (code: number, text: string) => callback(Object.assign(new Error(text), { responseCode: code }));
        if (address.address.startsWith('busy')) return reply(451, 'Mailbox busy, try later');
        if (address.address.startsWith('gone')) return reply(550, 'No such mailbox');
        return callback();
      },
      onData(stream, session, callback) {
        stream.resume();
        // Takes the whole body, then never answers: the sender cannot know whether it was kept.
        if (session.envelope.rcptTo.some((r) => r.address.startsWith('silent'))) return;
        stream.on('end', () => callback());
      },
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
    port = (server.server.address() as AddressInfo).port;
  });
  afterAll(async () => {
    await new Promise<void>((resolve) => server.close(() => resolve()));
  });

  const send = async (to: string, toPort = port) => {
    const transport = nodemailer.createTransport({
      host: '127.0.0.1',
      port: toPort,
      secure: false,
      socketTimeout: 800,
      connectionTimeout: 2_000,
    });
    try {
      await transport.sendMail({ from: 'bench@shop.example', to, subject: 'x', text: 'x' });
      return 'sent';
    } catch (error) {
      return classifySmtpError(error);
    } finally {
      transport.close();
    }
  };

  it('sends to a willing mailbox (the harness itself works)', async () => {
    expect(await send('player@mail.example')).toBe('sent');
  });

  it('retries a 4yz reply and gives up on a 5yz reply', async () => {
    expect(await send('busy@mail.example')).toBe('transient');
    expect(await send('gone@mail.example')).toBe('permanent');
  });

  it('retries a refused connection (nothing was handed over)', async () => {
    const closed = new SMTPServer({});
    await new Promise<void>((resolve) => closed.listen(0, '127.0.0.1', () => resolve()));
    const closedPort = (closed.server.address() as AddressInfo).port;
    await new Promise<void>((resolve) => closed.close(() => resolve()));
    expect(await send('player@mail.example', closedPort)).toBe('transient');
  });

  it('never retries a silence after the body was handed over', async () => {
    expect(await send('silent@mail.example')).toBe('unknown');
  });
});
