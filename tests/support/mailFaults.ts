// The set-up the mail fault tests share: the private cluster, the local S3 and SMTP fakes, and a server in a
// process of its own that mails through the fake SMTP server (it has no /dev/inbox: the tests read the fake's
// inbox themselves). Also used to start more servers on the same fakes (a restart, a second instance).
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect } from 'vitest';
import { startFakes, type Fakes } from '../../server/fakes';
import { startChildServer, type ChildServer } from './child';
import { Client } from './http';
import { startCluster } from './pg';

export type MailFaults = {
  fakes: Fakes;
  server: ChildServer;
  /** Another server process on the same database and fakes (`env` added to the usual). */
  startServer: (env?: Record<string, string>) => Promise<ChildServer>;
  /** Mail the fake SMTP server received for `to`. */
  mailTo: (to: string) => { to: string[]; subject: string; text: string }[];
  /** A signed-in account on `server` (the first by default) whose address is confirmed through its mailed link. */
  confirmed: (name: string, email: string, on?: ChildServer) => Promise<Client>;
  close: () => Promise<void>;
};

const LINK = /https?:\/\/\S*\/api\/auth\/verify-email[^\s"<>]*/;

export async function startMailFaults(env: Record<string, string> = {}): Promise<MailFaults> {
  startCluster();
  const s3Dir = mkdtempSync(join(tmpdir(), 'falloff-s3-'));
  const fakes = await startFakes({ s3Dir });
  const others: ChildServer[] = [];
  const startServer = async (more: Record<string, string> = {}) => {
    const s = await startChildServer({ FALLOFF_TEST_SMTP_PORT: String(fakes.smtp.port), ...env, ...more });
    others.push(s);
    return s;
  };
  const server = await startServer();
  const mailTo = (to: string) => fakes.inbox.list().filter((m) => m.to.includes(to));
  return {
    fakes,
    server,
    startServer,
    mailTo,
    async confirmed(name, email, on = server) {
      const c = await new Client(on.url).signUp(name, email, 'a fine long password');
      await expect.poll(() => mailTo(email).some((m) => LINK.test(m.text)), { timeout: 30_000, interval: 100 }).toBe(true);
      const link = new URL(mailTo(email).map((m) => m.text.match(LINK)?.[0]).find(Boolean)!);
      const v = await c.get(link.pathname + link.search);
      expect([200, 302]).toContain(v.status);
      return c;
    },
    async close() {
      for (const s of others) await s.stop();
      await fakes.smtp.start().catch(() => undefined);
      await fakes.close();
      rmSync(s3Dir, { recursive: true, force: true });
    },
  };
}
