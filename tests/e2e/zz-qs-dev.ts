import { openBrowser, startTestServer, VIEWPORTS } from './harness';
(async () => {
  const server = await startTestServer({ config: { distDir: '/tmp/qs-dist' } });
  try {
    for (const [name, vp] of Object.entries(VIEWPORTS)) {
      const b = await openBrowser({ viewport: vp });
      await b.page.goto(`${server.url}/quick-sizing`, { waitUntil: 'load' });
      await b.page.waitForSelector('[data-testid="qs-screen"][data-ready="true"]');
      await b.page.locator('[data-testid="qs-kind-wall"]').click();
      await b.page.locator('[data-testid="qs-purpose-conservation"]').click();
      await b.page.locator('[data-testid="qs-typical"]').click();
      await b.page.waitForTimeout(600);
      await b.page.locator('[data-testid="qs-charts"]').screenshot({ path: `/tmp/qs-shots/${name}-charts.png` });
      await b.page.locator('[data-testid="qs-results"]').screenshot({ path: `/tmp/qs-shots/${name}-results.png` });
      await b.page.locator('[data-testid="qs-method"]').screenshot({ path: `/tmp/qs-shots/${name}-method.png` });
      await b.page.locator('[data-testid="qs-section-purpose"]').screenshot({ path: `/tmp/qs-shots/${name}-purpose.png` });
      await b.close();
    }
  } finally { await server.close(); }
})();
