// Outgoing mail through a durable queue in PostgreSQL (pg-boss): `send` stores the message as a job and
// returns once it is committed; a worker in every server process hands jobs to SMTP and retries with growing
// delays when the mail server is down or refuses, so mail accepted while SMTP is away goes out when it returns.
// Delivery is at least once (a process killed between SMTP's "accepted" and the job's completion sends that
// message again after the job expires); each message carries a Message-ID made from its job id, so a
// repeat is recognisable as the same message.
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import { HttpError } from '../errors';
import type { Attachment, Mailer, Message } from './mailer';

const MAIL_QUEUE = 'mail';
/** Retries with exponential back-off from 2 s: 16 of them cover a mail server away for more than a day. */
const MAIL_RETRY = { retryLimit: 16, retryDelay: 2, retryBackoff: true } as const;
/**
 * The queue's own statements (and its wait for a connection) end within this: a queue table that is locked or
 * broken while the rest of the database answers fails a send in seconds (a 503) instead of holding the request.
 */
export const MAIL_QUEUE_TIMEOUT_MS = 5_000;
/** Seconds a client is told to wait before retrying a request whose mail the queue did not take. */
const MAIL_QUEUE_RETRY_AFTER_S = 30;

/**
 * The mail queue did not store a message (its tables unusable, its connection gone). The request that wanted to
 * send it answers 503 with Retry-After and undoes what it made, so the client's retry starts clean.
 */
export class MailQueueUnavailable extends HttpError {
  constructor(readonly reason: string) {
    super(503, 'mail_unavailable', `the mail queue cannot take messages just now; nothing was sent or kept, try again in ${MAIL_QUEUE_RETRY_AFTER_S} s`, { retryAfterS: MAIL_QUEUE_RETRY_AFTER_S });
  }
}

/** Messages fetched and sent together by one poll of the mail worker. */
const MAIL_BATCH = 20;

/** Characters a subject keeps at most (a longer one ends in an ellipsis); mail clients show far fewer. */
export const SUBJECT_MAX = 160;
/** Bidirectional embedding, override and isolate controls, and the invisible direction marks. */
const BIDI = /[\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/g;
/** Control characters (C0 with CR, LF and tab, DEL, C1) and the Unicode line and paragraph separators. */
const BREAKS_AND_CONTROLS = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g;

/**
 * Every mail subject as one clean line: line breaks and other control characters become a space, bidi controls
 * go (a title cannot read backwards in an inbox), runs of white space shrink to one, the ends are trimmed and the
 * length is capped at SUBJECT_MAX characters (whole characters, never half a surrogate pair). Subjects are built
 * from names and titles people typed, some stored before the text rules (model/text.ts) held them.
 */
export function cleanSubject(subject: string): string {
  const line = subject.toWellFormed().replace(BIDI, '').replace(BREAKS_AND_CONTROLS, ' ').replace(/\s+/g, ' ').trim();
  const chars = Array.from(line);
  return chars.length <= SUBJECT_MAX ? line : `${chars.slice(0, SUBJECT_MAX - 1).join('').trimEnd()}…`;
}

type StoredMessage = Omit<Message, 'attachments'> & { attachments?: (Omit<Attachment, 'content'> & { content: string })[] };

const toStored = (m: Message): StoredMessage => ({ ...m, subject: cleanSubject(m.subject), attachments: m.attachments?.map((a) => ({ ...a, content: a.content.toString('base64') })) });
const fromStored = (m: StoredMessage): Message => ({ ...m, subject: cleanSubject(m.subject), attachments: m.attachments?.map((a) => ({ ...a, content: Buffer.from(a.content, 'base64') })) });

/** Where a job is written: pg-boss's own pool, or a caller's transaction (db/client.ts, txExecutor). */
type QueueExecutor = PgBoss.Db;

export type MailQueue = Mailer & {
  /** Store a message inside the caller's transaction: it is queued exactly when that transaction commits. */
  sendIn: (m: Message, tx: QueueExecutor) => Promise<{ messageId: string }>;
  /** The queue itself, for other durable jobs on the same tables (server/mail/commentNotices.ts). */
  boss: PgBoss;
  stop: () => Promise<void>;
};

/**
 * Start the queue on `databaseUrl` (pg-boss keeps its tables in the `pgboss` schema, made on first start) and
 * a worker that delivers through `smtp`. Mail is sent from whichever process picks the job up.
 */
export async function startMailQueue(o: { databaseUrl: string; smtp: Mailer; logger: Logger; domain?: string }): Promise<MailQueue> {
  const boss = new PgBoss({
    connectionString: o.databaseUrl,
    max: 3,
    application_name: 'falloff-mail',
    schedule: false,
    // node-postgres options, passed through to pg-boss's pool
    ...({ statement_timeout: MAIL_QUEUE_TIMEOUT_MS, connectionTimeoutMillis: MAIL_QUEUE_TIMEOUT_MS } as object),
  });
  // pg-boss reports a lost database connection as an 'error' event: an unhandled one would end the process.
  boss.on('error', (err) => o.logger.warn({ err: { message: err.message, code: (err as { code?: string }).code } }, 'mail queue: database error'));
  await boss.start();
  await boss.createQueue(MAIL_QUEUE, { name: MAIL_QUEUE, ...MAIL_RETRY, expireInSeconds: 120, retentionDays: 7 });
  const domain = o.domain ?? 'falloff.local';
  // Up to MAIL_BATCH messages per fetch, sent side by side: a burst (a class's invitations) goes out in
  // seconds, not one message per poll. A message that fails is failed on its own (pg-boss retries it later);
  // the batch's completion then only touches the messages still active, i.e. those that went out.
  const workerId = await boss.work<StoredMessage>(MAIL_QUEUE, { pollingIntervalSeconds: 0.5, batchSize: MAIL_BATCH }, async (jobs) => {
    await Promise.all(
      jobs.map(async (job) => {
        const message = fromStored(job.data);
        try {
          await o.smtp.send({ ...message, messageId: `<${job.id}@${domain}>` });
        } catch (err) {
          o.logger.warn({ err: { message: (err as Error).message }, jobId: job.id }, 'mail not delivered yet; it will be retried');
          await boss.fail(MAIL_QUEUE, job.id, { message: (err as Error).message });
        }
      }),
    );
  });
  let stopped = false;
  const stop = async () => {
    if (stopped) return;
    stopped = true;
    await boss.stop({ graceful: true, wait: true, timeout: 5_000 });
  };
  async function send(m: Message, tx?: QueueExecutor) {
    let id: string | null;
    try {
      id = await boss.send(MAIL_QUEUE, toStored(m), { ...MAIL_RETRY, ...(tx ? { db: tx } : {}) });
    } catch (err) {
      o.logger.warn({ err: { message: (err as Error).message, code: (err as { code?: string }).code } }, 'mail queue: message not stored');
      throw new MailQueueUnavailable((err as Error).message);
    }
    if (!id) throw new MailQueueUnavailable('the queue returned no job id');
    // Wake this process's worker now rather than at its next poll (a job written in a transaction that is not
    // committed yet is simply not seen until the next poll).
    if (!tx) boss.notifyWorker(workerId);
    return { messageId: id };
  }
  return {
    send: (m) => send(m),
    sendIn: (m, tx) => send(m, tx),
    boss,
    close: () => void stop(),
    stop,
  };
}
