// A Falloff server in a process of its own, for tests that must see it survive (or kill it): started by
// tests/support/child.ts with `tsx`, configured from the environment, prints "listening <url>" when ready.
import { startServer } from '../../server/main';

const smtpPort = Number(process.env.FALLOFF_TEST_SMTP_PORT ?? 0);
startServer({
  databaseUrl: process.env.DATABASE_URL ?? '',
  port: Number(process.env.PORT ?? 0),
  logLevel: process.env.LOG_LEVEL ?? 'error',
  webDir: null,
  mail: smtpPort ? { host: '127.0.0.1', port: smtpPort } : undefined,
  storage: process.env.FALLOFF_TEST_S3_ENDPOINT
    ? { endpoint: process.env.FALLOFF_TEST_S3_ENDPOINT, region: 'us-east-1', bucket: process.env.FALLOFF_TEST_S3_BUCKET ?? 'falloff-photos', accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER', forcePathStyle: true }
    : undefined,
})
  .then((s) => process.stdout.write(`listening ${s.url}\n`))
  .catch((err) => {
    process.stderr.write(`${err?.stack ?? err}\n`);
    process.exit(1);
  });
