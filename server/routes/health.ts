import { sql } from 'drizzle-orm';
import { Router } from 'express';
import type { Db } from '../../db/client';

export function healthRoutes(db: Db) {
  const r = Router();
  r.get('/health', async (_req, res) => {
    try {
      await db.execute(sql`select 1`);
      res.json({ ok: true, db: 'up' });
    } catch {
      res.status(503).json({ ok: false, db: 'down' });
    }
  });
  return r;
}
