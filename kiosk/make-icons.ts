// Renders the kiosk's install icons from public/icon.svg with Debian Chromium: node --import tsx kiosk/make-icons.ts
import { readFileSync } from 'node:fs';
import { launchBrowser } from '@tests/setup/chromium';

const svg = readFileSync('public/icon.svg', 'utf8');
const browser = await launchBrowser();
for (const { size, file, padding } of [
  { size: 192, file: 'icon-192.png', padding: 0 },
  { size: 512, file: 'icon-512.png', padding: 0 },
  { size: 512, file: 'icon-maskable-512.png', padding: 0.1 },
]) {
  const page = await browser.newPage({ viewport: { width: size, height: size } });
  const inner = Math.round(size * (1 - 2 * padding));
  await page.setContent(
    `<body style="margin:0;background:#0f1a24;display:grid;place-items:center;height:${size}px">` +
      `<div style="width:${inner}px;height:${inner}px">${svg.replace('<svg ', `<svg width="${inner}" height="${inner}" `)}</div></body>`,
  );
  await page.screenshot({ path: `kiosk/icons/${file}` });
  await page.close();
}
await browser.close();
