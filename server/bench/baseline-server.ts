import express from 'express';
import { pathToFileURL } from 'node:url';
import { baselineCheckStore, type BaselineCheck } from '../db/baseline-check-store';

/** The floor to compare the product with: a bare Express route over the bare-connector store. Bench only. */
export function baselineApp(databaseUrl: string) {
  const checks = baselineCheckStore(databaseUrl);
  const app = express();
  app.use(express.json({ limit: '200kb' }));
  app.post('/baseline/checks', async (req, res) => {
    try {
      res.status(201).json(await checks.store(req.body as BaselineCheck));
    } catch (err) {
      res.status(500).json({ code: 'baseline_failed', message: (err as Error).message });
    }
  });
  return { app, close: () => checks.close() };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const { app } = baselineApp(process.env.DATABASE_URL!);
  app.listen(Number(process.env.PORT), '127.0.0.1', () => process.stdout.write('listening\n'));
}
