// `npm run operator -- add <email>` | `remove <email>` | `list`: who operates this Falloff. An operator
// publishes templates to, and withdraws them from, the gallery for everyone (server/access.ts). The account
// must exist (signed up). Uses DATABASE_URL when set, else this clone's own database (`npm start` must have
// started its PostgreSQL, or run it once).
import { createDb } from '../db/client';
import { addOperator, listOperators, removeOperator } from '../db/operators';
import { DB_NAME, databaseUrl } from './lib.mjs';

const USAGE = 'usage: npm run operator -- add <email> | remove <email> | list';

async function main(): Promise<number> {
  const [cmd, email, ...rest] = process.argv.slice(2);
  if (!cmd || rest.length || (cmd === 'list' ? !!email : !['add', 'remove'].includes(cmd) || !email)) {
    process.stderr.write(`${USAGE}\n`);
    return 2;
  }
  const url = process.env.DATABASE_URL || databaseUrl(DB_NAME);
  const { db, pool } = createDb(url);
  try {
    if (cmd === 'list') {
      const all = await listOperators(db);
      if (!all.length) process.stdout.write('no operators yet (npm run operator -- add <email>)\n');
      for (const o of all) process.stdout.write(`${o.email}  ${o.name}  since ${o.addedAt.toISOString().slice(0, 10)}\n`);
      return 0;
    }
    const r = cmd === 'add' ? await addOperator(db, email!) : await removeOperator(db, email!);
    const said = {
      added: `${email} is now an operator: they can publish templates to the gallery for everyone and withdraw them`,
      already: `${email} is already an operator`,
      removed: `${email} is no longer an operator`,
      not_one: `${email} was not an operator`,
      no_account: `no account has the address ${email}; they sign up first`,
    }[r];
    (r === 'no_account' ? process.stderr : process.stdout).write(`${said}\n`);
    return r === 'no_account' ? 1 : 0;
  } catch (err) {
    const e = err as { code?: string; message?: string };
    const down = e.code === 'ECONNREFUSED' || /connect|ECONNREFUSED|terminat/i.test(e.message ?? '');
    process.stderr.write(down ? `PostgreSQL does not answer at ${url.replace(/\/\/[^@]*@/, '//')}: start Falloff first (npm start) or set DATABASE_URL.\n` : `${e.message ?? err}\n`);
    return 1;
  } finally {
    await pool.end().catch(() => undefined);
  }
}

main().then((code) => process.exit(code));
