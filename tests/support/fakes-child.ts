// The local SMTP and S3 fakes (server/fakes.ts) in a process of their own, for tests that must see them
// survive a misbehaving client: prints "fakes <smtp port> <s3 endpoint> <bucket>" when ready, and on each line
// read from stdin prints "inbox <n>", the number of messages the SMTP fake kept.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { startFakes } from '../../server/fakes';

const s3Dir = mkdtempSync(join(tmpdir(), 'falloff-s3-'));
startFakes({ s3Dir })
  .then((f) => {
    process.stdout.write(`fakes ${f.smtp.port} ${f.s3.endpoint} ${f.s3.bucket}\n`);
    createInterface({ input: process.stdin }).on('line', () => process.stdout.write(`inbox ${f.inbox.list().length}\n`));
    process.on('SIGTERM', () => void f.close().finally(() => (rmSync(s3Dir, { recursive: true, force: true }), process.exit(0))));
  })
  .catch((err) => {
    process.stderr.write(`${err?.stack ?? err}\n`);
    process.exit(1);
  });
