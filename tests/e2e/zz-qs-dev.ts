import { openBrowser, startTestServer, VIEWPORTS } from './harness';
(async () => {
  const server = await startTestServer({ config: { distDir: process.env.QS_DIST || '/tmp/qs-dist' } });
  try {
    for (const [name, vp] of Object.entries(VIEWPORTS)) {
      const b = await openBrowser({ viewport: vp });
      const errors: string[] = [];
      b.page.on('pageerror', (e) => errors.push(String(e)));
      b.page.on('console', (m) => { if (m.type() === 'error') errors.push(m.text()); });
      await b.page.goto(`${server.url}/quick-sizing${process.env.QS_QUERY ?? ''}`, { waitUntil: 'load' });
      await b.page.waitForLoadState('networkidle');
      await b.page.waitForTimeout(500);
      await b.page.screenshot({ path: `/tmp/qs-shots/${name}.png`, fullPage: name === 'desktop' });
      await b.page.screenshot({ path: `/tmp/qs-shots/${name}-full.png`, fullPage: true });
      console.log(name, 'errors:', errors.slice(0, 5));
      console.log(await b.page.locator('[data-testid="qs-result-surfaceTemperature"]').first().getAttribute('data-si'));
      console.log(b.page.url().slice(0, 200));
      await b.close();
    }
  } finally { await server.close(); }
})();
