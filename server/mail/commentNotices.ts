// E-mail about new comments, grouped and rate limited, and durable: a comment is stored in the same transaction
// as a delayed job in the queue's tables in PostgreSQL (pg-boss, server/mail/queue.ts), one waiting job per
// setup (more comments in the meantime join it); a restart or a killed process loses nothing, and whichever
// process is running when the wait ends sends it. Then each of the setup's owners and editors who has comments by
// others they have not read, and who has not been e-mailed about this setup within the gap, gets one e-mail
// listing them. Each person's notice is claimed (setup_reads.notified_at, db/comments.ts claimNotice) in the
// transaction that queues their e-mail, so a retried or doubled job never sends it twice.
import type { Logger } from 'pino';
import { txExecutor, type Db } from '../../db/client';
import { claimNotice, digestRecipients, getSetupTitle } from '../../db/comments';
import { MAIL_QUEUE_TIMEOUT_MS, MailQueueUnavailable, type MailQueue } from './queue';
import { commentDigestMessage } from './messages';

/** How long a setup's new comments wait to be grouped into one e-mail (COMMENT_DIGEST_DELAY_MS). */
const digestDelayMs = () => Number(process.env.COMMENT_DIGEST_DELAY_MS ?? 60_000);
/** At most one comment e-mail per person and setup within this time (COMMENT_DIGEST_GAP_MS). */
const digestGapMs = () => Number(process.env.COMMENT_DIGEST_GAP_MS ?? 15 * 60_000);

const COMMENT_DIGEST_QUEUE = 'comment-digest';
type DigestJob = { setupId: string; origin: string };

export type CommentNotices = {
  /**
   * Inside the transaction that stores a comment: make sure a digest of the setup's comments is waiting. Throws
   * MailQueueUnavailable when the queue refuses (the comment is then rolled back and the request answers 503).
   */
  commented: (tx: unknown, setupId: string, origin: string) => Promise<void>;
};

export async function startCommentNotices(o: { db: Db; queue: MailQueue; logger?: Logger }): Promise<CommentNotices> {
  const { db, queue, logger } = o;
  const { boss } = queue;
  // 'short': at most one job per setup waiting to start; a comment while one waits adds nothing.
  await boss.createQueue(COMMENT_DIGEST_QUEUE, { name: COMMENT_DIGEST_QUEUE, policy: 'short', retryLimit: 12, retryDelay: 5, retryBackoff: true, expireInSeconds: 120, retentionDays: 7 });

  async function deliver({ setupId, origin }: DigestJob) {
    const gap = digestGapMs();
    const title = await getSetupTitle(db, setupId);
    if (title === null) return;
    for (const r of await digestRecipients(db, setupId, gap)) {
      await db.transaction(async (tx) => {
        if (!(await claimNotice(tx, r.userId, setupId, gap))) return;
        await queue.sendIn(commentDigestMessage({ to: r.email, name: r.name, title, url: `${origin}/setups/${setupId}?panel=comments`, comments: r.comments }), txExecutor(tx));
      });
    }
  }
  // A failure (the database or the mail queue away) fails the job; pg-boss tries it again later.
  await boss.work<DigestJob>(COMMENT_DIGEST_QUEUE, { pollingIntervalSeconds: 0.5, batchSize: 1 }, async (jobs) => {
    for (const job of jobs) {
      try {
        await deliver(job.data);
      } catch (err) {
        logger?.warn({ err: { message: (err as Error).message }, setupId: job.data.setupId }, 'comment e-mail not queued yet; it will be tried again');
        throw err;
      }
    }
  });

  return {
    async commented(tx, setupId, origin) {
      const delayS = Math.max(0, digestDelayMs()) / 1000;
      const exec = txExecutor(tx);
      try {
        // A locked queue table fails the comment within seconds (a 503) instead of holding it.
        await exec.executeSql(`set local lock_timeout = ${MAIL_QUEUE_TIMEOUT_MS}`);
        await boss.send(COMMENT_DIGEST_QUEUE, { setupId, origin } satisfies DigestJob, { singletonKey: setupId, ...(delayS > 0 ? { startAfter: delayS } : {}), db: exec });
      } catch (err) {
        logger?.warn({ err: { message: (err as Error).message } }, 'comment digest not queued');
        throw new MailQueueUnavailable((err as Error).message);
      }
    },
  };
}
