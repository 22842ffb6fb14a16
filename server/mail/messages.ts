// The e-mails Falloff sends, as text and simple HTML. Every value put into HTML is escaped.
import type { Message } from './mailer';

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

function html(paragraphs: string[], link: { href: string; label: string }, foot: string): string {
  const ps = paragraphs.map((p) => `<p style="margin:0 0 14px">${esc(p).replace(/\n/g, '<br>')}</p>`).join('');
  return `<!doctype html><html><body style="margin:0;padding:24px;background:#f4f3ef;font-family:'IBM Plex Sans',Helvetica,Arial,sans-serif;color:#1b1c1e;font-size:15px;line-height:1.5">
<div style="max-width:520px;margin:0 auto;background:#ffffff;border:1px solid #dcdcd8;border-radius:10px;padding:24px">
<div style="font-family:'IBM Plex Mono',Menlo,monospace;font-size:11px;letter-spacing:2px;color:#9a5d00;margin-bottom:12px">FALLOFF</div>
${ps}<p style="margin:18px 0"><a href="${esc(link.href)}" style="display:inline-block;background:#f0b24a;color:#1d2024;text-decoration:none;font-weight:600;padding:10px 16px;border-radius:8px">${esc(link.label)}</a></p>
<p style="margin:0;color:#62646a;font-size:12px">${esc(foot)}</p></div></body></html>`;
}

export function crewSheetMessage(v: { to: string[]; senderName: string; senderEmail: string; title: string; url: string; note?: string; pdf?: Buffer; pdfName: string }): Message {
  const lines = [`${v.senderName} sent you the crew sheet for “${v.title}”.`, ...(v.note ? [v.note] : []), 'Open the plan on your phone — no account needed:'];
  const foot = `${v.pdf ? 'The crew sheet is attached as a PDF. ' : ''}Sandbag stands, tape down cables and follow the venue’s rules and local codes. Reply to reach ${v.senderName}.`;
  return {
    to: v.to,
    replyTo: v.senderEmail,
    subject: `Crew sheet: ${v.title}`,
    text: `${lines.join('\n\n')}\n${v.url}\n\n${foot}\n`,
    html: html(lines, { href: v.url, label: 'Open the plan' }, foot),
    attachments: v.pdf ? [{ filename: v.pdfName, content: v.pdf, contentType: 'application/pdf' }] : [],
  };
}

export function invitationMessage(v: { to: string; studioName: string; role: string; inviterName: string; link: string; expiresAt: string }): Message {
  const lines = [`${v.inviterName} invited you to join ${v.studioName} on Falloff as ${v.role}.`, 'Open the link to sign up or sign in with this address and join:'];
  const foot = `The invitation is for ${v.to} and works until ${new Date(v.expiresAt).toUTCString()}. If you did not expect it, ignore this e-mail.`;
  return { to: v.to, subject: `Join ${v.studioName} on Falloff`, text: `${lines.join('\n\n')}\n${v.link}\n\n${foot}\n`, html: html(lines, { href: v.link, label: `Join ${v.studioName}` }, foot) };
}

export function resetPasswordMessage(v: { to: string; name: string; url: string }): Message {
  const lines = [`Hello ${v.name},`, 'Someone asked to reset the password of your Falloff account. Choose a new one here:'];
  const foot = 'The link works once and for one hour. If you did not ask for it, ignore this e-mail; your password stays as it is.';
  return { to: v.to, subject: 'Reset your Falloff password', text: `${lines.join('\n\n')}\n${v.url}\n\n${foot}\n`, html: html(lines, { href: v.url, label: 'Choose a new password' }, foot) };
}

export function verifyEmailMessage(v: { to: string; name: string; url: string }): Message {
  const lines = [`Hello ${v.name},`, 'Confirm that this address is yours to finish setting up your Falloff account. Until then you cannot join a studio or a class by invitation, or send mail to others.'];
  const foot = 'If you did not sign up for Falloff, ignore this e-mail; no account is confirmed without this link.';
  return { to: v.to, subject: 'Confirm your e-mail address for Falloff', text: `${lines.join('\n\n')}\n${v.url}\n\n${foot}\n`, html: html(lines, { href: v.url, label: 'Confirm my address' }, foot) };
}

/** Someone tried to sign up with an address that already has an account: tell its owner, not the visitor. */
export function existingAccountMessage(v: { to: string; name: string; signInUrl: string }): Message {
  const lines = [`Hello ${v.name},`, 'Someone just tried to make a new Falloff account with this address, which already has one. If it was you, sign in instead — or reset your password from the sign-in page if you have forgotten it.'];
  const foot = 'If it was not you, nothing has changed: your account and password stay as they are.';
  return { to: v.to, subject: 'You already have a Falloff account', text: `${lines.join('\n\n')}\n${v.signInUrl}\n\n${foot}\n`, html: html(lines, { href: v.signInUrl, label: 'Sign in' }, foot) };
}

/** New comments on a setup, grouped into one e-mail per person (server/mail/commentNotices.ts). */
export function commentDigestMessage(v: { to: string; name: string; title: string; url: string; comments: { author: string; body: string }[] }): Message {
  const n = v.comments.length;
  const shown = v.comments.slice(0, 10);
  const lines = [
    `Hello ${v.name},`,
    `${n === 1 ? 'There is a new comment' : `There are ${n} new comments`} on “${v.title}”:`,
    ...shown.map((c) => `${c.author}: ${c.body.length > 400 ? `${c.body.slice(0, 400)}…` : c.body}`),
    ...(n > shown.length ? [`…and ${n - shown.length} more.`] : []),
  ];
  const foot = 'You get at most one of these e-mails per setup every few minutes; opening the comments marks them read.';
  return { to: v.to, subject: `${n === 1 ? 'A new comment' : `${n} new comments`} on ${v.title}`, text: `${lines.join('\n\n')}\n\n${v.url}\n\n${foot}\n`, html: html(lines, { href: v.url, label: 'Open the setup' }, foot) };
}
