import { Injectable, OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import nodemailer, { type SendMailOptions, type Transporter } from 'nodemailer';
import type { AppConfig } from '../config/configuration';

/**
 * nodemailer over SMTP, configured by the `mail` settings: the local mail fake in development and
 * tests, a real relay in production (configuration only).
 */
@Injectable()
export class MailTransport implements OnApplicationShutdown {
  private readonly transporter: Transporter;
  readonly from: string;

  constructor(config: ConfigService<AppConfig, true>) {
    const mail = config.get('mail', { infer: true });
    this.from = mail.from;
    this.transporter = nodemailer.createTransport({
      host: mail.host,
      port: mail.port,
      secure: mail.secure,
      auth: mail.user ? { user: mail.user, pass: mail.password ?? '' } : undefined,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    });
  }

  send(message: SendMailOptions) {
    return this.transporter.sendMail({ from: this.from, ...message });
  }

  onApplicationShutdown() {
    this.transporter.close();
  }
}

export type SmtpVerdict = 'transient' | 'permanent' | 'unknown';

// Failures that happen before anything of the message reaches the server: nothing to repeat.
const beforeHandover = /ECONNREFUSED|ENOTFOUND|EHOSTUNREACH|ENETUNREACH|EAI_AGAIN|Connection timeout|Greeting never received/;

/**
 * What a failed send tells us about the message. A reply code means the server answered and did
 * not take it (RFC 5321 §4.2.1: 4yz transient, 5yz permanent). A failure to connect, resolve,
 * start TLS or log in means nothing was handed over. Any other silence — a dropped connection or
 * a timeout once the session was under way — may have come after the server took the body
 * (nodemailer does not say in which phase a socket failed), so it is 'unknown' and never retried
 * automatically: retrying could deliver it twice.
 */
export function classifySmtpError(error: unknown): SmtpVerdict {
  const e = error as { responseCode?: number; code?: string; message?: string };
  if (typeof e?.responseCode === 'number') return e.responseCode >= 500 ? 'permanent' : 'transient';
  if (e?.code === 'EDNS' || e?.code === 'ETLS' || e?.code === 'EAUTH') return 'transient';
  if (beforeHandover.test(`${e?.code ?? ''} ${e?.message ?? ''}`)) return 'transient';
  return 'unknown';
}

export function describeSmtpError(error: unknown): string {
  const e = error as { message?: string; code?: string; responseCode?: number };
  const code = e?.responseCode ? `SMTP ${e.responseCode}` : e?.code;
  return `${code ? `${code}: ` : ''}${e?.message ?? String(error)}`;
}
