import { Router } from 'express';
import type { DataSource } from 'typeorm';

/** GET /api/health: the app is up; says whether the database answers and how fast. */
export function healthRoutes(dataSource: DataSource) {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const started = process.hrtime.bigint();
    try {
      await dataSource.query('SELECT 1');
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      res.json({ data: { status: 'ok', database: { status: 'up', latencyMs: Math.round(ms * 10) / 10 }, uptimeS: Math.round(process.uptime()) } });
    } catch (err) {
      res.setHeader('Retry-After', '5');
      res.status(503).json({
        error: { code: 'service_unavailable', message: 'The database is not reachable right now.', details: { database: { status: 'down', reason: (err as Error).message } } },
      });
    }
  });
  return router;
}
