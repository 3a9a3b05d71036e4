import { test, expect } from '@playwright/test';
import AxeBuilder from '@axe-core/playwright';
import { mkdirSync } from 'node:fs';
import { resolve } from 'node:path';

const BASE = '/exhibit/';

test.describe('the demo exhibit in a browser', () => {
  test('home → room → panel works with JavaScript off', async ({ browser }) => {
    const context = await browser.newContext({ javaScriptEnabled: false });
    const page = await context.newPage();
    await page.goto(BASE);
    await expect(page.locator('h1')).toHaveCount(1);
    const roomLink = page.locator('.room-list h3 a').first();
    const roomTitle = (await roomLink.textContent())!.trim();
    await roomLink.click();
    await expect(page.locator('h1')).toHaveText(roomTitle);
    await page.locator('.panel-card h2 a').first().click();
    // A panel page: an inline SVG chart with its accessible name, a caption, a table and working downloads.
    // One drawing is shown (wide or narrow layout, by a media query); its twin is hidden from everyone.
    const svg = page.locator('figure.chart svg[role="img"]').locator('visible=true');
    await expect(svg).toHaveCount(1);
    await expect(svg.locator(':scope > title')).toHaveCount(1);
    await expect(page.locator('.caption')).not.toBeEmpty();
    await expect(page.locator('table.data tbody tr').first()).toBeVisible();
    await expect(page.locator('.method-card')).toBeVisible();
    const csvHref = await page.locator('a', { hasText: 'CSV' }).getAttribute('href');
    const jsonHref = await page.locator('a', { hasText: 'JSON' }).getAttribute('href');
    expect(csvHref!.startsWith(BASE)).toBe(true);
    const csv = await page.request.get(csvHref!);
    expect(csv.status()).toBe(200);
    expect((await csv.text()).split('\r\n').length).toBeGreaterThan(2);
    const json = await page.request.get(jsonHref!);
    expect(json.status()).toBe(200);
    expect(await json.json()).toHaveProperty('result');
    await context.close();
  });

  test('every page has no accessibility violations (axe-core)', async ({ page }) => {
    test.setTimeout(420_000);
    await page.goto(BASE);
    const links = new Set<string>([BASE]);
    for (const a of await page.locator('a[href]').all()) {
      const h = await a.getAttribute('href');
      if (h && h.startsWith(BASE) && h.endsWith('/')) links.add(h);
    }
    // Room pages link to panels; collect those too.
    for (const room of [...links]) {
      await page.goto(room);
      for (const a of await page.locator('main a[href]').all()) {
        const h = await a.getAttribute('href');
        if (h && h.startsWith(BASE) && h.endsWith('/')) links.add(h);
      }
    }
    expect(links.size).toBeGreaterThan(5);
    for (const link of links) {
      await page.goto(link);
      const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
      const summary = results.violations.map((v) => `${link}: ${v.id} (${v.nodes.length}) ${v.help}`);
      expect(summary).toEqual([]);
    }
  });

  test('the dialogue panels show a speaker bar chart, a conversation matrix and a network', async ({ page }) => {
    for (const [path, kind, measure] of [
      ['voices/who-speaks/', 'bars', 'speech'],
      ['voices/who-speaks-to-whom/', 'matrix', 'conversation'],
      ['voices/the-web-of-the-staithe/', 'network', 'network'],
    ] as const) {
      await page.goto(BASE + path);
      const chart = page.locator(`figure.chart svg[data-chart="${kind}"]`).locator('visible=true');
      await expect(chart).toHaveCount(1);
      // Its data table lists the cast members the chart draws.
      await expect(page.locator('table.data tbody tr')).not.toHaveCount(0);
      await expect(page.locator('.method-card h2')).toContainText(measure);
    }
  });

  test('every chart kind is screenshotted at 360 and 1920 px, with no text under 9 px on screen', async ({ browser }) => {
    test.setTimeout(300_000);
    const out = resolve(import.meta.dirname, '../../.vitrine/screens');
    mkdirSync(out, { recursive: true });
    const seen = new Set<string>();
    for (const width of [360, 1920]) {
      const context = await browser.newContext({ viewport: { width, height: 1000 } });
      const page = await context.newPage();
      await page.goto(BASE);
      const panels = await page.locator('.room-list .panel-links a').evaluateAll((as) => as.map((a) => a.getAttribute('href')!));
      for (const href of panels) {
        await page.goto(href);
        await page.evaluate(() => document.fonts.ready);
        const chart = page.locator('figure.chart svg[role="img"]').locator('visible=true');
        const kind = (await chart.getAttribute('data-chart'))!;
        seen.add(kind);
        await page.locator('figure.chart').screenshot({ path: `${out}/${href.split('/').filter(Boolean).slice(-1)[0]}-${width}.png` });
        // The smallest text the visitor sees in the chart, in CSS pixels.
        const smallest = await chart.evaluate((svg) =>
          Math.min(...[...svg.querySelectorAll('text')].filter((t) => t.getBoundingClientRect().height > 0).map((t) => parseFloat(getComputedStyle(t).fontSize) * (svg.getBoundingClientRect().width / (svg as SVGSVGElement).viewBox.baseVal.width))),
        );
        expect(smallest, `${href} at ${width} px`).toBeGreaterThanOrEqual(9);
      }
      await context.close();
    }
    // Every chart kind is used by the demo exhibit.
    expect([...seen].sort()).toEqual(['bars', 'kwic', 'lines', 'matrix', 'multiples', 'network', 'scatter', 'strip', 'textmap', 'tree', 'treemap']);
  });

  test('a panel is legible at 360 px: no horizontal scrolling of the page', async ({ browser }) => {
    const context = await browser.newContext({ viewport: { width: 360, height: 740 } });
    const page = await context.newPage();
    await page.goto(BASE);
    await page.locator('.room-list .panel-links a').first().click();
    await page.evaluate(() => document.fonts.ready);
    // Wide data tables scroll inside their own region; nothing else may stick out of the viewport.
    const wide = await page.evaluate(() =>
      [...document.querySelectorAll('body *')]
        .filter((el) => !el.closest('.table-wrap') && el.getBoundingClientRect().right > document.documentElement.clientWidth + 1)
        .map((el) => `${el.tagName.toLowerCase()}.${el.getAttribute('class') ?? ''}`)
        .slice(0, 5),
    );
    expect(wide).toEqual([]);
    await context.close();
  });
});
