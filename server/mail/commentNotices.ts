// E-mail about new comments, grouped and rate limited: a comment starts a short wait per setup (more
// comments in the meantime join the same e-mail); then each of the setup's owners and editors who has
// comments by others they have not read, and who has not been e-mailed about this setup within the gap,
// gets one e-mail listing them. The last-notified time is kept in the database (setup_reads), so the gap
// holds across restarts and server processes.
import type { Logger } from 'pino';
import type { Db } from '../../db/client';
import { digestRecipients, getSetupTitle, markNotified } from '../../db/comments';
import type { Mailer } from './mailer';
import { commentDigestMessage } from './messages';

/** How long a setup's new comments wait to be grouped into one e-mail (COMMENT_DIGEST_DELAY_MS). */
export const digestDelayMs = () => Number(process.env.COMMENT_DIGEST_DELAY_MS ?? 60_000);
/** At most one comment e-mail per person and setup within this time (COMMENT_DIGEST_GAP_MS). */
export const digestGapMs = () => Number(process.env.COMMENT_DIGEST_GAP_MS ?? 15 * 60_000);

export type CommentNotices = { commented: (setupId: string, origin: string) => void; flush: () => Promise<void>; close: () => void };

export function commentNotices(db: Db, mailer: Mailer | undefined, log?: Logger, o: { delayMs?: number; gapMs?: number } = {}): CommentNotices {
  const delay = o.delayMs ?? digestDelayMs();
  const gap = o.gapMs ?? digestGapMs();
  const waiting = new Map<string, { timer: NodeJS.Timeout; origin: string }>();
  const running = new Set<Promise<void>>();

  async function send(setupId: string, origin: string) {
    if (!mailer) return;
    const title = await getSetupTitle(db, setupId);
    if (title === null) return;
    for (const r of await digestRecipients(db, setupId, gap)) {
      try {
        await mailer.send(commentDigestMessage({ to: r.email, name: r.name, title, url: `${origin}/setups/${setupId}?panel=comments`, comments: r.comments }));
        await markNotified(db, r.userId, setupId);
      } catch (err) {
        log?.error({ err, setupId }, 'comment e-mail failed');
      }
    }
  }
  function fire(setupId: string) {
    const w = waiting.get(setupId);
    waiting.delete(setupId);
    if (!w) return;
    const p = send(setupId, w.origin).catch((err) => log?.error({ err, setupId }, 'comment e-mail failed'));
    running.add(p);
    void p.finally(() => running.delete(p));
  }
  return {
    commented(setupId, origin) {
      if (!mailer || waiting.has(setupId)) return;
      const timer = setTimeout(() => fire(setupId), delay);
      timer.unref?.();
      waiting.set(setupId, { timer, origin });
    },
    /** Send whatever is waiting now (tests; shutdown). */
    async flush() {
      for (const [id, w] of [...waiting]) {
        clearTimeout(w.timer);
        fire(id);
      }
      await Promise.all([...running]);
    },
    close() {
      for (const w of waiting.values()) clearTimeout(w.timer);
      waiting.clear();
    },
  };
}
