// Helpers for the export, share, mail and photo tests: raw bytes with a client's cookies, a PDF's text,
// and the dev inbox of the fake SMTP server.
import { PDFParse } from 'pdf-parse';
import { testAddress, type Client } from '../support/http';

/** The cookie header a test client would send (its jar is private to it). */
const cookieOf = (c: Client | null) => (c ? [...(c as unknown as { cookies: Map<string, string> }).cookies].map(([k, v]) => `${k}=${v}`).join('; ') : '');

export type Raw = { status: number; type: string; disposition: string; retryAfter: string | null; body: Buffer; json: any };

/** GET (or another method) returning the body as bytes; `c` null sends no cookie (signed out). */
export async function raw(base: string, c: Client | null, path: string, init: { method?: string; body?: BodyInit; headers?: Record<string, string> } = {}): Promise<Raw> {
  const res = await fetch(base + path, { method: init.method ?? 'GET', body: init.body, headers: { origin: base, cookie: cookieOf(c), ...(path.startsWith('/dev/') ? {} : { 'x-forwarded-for': c?.address ?? testAddress() }), ...init.headers } });
  // (the local inbox answers only this machine: no forwarded client address for /dev/)
  const body = Buffer.from(await res.arrayBuffer());
  let json: unknown = null;
  try {
    json = JSON.parse(body.toString('utf8'));
  } catch {
    /* not JSON */
  }
  return { status: res.status, type: res.headers.get('content-type') ?? '', disposition: res.headers.get('content-disposition') ?? '', retryAfter: res.headers.get('retry-after'), body, json };
}

export async function pdfText(pdf: Buffer): Promise<{ text: string; pages: number }> {
  const p = new PDFParse({ data: new Uint8Array(pdf) });
  const r = await p.getText();
  await p.destroy();
  // Extraction may break a line anywhere: compare with runs of white space as one space.
  return { text: r.text.replace(/\s+/g, ' '), pages: r.total };
}

export type InboxMail = { id: number; to: string[]; from: string; subject: string; text: string; html: string; attachments: { filename: string; contentType: string; size: number; index: number }[] };

/** Mail the fake SMTP server captured, newest last, optionally only to `to`. Mail goes out through a queue
 *  (server/mail/queue.ts), so with `to` this waits (up to `waitMs`) for mail to that address to arrive and
 *  then to settle (nothing new for a second). */
export async function inbox(base: string, to?: string, waitMs = 15_000): Promise<InboxMail[]> {
  const read = async () => ((await (await fetch(`${base}/dev/inbox.json`)).json()) as { messages: InboxMail[] }).messages;
  if (!to) return read();
  return settledMail(async () => (await read()).filter((m) => m.to.includes(to)), waitMs);
}

/** Poll `read` until it has something and has not changed for `quietMs`, or `waitMs` passed. */
export async function settledMail<T>(read: () => Promise<T[]>, waitMs = 15_000, quietMs = 1_000): Promise<T[]> {
  const until = Date.now() + waitMs;
  let last = await read();
  let since = Date.now();
  while (Date.now() < until) {
    if (last.length && Date.now() - since >= quietMs) return last;
    await new Promise((res) => setTimeout(res, 200));
    const now = await read();
    if (now.length !== last.length) since = Date.now();
    last = now;
  }
  return last;
}
