// The e-mails a class sends: an invitation to join, an assignment set, a plan submitted, a review done.
// They go through the app's mailer (the local fake SMTP server in development and tests). An e-mail is a
// convenience: a failure is logged and never fails the request that caused it.
import type { Request } from 'express';
import type { Mailer, Message } from '../mail/mailer';
import { MailQueueUnavailable } from '../mail/queue';

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** Where the app is reached from outside, for links in e-mails. */
export function appLink(req: Request, path: string): string {
  const origin = process.env.PUBLIC_URL ?? `${req.protocol}://${req.get('host')}`;
  return `${origin}${path}`;
}

function message(to: string, subject: string, lines: string[], link: { href: string; label: string }): Message {
  const body = lines.map((l) => `<p style="margin:0 0 12px">${esc(l).replace(/\n/g, '<br>')}</p>`).join('');
  return {
    to,
    subject,
    text: `${lines.join('\n\n')}\n\n${link.label}: ${link.href}\n`,
    html: `<!doctype html><html><body style="font-family:Helvetica,Arial,sans-serif;font-size:15px;line-height:1.5;color:#1b1c1e;padding:20px">
<div style="max-width:520px">${body}<p><a href="${esc(link.href)}">${esc(link.label)}</a></p>
<p style="color:#62646a;font-size:12px">Sent by Falloff for your class.</p></div></body></html>`,
  };
}

export const classMail = {
  invitation: (v: { to: string; className: string; role: string; inviterName: string; code: string; link: string }) =>
    message(
      v.to,
      `Join ${v.className} on Falloff`,
      [`${v.inviterName} invited you to ${v.className} as ${v.role === 'instructor' ? 'an instructor' : 'a student'}.`, `Sign up or sign in with this address and open Classes to join. You can also join with the code ${v.code}.`],
      { href: v.link, label: 'Open Classes' },
    ),
  assignmentSet: (v: { to: string; className: string; title: string; brief: string; instructorName: string; dueAt: string | null; link: string }) =>
    message(
      v.to,
      `New assignment in ${v.className}: ${v.title}`,
      [`${v.instructorName} set an assignment: ${v.title}.`, ...(v.brief ? [v.brief] : []), ...(v.dueAt ? [`Due ${new Date(v.dueAt).toUTCString()}.`] : [])],
      { href: v.link, label: 'Open the assignment' },
    ),
  submitted: (v: { to: string; studentName: string; title: string; attempt: number; passed: boolean | null; link: string }) =>
    message(
      v.to,
      `${v.studentName} submitted “${v.title}”`,
      [`${v.studentName} submitted attempt ${v.attempt} of “${v.title}”.${v.passed === null ? '' : v.passed ? ' It meets the meter check.' : ' It does not meet the meter check yet.'}`],
      { href: v.link, label: 'Review it' },
    ),
  reviewed: (v: { to: string; reviewerName: string; title: string; attempt: number; comments: number; link: string }) =>
    message(
      v.to,
      `Your plan for “${v.title}” was reviewed`,
      [`${v.reviewerName} reviewed attempt ${v.attempt} of “${v.title}”${v.comments ? ` and left ${v.comments} comment${v.comments === 1 ? '' : 's'}` : ''}.`],
      { href: v.link, label: 'See the review' },
    ),
};

/**
 * Send each message on its own (students never see each other's addresses); report how many went. With
 * `throwIfQueueDown`, a mail queue that took none of them (MailQueueUnavailable) is thrown for the caller to
 * undo what it made; notices after an action that stands are only counted.
 */
export async function sendAll(mailer: Mailer | undefined, req: Request, messages: Message[], o: { throwIfQueueDown?: boolean } = {}): Promise<{ sent: number; failed: number }> {
  if (!mailer || !messages.length) return { sent: 0, failed: 0 };
  const results = await Promise.allSettled(messages.map((m) => mailer.send(m)));
  const failed = results.filter((r) => r.status === 'rejected');
  const queueDown = failed.find((f) => (f as PromiseRejectedResult).reason instanceof MailQueueUnavailable);
  if (o.throwIfQueueDown && queueDown && failed.length === results.length) throw (queueDown as PromiseRejectedResult).reason;
  for (const f of failed) req.log?.warn({ err: (f as PromiseRejectedResult).reason }, 'class e-mail not sent');
  return { sent: results.length - failed.length, failed: failed.length };
}
