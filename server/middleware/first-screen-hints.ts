import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { boardBases, boardParams, boardQuery } from '@shared/schemas/board-address';

// Each page of the app is the same index.html until its script runs; only then does it ask for its screen's code,
// its words and the session, one round trip after another. On a tablet at the edge of the hangar's Wi-Fi each
// round trip is slow, so the page names what its first screen will fetch, and the browser fetches it alongside the
// script. Nothing here changes what a page does: a hint that is not used costs one small request.

/** One source module's entry in Vite's build manifest (build.manifest): its file and what it imports. */
interface ManifestChunk {
  file: string;
  imports?: string[];
  isEntry?: boolean;
}
type Manifest = Record<string, ManifestChunk>;

interface FirstScreen {
  /** Whether the page asks for the session before it draws anything (every page but the board). */
  session: boolean;
  /** The API answer the first screen draws from, when the address alone names it (the board's airframes). */
  data?: string;
  /** Source modules of the screen's lazily loaded code and the English words it reads (English is the fallback of
   * every language, so it is fetched whatever the language). */
  modules: string[];
}

const words = 'shared/i18n/locales/en/words.json';

/** The first screen of each address (src/app/router.tsx); null for an address with none worth naming. */
export function firstScreenOf(path: string, query = new URLSearchParams()): FirstScreen | null {
  if (path === '/' || path === '/kiosk') return { session: true, modules: [] };
  if (path.startsWith('/kiosk/'))
    return { session: true, modules: ['src/app/routes/kiosk-work-routes.ts', words] };
  if (path === '/pilot' || path.startsWith('/pilot/'))
    return { session: true, modules: ['src/app/routes/acceptance-routes.tsx', words] };
  if (path === '/board')
    return {
      session: false,
      // Asked for exactly as the board page asks (src/app/routes/board-route.tsx, the same shared functions).
      data: `/api/airframes${boardQuery(query.get(boardParams.token), boardBases(query.get(boardParams.bases)))}`,
      modules: ['src/app/routes/board-route.tsx', words, 'shared/i18n/locales/en/board.json'],
    };
  if (path === '/desk') return { session: true, modules: ['src/app/routes/desk-routes.tsx', words] };
  if (path === '/desk/home')
    return {
      session: true,
      modules: ['src/app/routes/desk-layout.tsx', 'src/app/routes/desk-routes.tsx', words],
    };
  if (path.startsWith('/desk/')) return { session: true, modules: ['src/app/routes/desk-layout.tsx', words] };
  return null;
}

/** The built files a screen's modules need, with what they import in turn, less the entry the page loads anyway. */
function filesOf(manifest: Manifest, modules: string[]): string[] {
  const files = new Set<string>();
  const visit = (key: string) => {
    const chunk = manifest[key];
    if (!chunk || chunk.isEntry || files.has(chunk.file)) return;
    files.add(chunk.file);
    for (const imported of chunk.imports ?? []) visit(imported);
  };
  modules.forEach(visit);
  return [...files];
}

/**
 * index.html for an address, with a preload of the API answers its first screen asks for first (the session, the
 * board's airframes) and a module preload of each file of that screen. Without a build manifest (a build from
 * before it was switched on) the page goes out as built.
 */
export function firstScreenPages(clientDir: string): (path: string, query?: URLSearchParams) => string {
  const html = readFileSync(join(clientDir, 'index.html'), 'utf8');
  const manifestPath = join(clientDir, '.vite', 'manifest.json');
  const manifest = existsSync(manifestPath)
    ? (JSON.parse(readFileSync(manifestPath, 'utf8')) as Manifest)
    : null;
  const modulePreloads = new Map<string, string>();
  // The same requests the app's fetch makes (same address, same-origin credentials), so the browser hands the
  // preloaded answers to it.
  const fetchPreload = (url: string) =>
    `<link rel="preload" href="${url.replaceAll('&', '&amp;')}" as="fetch" crossorigin="anonymous">`;
  return (path, query) => {
    const screen = manifest ? firstScreenOf(path, query) : null;
    if (!screen) return html;
    const key = screen.modules.join(' ');
    let modules = modulePreloads.get(key);
    if (modules === undefined) {
      modules = filesOf(manifest!, screen.modules)
        .map((file) => `<link rel="modulepreload" crossorigin href="/${file}">`)
        .join('');
      modulePreloads.set(key, modules);
    }
    const fetches = [...(screen.session ? ['/api/session'] : []), ...(screen.data ? [screen.data] : [])];
    return html.replace('</head>', `${fetches.map(fetchPreload).join('')}${modules}</head>`);
  };
}
