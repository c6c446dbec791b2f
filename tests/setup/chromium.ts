import { chromium, type Browser } from 'playwright-core';

/** Debian's Chromium, headless, with nothing reaching out to the network on its own (see ../shared/STACK.md). */
export const chromiumFlags = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** The one launcher for the browser tests, the bench's browser figures and the icon renderer. */
export const launchBrowser = (): Promise<Browser> =>
  chromium.launch({ executablePath: '/usr/bin/chromium', args: chromiumFlags });
