import { chromium } from '@playwright/test';
const base = 'http://127.0.0.1:3100';
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'] });
const who = process.argv[2]; const paths = process.argv.slice(3);
const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
page.on('console', (m) => { if (m.type() === 'error') console.log('console error:', m.text()); });
page.on('pageerror', (e) => console.log('page error:', e.message));
page.on('request', (r) => { const u = new URL(r.url()); if (!['127.0.0.1', 'localhost'].includes(u.hostname) && !u.protocol.startsWith('data') && !u.protocol.startsWith('blob')) console.log('OUTSIDE', r.url()); });
await page.goto(base + '/sign-in');
await page.getByLabel('E-mail').fill(`${who}@demo.example`);
await page.getByLabel('Password').fill('correlary-demo-2026');
await page.getByRole('button', { name: 'Sign in' }).click();
await page.waitForURL(/library/);
for (const p of paths) {
  await page.goto(base + p);
  await page.waitForTimeout(2500);
  const name = p.replace(/[^a-z0-9]+/gi, '_');
  await page.screenshot({ path: `/tmp/shots/${who}${name}.png`, fullPage: true });
  console.log('shot', name);
}
await browser.close();
