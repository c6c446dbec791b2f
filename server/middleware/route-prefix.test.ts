import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { onlyForItsRoutes, routePrefixes } from './route-prefix';

const routerWith = (build: (router: express.Router) => void) => {
  const router = express.Router();
  build(router);
  return router;
};

describe('a feature router is skipped for paths none of its routes starts with', () => {
  it('when every route has a plain path, then its first segments are known; a middleware or a parameter first makes it see every request', () => {
    const plain = routerWith((r) => {
      r.get('/checks/:id', (_q, s) => void s.end());
      r.post('/checks', (_q, s) => void s.end());
      r.get('/Drafts/open', (_q, s) => void s.end());
      r.get(['/readings/:id', '/photos/:id'], (_q, s) => void s.end());
    });
    expect(routePrefixes(plain)).toEqual(new Set(['/checks', '/drafts', '/readings', '/photos']));
    expect(routePrefixes(routerWith((r) => r.use((_q, _s, next) => next())))).toBeNull();
    expect(routePrefixes(routerWith((r) => r.get('/:id', (_q, s) => void s.end())))).toBeNull();
  });

  it('when a request comes, then the router answers its own paths as Express would (any case, a trailing slash) and passes on the rest', async () => {
    const seen: string[] = [];
    const router = routerWith((r) => {
      r.get('/checks/:id', (q, s) => void s.json({ id: q.params.id }));
      r.post('/checks', (_q, s) => void s.status(201).end());
    });
    const app = express();
    app.use((q, _s, next) => {
      seen.push(q.path);
      next();
    });
    app.use(onlyForItsRoutes(router));
    app.use((_q, s) => void s.status(404).json({ passedOn: true }));
    expect((await request(app).get('/checks/7')).body).toEqual({ id: '7' });
    expect((await request(app).get('/CHECKS/8')).body).toEqual({ id: '8' });
    expect((await request(app).post('/checks/')).status).toBe(201);
    expect((await request(app).get('/checksum')).body).toEqual({ passedOn: true });
    expect((await request(app).get('/holds/1')).body).toEqual({ passedOn: true });
    expect(seen).toHaveLength(5);
    expect((onlyForItsRoutes(router) as unknown as { stack: unknown }).stack).toBe(router.stack);
  });
});
