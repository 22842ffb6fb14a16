// What the server must be told outside the local default. Locally (loopback address, no PUBLIC_URL, not
// production) it may run on a built-in secret; anywhere else a built-in secret would let anyone who read this
// file forge sessions, and links in e-mails would point at the wrong host: AUTH_SECRET and PUBLIC_URL are then required.
export const LOCAL_SECRET = 'falloff-local-development-secret-0123456789';
const MIN_SECRET_LENGTH = 32;

export type AuthConfig = { secret: string; publicUrl: string | undefined; local: boolean };

const LOOPBACK = /^(127\.\d+\.\d+\.\d+|localhost|::1)$/;

export function authConfig(env: Record<string, string | undefined>, host: string): AuthConfig {
  const publicUrl = env.PUBLIC_URL?.trim() || undefined;
  const local = env.NODE_ENV !== 'production' && !publicUrl && LOOPBACK.test(host);
  const secret = env.AUTH_SECRET?.trim();
  if (!local) {
    const missing = [!secret && 'AUTH_SECRET', !publicUrl && 'PUBLIC_URL'].filter(Boolean);
    if (missing.length) {
      throw new Error(
        `${missing.join(' and ')} must be set when the server is not a local development one (NODE_ENV=production, PUBLIC_URL set, or listening beyond loopback): ` +
          'AUTH_SECRET signs sessions (at least 32 random characters, the same on every instance), PUBLIC_URL is the address people reach (links in e-mails).',
      );
    }
    if (secret!.length < MIN_SECRET_LENGTH || secret === LOCAL_SECRET) throw new Error(`AUTH_SECRET must be at least ${MIN_SECRET_LENGTH} random characters (and not the built-in local one)`);
  }
  return { secret: secret || LOCAL_SECRET, publicUrl, local };
}
