/**
 * Sending mail from the app: nodemailer over SMTP to SMTP_HOST:SMTP_PORT — by default the local
 * catcher that `npm start` runs (127.0.0.1:2525), which stores the message for the
 * administrators' mailbox instead of delivering it. Point SMTP_* at a real relay to deliver.
 */
import nodemailer, { type Transporter } from 'nodemailer';
import { settings } from '@/src/settings';

export interface OutgoingMail {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
}

let transport: Transporter | null = null;
let transportKey = '';

function getTransport(): Transporter {
  const s = settings();
  const { SMTP_HOST: host, SMTP_PORT: port, SMTP_USER: user } = s;
  const key = `${host}:${port}:${user ?? ''}:${s.SMTP_SECURE}`;
  if (!transport || key !== transportKey) {
    transport = nodemailer.createTransport({
      host,
      port,
      secure: s.SMTP_SECURE,
      // The loopback catcher speaks plain SMTP; a real relay negotiates STARTTLS itself.
      ignoreTLS: host === '127.0.0.1' || host === 'localhost',
      auth: user ? { user, pass: s.SMTP_PASSWORD ?? '' } : undefined,
    });
    transportKey = key;
  }
  return transport;
}

/** The sender address of this installation (MAIL_FROM, default "Cavitas <cavitas@localhost>"). */
export function mailFrom(): string {
  return settings().MAIL_FROM;
}

/** Sends one message; resolves with the SMTP message id. Throws when the server refuses it. */
export async function sendMail(mail: OutgoingMail): Promise<string> {
  const to = Array.isArray(mail.to) ? mail.to : [mail.to];
  if (to.length === 0 || to.some((a) => !a.includes('@'))) throw new Error(`sendMail: invalid recipient list "${to.join(', ')}"`);
  const info = await getTransport().sendMail({ from: mailFrom(), to, subject: mail.subject, text: mail.text, html: mail.html });
  return info.messageId;
}
