import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { firstScreenOf, firstScreenPages } from './first-screen-hints';

const html = '<html><head><title>Gaugewalk</title></head><body></body></html>';
const manifest = {
  'index.html': { file: 'assets/index-1.js', isEntry: true },
  'src/app/routes/board-route.tsx': {
    file: 'assets/board-route-2.js',
    imports: ['index.html', '_state-badge.js'],
  },
  '_state-badge.js': { file: 'assets/state-badge-3.js', imports: ['index.html'] },
  'shared/i18n/locales/en/words.json': { file: 'assets/words-4.js' },
  'shared/i18n/locales/en/board.json': { file: 'assets/board-5.js' },
  'src/app/routes/desk-routes.tsx': { file: 'assets/desk-routes-6.js', imports: ['_state-badge.js'] },
};

function built(withManifest: boolean) {
  const dir = mkdtempSync(join(tmpdir(), 'gw-hints-'));
  writeFileSync(join(dir, 'index.html'), html);
  if (withManifest) {
    mkdirSync(join(dir, '.vite'));
    writeFileSync(join(dir, '.vite', 'manifest.json'), JSON.stringify(manifest));
  }
  return dir;
}
const dirs = [built(true), built(false)];
afterAll(() => dirs.forEach((dir) => rmSync(dir, { recursive: true, force: true })));
const pageFor = firstScreenPages(dirs[0]!);
const hrefs = (page: string, rel: string) =>
  [...page.matchAll(new RegExp(`<link rel="${rel}"[^>]* href="([^"]+)"`, 'g'))].map((m) => m[1]);

describe('first-screen hints in index.html', () => {
  it('when the board opens from a link for some bases, then its code, its words and its airframes are named, not the session', () => {
    const page = pageFor('/board', new URLSearchParams('board=Ab_9-x&base= np,hh &lang=de'));
    expect(hrefs(page, 'modulepreload')).toEqual([
      '/assets/board-route-2.js',
      '/assets/state-badge-3.js',
      '/assets/words-4.js',
      '/assets/board-5.js',
    ]);
    // Asked for as the board asks: its link, then its bases upper-cased; the & written as HTML wants it.
    expect(hrefs(page, 'preload')).toEqual(['/api/airframes?board=Ab_9-x&amp;base=NP%2CHH']);
    expect(page).toContain('as="fetch" crossorigin="anonymous"');
    expect(page.indexOf('<link')).toBeLessThan(page.indexOf('</head>'));
  });

  it('when the desk, the kiosk or the start page opens, then the session is preloaded, and the entry never is', () => {
    const desk = pageFor('/desk');
    expect(hrefs(desk, 'preload')).toEqual(['/api/session']);
    expect(hrefs(desk, 'modulepreload')).toEqual([
      '/assets/desk-routes-6.js',
      '/assets/state-badge-3.js',
      '/assets/words-4.js',
    ]);
    for (const path of ['/', '/kiosk']) {
      expect(hrefs(pageFor(path), 'preload')).toEqual(['/api/session']);
      expect(hrefs(pageFor(path), 'modulepreload')).toEqual([]);
    }
  });

  it('when an address has no first screen to name, or the build has no manifest, then index.html goes out as built', () => {
    expect(pageFor('/t/some-tag')).toBe(html);
    expect(pageFor('/enrol/123456')).toBe(html);
    expect(firstScreenPages(dirs[1]!)('/board', new URLSearchParams('board=x'))).toBe(html);
  });

  it('when a board link carries markup, then it stays inside the address', () => {
    const page = pageFor('/board', new URLSearchParams('board="><script>alert(1)</script>'));
    expect(page).not.toContain('<script>');
    expect(hrefs(page, 'preload')).toEqual([
      '/api/airframes?board=%22%3E%3Cscript%3Ealert%281%29%3C%2Fscript%3E',
    ]);
  });

  it('when a route module is renamed or moved, then this fails instead of its hint going quietly missing', () => {
    // The build manifest is keyed by these source paths; a name it lacks is skipped without a word.
    const named = [
      '/',
      '/kiosk',
      '/kiosk/airframes',
      '/pilot',
      '/board',
      '/desk',
      '/desk/home',
      '/desk/records',
    ].flatMap((path) => firstScreenOf(path)?.modules ?? []);
    expect(named.length).toBeGreaterThan(5);
    expect(named.filter((module) => !existsSync(module))).toEqual([]);
  });
});
