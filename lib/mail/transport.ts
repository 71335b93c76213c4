import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/env';

const g = globalThis as unknown as { __cwMail?: Transporter };

function mailer(): Transporter {
  return (g.__cwMail ??= nodemailer.createTransport(env.smtpUrl));
}

export interface OutgoingMail {
  to: string | string[];
  subject: string;
  text: string;
  html: string;
  headers?: Record<string, string>;
  /** A fixed Message-ID (`<…@…>`): a message handed over again after a crash carries the same one. */
  messageId?: string;
}

export async function sendMail(mail: OutgoingMail) {
  await mailer().sendMail({ from: env.MAIL_FROM, ...mail });
}
