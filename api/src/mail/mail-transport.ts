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

/**
 * What a failed send tells us about the message (RFC 5321 §4.2.1: 4yz replies are transient,
 * 5yz permanent). A reply code means the server answered and did not take the message. No reply
 * while the message body was being handed over (command DATA) means we cannot know whether the
 * server kept it: that case is never retried automatically, so it cannot arrive twice.
 */
export function classifySmtpError(error: unknown): SmtpVerdict {
  const e = error as { responseCode?: number; command?: string };
  if (typeof e?.responseCode === 'number') return e.responseCode >= 500 ? 'permanent' : 'transient';
  if (e?.command === 'DATA') return 'unknown';
  return 'transient';
}

export function describeSmtpError(error: unknown): string {
  const e = error as { message?: string; code?: string; responseCode?: number };
  const code = e?.responseCode ? `SMTP ${e.responseCode}` : e?.code;
  return `${code ? `${code}: ` : ''}${e?.message ?? String(error)}`;
}
