// Helpers for the export, share, mail and photo tests: raw bytes with a client's cookies, a PDF's text,
// and the dev inbox of the fake SMTP server.
import { PDFParse } from 'pdf-parse';
import type { Client } from '../support/http';

/** The cookie header a test client would send (its jar is private to it). */
const cookieOf = (c: Client | null) => (c ? [...(c as unknown as { cookies: Map<string, string> }).cookies].map(([k, v]) => `${k}=${v}`).join('; ') : '');

export type Raw = { status: number; type: string; disposition: string; body: Buffer; json: any };

/** GET (or another method) returning the body as bytes; `c` null sends no cookie (signed out). */
export async function raw(base: string, c: Client | null, path: string, init: { method?: string; body?: BodyInit; headers?: Record<string, string> } = {}): Promise<Raw> {
  const res = await fetch(base + path, { method: init.method ?? 'GET', body: init.body, headers: { origin: base, cookie: cookieOf(c), ...init.headers } });
  const body = Buffer.from(await res.arrayBuffer());
  let json: unknown = null;
  try {
    json = JSON.parse(body.toString('utf8'));
  } catch {
    /* not JSON */
  }
  return { status: res.status, type: res.headers.get('content-type') ?? '', disposition: res.headers.get('content-disposition') ?? '', body, json };
}

export async function pdfText(pdf: Buffer): Promise<{ text: string; pages: number }> {
  const p = new PDFParse({ data: new Uint8Array(pdf) });
  const r = await p.getText();
  await p.destroy();
  // Extraction may break a line anywhere: compare with runs of white space as one space.
  return { text: r.text.replace(/\s+/g, ' '), pages: r.total };
}

export type InboxMail = { id: number; to: string[]; from: string; subject: string; text: string; html: string; attachments: { filename: string; contentType: string; size: number; index: number }[] };

/** Mail the fake SMTP server captured, newest last, optionally only to `to`. */
export async function inbox(base: string, to?: string): Promise<InboxMail[]> {
  const r = await fetch(`${base}/dev/inbox.json`);
  const { messages } = (await r.json()) as { messages: InboxMail[] };
  return to ? messages.filter((m) => m.to.includes(to)) : messages;
}
