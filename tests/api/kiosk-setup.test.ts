import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { appForThisFile } from '../setup/api-harness';

const { app } = appForThisFile();

describe('tablet installation', () => {
  it('when a tablet asks for the manifest, then it gets a full-screen kiosk app starting on /kiosk with icons that exist', async () => {
    const res = await request(app).get('/manifest.webmanifest').expect(200);
    expect(res.headers['content-type']).toMatch(/application\/manifest\+json/);
    const manifest = JSON.parse(res.text);
    expect(manifest).toMatchObject({ start_url: '/kiosk', display: 'fullscreen', short_name: 'Gaugewalk' });
    const icons = manifest.icons.filter((i: { src: string }) => i.src.startsWith('/kiosk-icons/'));
    expect(icons.map((i: { src: string }) => i.src).sort()).toEqual([
      '/kiosk-icons/icon-192.png',
      '/kiosk-icons/icon-512.png',
      '/kiosk-icons/icon-maskable-512.png',
    ]);
    for (const icon of icons) {
      const png = await request(app).get(icon.src).expect(200);
      expect(png.headers['content-type']).toBe('image/png');
    }
  });

  it('when pages are served, then the security headers forbid framing and foreign scripts', async () => {
    const res = await request(app).get('/api/health');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
