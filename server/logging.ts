// What the logs may hold: never a session cookie, an Authorization header, a Set-Cookie, a password or a
// token. Headers and bodies are redacted by pino's own `redact`; tokens in paths and query strings (share
// links, invitations, password resets, e-mail confirmations) are cut out of the logged URL.
import type { LoggerOptions } from 'pino';

const REDACT_PATHS = [
  'req.headers.cookie',
  'req.headers.authorization',
  'req.headers["x-api-key"]',
  'res.headers["set-cookie"]',
  'headers.cookie',
  'headers.authorization',
  '*.password',
  '*.newPassword',
  '*.currentPassword',
  '*.token',
];

export function loggerOptions(level: string): LoggerOptions {
  return { level, redact: { paths: REDACT_PATHS, censor: '[redacted]' } };
}

/** A URL with the secret parts replaced: path tokens after shared/, invitations/, join/, reset-password/, and
 *  query values named token, code or callbackURL. */
export function redactUrl(url: string | undefined): string | undefined {
  if (!url) return url;
  const [path, query] = url.split('?', 2) as [string, string | undefined];
  const cleanPath = path.replace(/\/(shared|invitations|join|reset-password|s)\/[^/?#]+/g, (_m, seg: string) => `/${seg}/[redacted]`);
  if (query === undefined) return cleanPath;
  const cleanQuery = query.replace(/(^|&)(token|code|callbackURL)=[^&]*/gi, (_m, amp: string, key: string) => `${amp}${key}=[redacted]`);
  return `${cleanPath}?${cleanQuery}`;
}
