// A small HTTP client for API tests: real requests to the real server, with its own cookie jar.
export type Res<T = any> = { status: number; body: T; headers: Headers };

export class Client {
  private cookies = new Map<string, string>();
  constructor(readonly base: string) {}

  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Res<T>> {
    const h: Record<string, string> = { origin: this.base, ...headers };
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

  get = <T = any>(p: string) => this.request<T>('GET', p);
  post = <T = any>(p: string, b?: unknown) => this.request<T>('POST', p, b ?? {});
  put = <T = any>(p: string, b?: unknown) => this.request<T>('PUT', p, b ?? {});
  del = <T = any>(p: string) => this.request<T>('DELETE', p);

  async signIn(email: string, password: string) {
    const r = await this.post('/api/auth/sign-in/email', { email, password });
    if (r.status !== 200) throw new Error(`sign-in of ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
    return this;
  }

  async signUp(name: string, email: string, password: string) {
    const r = await this.post('/api/auth/sign-up/email', { name, email, password });
    if (r.status !== 200) throw new Error(`sign-up of ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
    return this;
  }
}

let n = 0;
/** A unique e-mail address for a user made by a test. */
export function freshEmail(tag = 'user') {
  return `${tag}-${Date.now().toString(36)}-${(n++).toString(36)}-${Math.random().toString(36).slice(2, 6)}@test.falloff.test`;
}
