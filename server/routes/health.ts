import { sql } from 'drizzle-orm';
import { Router } from 'express';
import type { Db } from '../../db/client';
import { DB_RETRY_AFTER_S } from '../errors';

/** GET /api/health: 200 while PostgreSQL answers, 503 (with Retry-After) while it does not. */
export function healthRoutes(db: Db) {
  const r = Router();
  r.get('/health', async (_req, res) => {
    try {
      await db.execute(sql`select 1`);
      res.json({ ok: true, db: 'up' });
    } catch {
      res.setHeader('Retry-After', String(DB_RETRY_AFTER_S));
      res.status(503).json({ ok: false, db: 'down' });
    }
  });
  return r;
}
