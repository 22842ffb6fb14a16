// The local fakes (server/fakes.ts) run beside `npm start` and the tests: a client that goes away half-way
// must not take them down. smtp-server turns a dropped client's socket error into an 'error' event on the
// server, which ended the process when nothing listened for it. The fakes run in a process of their own here
// (tests/support/fakes-child.ts), so a crash shows as an exit instead of taking the test runner with it.
import { spawn, type ChildProcess } from 'node:child_process';
import { connect } from 'node:net';
import { join } from 'node:path';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { createMailer } from '../../server/mail/mailer';

const root = join(__dirname, '..', '..');
let child: ChildProcess;
let exited = false;
let stderr = '';
let smtpPort = 0;
let s3 = { endpoint: '', bucket: '' };
const lines: string[] = [];

/** The first of `lines` from index `from` on that starts with `prefix`, once the child has printed it. */
async function lineFrom(from: number, prefix: string, timeoutMs = 60_000): Promise<string> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const l = lines.slice(from).find((x) => x.startsWith(prefix));
    if (l) return l;
    if (exited) throw new Error(`the fakes' process exited: ${stderr}`);
    if (Date.now() > until) throw new Error(`no "${prefix}" line in ${timeoutMs} ms: ${stderr}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

beforeAll(async () => {
  child = spawn(process.execPath, ['--import', 'tsx', join(root, 'tests', 'support', 'fakes-child.ts')], { cwd: root, stdio: ['pipe', 'pipe', 'pipe'] });
  child.once('exit', () => (exited = true));
  child.stderr!.on('data', (d) => (stderr = (stderr + d).slice(-20_000)));
  let out = '';
  child.stdout!.on('data', (d) => {
    out += d;
    const done = out.split('\n');
    out = done.pop()!;
    lines.push(...done);
  });
  const [, port, endpoint, bucket] = (await lineFrom(0, 'fakes ')).split(' ');
  smtpPort = Number(port);
  s3 = { endpoint: endpoint!, bucket: bucket! };
}, 90_000);

afterAll(async () => {
  if (!exited) {
    const gone = new Promise((r) => child.once('exit', r));
    child.kill('SIGTERM');
    await gone;
  }
});

/** The number of messages the SMTP fake has kept, asked of the child. */
async function inboxCount(): Promise<number> {
  const before = lines.length;
  child.stdin!.write('count\n');
  return Number((await lineFrom(before, 'inbox ', 10_000)).split(' ')[1]);
}

/** Speak SMTP over a raw socket up to the middle of a message's DATA, then reset the connection. */
function dropMidMessage(port: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const s = connect(port, '127.0.0.1');
    const commands = ['EHLO dropper.test', 'MAIL FROM:<dropper@example.test>', 'RCPT TO:<someone@example.test>', 'DATA'];
    let sent = 0;
    let buffered = '';
    s.on('data', (d) => {
      buffered += String(d);
      // Each reply ends with a line "NNN text" (a space after the code, not a hyphen).
      if (!/(^|\r\n)\d{3} [^\r\n]*\r\n$/.test(buffered)) return;
      const last = buffered;
      buffered = '';
      if (sent < commands.length) return void s.write(`${commands[sent++]}\r\n`);
      if (/(^|\r\n)354 /.test(last)) {
        // Reset (not close) once the fake has read the first lines: its socket then fails with ECONNRESET.
        s.write('Subject: half a message\r\n\r\nThe first lines of a body that never ends\r\n', () => {
          setTimeout(() => (s.resetAndDestroy(), resolve()), 100);
        });
      }
    });
    s.on('error', reject);
  });
}

test('the SMTP fake keeps taking mail after clients drop in the middle of a message', async () => {
  // The first drop was swallowed by a listener left over from listen(); the second ended the process.
  for (let i = 0; i < 3; i++) await dropMidMessage(smtpPort);
  await new Promise((r) => setTimeout(r, 300));
  expect(exited, stderr).toBe(false);

  const before = await inboxCount();
  const mailer = createMailer({ host: '127.0.0.1', port: smtpPort });
  try {
    const sent = await mailer.send({ to: 'crew@example.test', subject: 'After the drops', text: 'still here', html: '<p>still here</p>' });
    expect(sent.messageId).toBeTruthy();
  } finally {
    mailer.close();
  }
  await expect.poll(inboxCount, { timeout: 10_000, interval: 100 }).toBe(before + 1);
  expect(exited, stderr).toBe(false);
});

test('the S3 fake keeps answering after an upload is cut off half-way', async () => {
  const port = Number(new URL(s3.endpoint).port);
  for (let i = 0; i < 3; i++) {
    await new Promise<void>((resolve, reject) => {
      const s = connect(port, '127.0.0.1', () => {
        s.write(`PUT /${s3.bucket}/cut-${i} HTTP/1.1\r\nHost: 127.0.0.1:${port}\r\nContent-Length: 1000000\r\n\r\n${'x'.repeat(4096)}`, () => {
          setTimeout(() => (s.resetAndDestroy(), resolve()), 100);
        });
      });
      s.on('error', reject);
    });
  }
  // Path-style, unsigned: the fake takes mismatched signatures (server/fakes.ts) and refuses none here.
  const put = await fetch(`${s3.endpoint}/${s3.bucket}/whole`, { method: 'PUT', body: 'a whole object', headers: { 'content-type': 'text/plain' } });
  expect(put.status, await put.text()).toBe(200);
  const got = await fetch(`${s3.endpoint}/${s3.bucket}/whole`);
  expect(got.status).toBe(200);
  expect(await got.text()).toBe('a whole object');
  expect(exited, stderr).toBe(false);
});
