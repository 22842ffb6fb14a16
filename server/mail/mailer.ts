// Outgoing e-mail over SMTP (nodemailer). Development and tests point it at the local fake SMTP server
// (server/fakes.ts), which captures every message; production sets SMTP_URL. The app sends through the
// durable queue in front of it (server/mail/queue.ts); this is what the queue's worker delivers with.
import nodemailer from 'nodemailer';

export type MailConfig = { host: string; port: number; secure?: boolean; user?: string; pass?: string; from?: string } | { url: string; from?: string };
export type Attachment = { filename: string; content: Buffer; contentType: string };
export type Message = { to: string | string[]; subject: string; text: string; html: string; replyTo?: string; attachments?: Attachment[]; messageId?: string };
export type Mailer = { send: (m: Message) => Promise<{ messageId: string }>; close: () => void };

export const SMTP_TIMEOUT_MS = Number(process.env.SMTP_TIMEOUT_MS ?? 5000);
const DEFAULT_FROM = 'Falloff <crew@falloff.test>';

export function createMailer(c: MailConfig): Mailer {
  // A mail server that stops answering fails a send within seconds instead of holding the request.
  const timeouts = { connectionTimeout: SMTP_TIMEOUT_MS, greetingTimeout: SMTP_TIMEOUT_MS, socketTimeout: 2 * SMTP_TIMEOUT_MS };
  const transport =
    'url' in c
      ? nodemailer.createTransport({ url: c.url, ...timeouts } as Parameters<typeof nodemailer.createTransport>[0])
      : nodemailer.createTransport({
          ...timeouts,
          host: c.host,
          port: c.port,
          secure: c.secure ?? false,
          // The local fake speaks plain SMTP on loopback; a real relay is reached through SMTP_URL.
          ignoreTLS: !c.secure && (c.host === '127.0.0.1' || c.host === 'localhost'),
          ...(c.user ? { auth: { user: c.user, pass: c.pass ?? '' } } : {}),
        });
  const from = c.from ?? process.env.MAIL_FROM ?? DEFAULT_FROM;
  return {
    async send(m) {
      const info = await transport.sendMail({ from, ...m });
      return { messageId: info.messageId };
    },
    close: () => transport.close(),
  };
}
