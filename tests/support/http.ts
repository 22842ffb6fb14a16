// A small HTTP client for API tests: real requests to the real server, with its own cookie jar.
export type Res<T = any> = { status: number; body: T; headers: Headers };

let clients = 0;
/** A network address of its own for each client (a /64 of the IPv6 documentation prefix, 2001:db8::/32), sent
 *  as X-Forwarded-For, which the server trusts from loopback: the per-address rate limits then see each test's
 *  client as its own visitor, as they would real people behind a proxy. No traffic goes to it. */
export function testAddress(): string {
  const n = (clients++ & 0xffff).toString(16);
  return `2001:db8:${Math.floor(Math.random() * 0xffff).toString(16)}:${n}::1`;
}

export class Client {
  private cookies = new Map<string, string>();
  constructor(
    readonly base: string,
    readonly address = testAddress(),
  ) {}

  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Res<T>> {
    const h: Record<string, string> = { origin: this.base, 'x-forwarded-for': this.address, ...headers };
    if (this.cookies.size) h.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    let payload: string | undefined;
    if (body !== undefined) {
      h['content-type'] ??= 'application/json';
      payload = typeof body === 'string' ? body : JSON.stringify(body);
    }
    const res = await fetch(this.base + path, { method, headers: h, body: payload, redirect: 'manual' });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair!.indexOf('=');
      const name = pair!.slice(0, i);
      const value = pair!.slice(i + 1);
      if (value === '' || /max-age=0/i.test(c)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      /* not JSON: keep the text so a test can show it */
    }
    return { status: res.status, body: parsed as T, headers: res.headers };
  }

  /** The jar as a Cookie header, for a test that fetches raw bytes itself. */
  cookieHeader = () => [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');

  get = <T = any>(p: string) => this.request<T>('GET', p);
  post = <T = any>(p: string, b?: unknown) => this.request<T>('POST', p, b ?? {});
  put = <T = any>(p: string, b?: unknown) => this.request<T>('PUT', p, b ?? {});
  del = <T = any>(p: string) => this.request<T>('DELETE', p);

  async signIn(email: string, password: string) {
    const r = await this.post('/api/auth/sign-in/email', { email, password });
    if (r.status !== 200) throw new Error(`sign-in of ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
    return this;
  }

  /**
   * Sign up, then confirm the address through the link the server mailed (read from the fake SMTP server's
   * inbox at /dev/inbox.json), which signs in. `verify: false` leaves the address unconfirmed and signs in
   * with the password instead.
   */
  async signUp(name: string, email: string, password: string, { verify = true }: { verify?: boolean } = {}) {
    const r = await this.post('/api/auth/sign-up/email', { name, email, password });
    if (r.status !== 200) throw new Error(`sign-up of ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
    // A server started without the fake SMTP server (no /dev/inbox) mails nothing: the address stays unconfirmed.
    if (!verify || !(await this.hasInbox())) return this.signIn(email, password);
    const link = await this.mailedLink(email, '/api/auth/verify-email');
    const v = await this.get(link.slice(this.base.length));
    if (v.status !== 302 && v.status !== 200) throw new Error(`confirming ${email} failed: ${v.status} ${JSON.stringify(v.body)}`);
    if (![...this.cookies.keys()].some((k) => k.endsWith('session_token'))) await this.signIn(email, password);
    return this;
  }

  async hasInbox(): Promise<boolean> {
    const r = await fetch(`${this.base}/dev/inbox.json`);
    await r.arrayBuffer();
    return r.ok && (r.headers.get('content-type') ?? '').includes('json');
  }

  /** The newest link containing `path` in mail to `to` (waits for it: mail is sent after the answer). */
  async mailedLink(to: string, path: string, timeoutMs = 15_000): Promise<string> {
    const until = Date.now() + timeoutMs;
    const pattern = new RegExp(`${this.base.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}${path}[^\\s"<>]*`);
    for (;;) {
      const inbox = await fetch(`${this.base}/dev/inbox.json`).then((x) => x.json() as Promise<{ messages: { to: string[]; text: string }[] }>);
      const m = inbox.messages.filter((x) => x.to.includes(to)).map((x) => x.text.match(pattern)?.[0]).filter(Boolean).pop();
      if (m) return m;
      if (Date.now() > until) throw new Error(`no mail to ${to} with a link to ${path}`);
      await new Promise((res) => setTimeout(res, 100));
    }
  }
}

let n = 0;
/** A unique e-mail address for a user made by a test. */
export function freshEmail(tag = 'user') {
  return `${tag}-${Date.now().toString(36)}-${(n++).toString(36)}-${Math.random().toString(36).slice(2, 6)}@test.falloff.test`;
}
