import { loadavg } from 'node:os';
import { launchBrowser } from '@tests/setup/chromium';
import { firstScreenTransfer, lighthouseAudits, type Audit, type FirstScreen } from './browser-figures';

/** What a page needs to open as its users see it: a tablet's device cookie, a TV's board link, a desk session. */
export interface Visitors {
  kioskCookie: string;
  boardPath: string;
  deskCookie: string;
}

export interface FirstScreenFigures {
  transfer: Record<'kiosk' | 'board' | 'desk', { kB: number; requests: number }>;
  lighthouse: Record<string, Audit>;
  /** The machine's one-minute load average at the end of the audits: Lighthouse's scores fall as it rises. */
  loadAverage: number;
  seconds: number;
}

/** The first screens the bench opens: each one's sign that it is drawn. */
const screens = (who: Visitors): FirstScreen[] => [
  {
    name: 'kiosk',
    path: '/kiosk',
    cookie: who.kioskCookie,
    ready: (page) => page.getByRole('button', { name: 'Next: PIN' }).waitFor(),
  },
  {
    name: 'board',
    path: who.boardPath,
    // A tile: the bench's invented airframes carry no registration mark.
    ready: (page) => page.locator('article[data-testid^="board-"]').first().waitFor(),
  },
  {
    name: 'desk',
    path: '/desk',
    cookie: who.deskCookie,
    ready: (page) => page.getByRole('heading', { name: /Good to see you/ }).waitFor(),
  },
];

/**
 * The kiosk, board and desk first screens' transfer in Chromium with an empty cache, then Lighthouse on those and
 * the start page. Run after the load figures, on an otherwise quiet server.
 */
export async function firstScreens(baseUrl: string, who: Visitors): Promise<FirstScreenFigures> {
  const started = Date.now();
  const browser = await launchBrowser();
  const transfer = {} as FirstScreenFigures['transfer'];
  try {
    for (const screen of screens(who)) {
      const { kB, requests } = await firstScreenTransfer(browser, baseUrl, screen);
      transfer[screen.name as keyof FirstScreenFigures['transfer']] = { kB, requests };
    }
  } finally {
    await browser.close();
  }
  const lighthouse = await lighthouseAudits([
    { name: 'start', url: `${baseUrl}/` },
    { name: 'kiosk', url: `${baseUrl}/kiosk`, cookie: who.kioskCookie },
    { name: 'board', url: `${baseUrl}${who.boardPath}` },
    { name: 'desk', url: `${baseUrl}/desk`, cookie: who.deskCookie },
  ]);
  return {
    transfer,
    lighthouse,
    loadAverage: Math.round(loadavg()[0]! * 100) / 100,
    seconds: Math.round((Date.now() - started) / 1000),
  };
}
