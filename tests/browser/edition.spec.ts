/**
 * The reading edition in a browser: links from notes, concordance lines, quotations and
 * word occurrences land on the paragraph they name, and that paragraph holds the words
 * the link stands for. The demo's own tables are the expected values: the words of each
 * concordance line and quotation are looked for in the paragraph the page lands on.
 */
import { test, expect } from '@playwright/test';
import type { Page } from '@playwright/test';

const BASE = '/exhibit/';

/** Text as a reader compares it: white space as single spaces. */
const flat = (s: string | null) => (s ?? '').replace(/\s+/g, ' ').trim();

/** Follows a link on the page and returns the text of the paragraph it lands on (the :target). */
async function land(page: Page, href: string): Promise<{ text: string; hash: string }> {
  await page.goto(href);
  const hash = new URL(page.url()).hash;
  expect(hash, href).toMatch(/^#p\d+$/);
  const target = page.locator(`${hash}:target`);
  await expect(target).toHaveCount(1);
  await expect(target).toBeInViewport();
  return { text: flat(await target.locator('p').first().textContent()), hash };
}

/** A spread sample of n items. */
const sample = <T>(xs: T[], n: number): T[] => (xs.length <= n ? xs : Array.from({ length: n }, (_, k) => xs[Math.floor((k * (xs.length - 1)) / (n - 1))]!));

test.describe('the reading edition', () => {
  test('concordance lines land on the paragraph holding the node and its next word', async ({ page }) => {
    await page.goto(`${BASE}words/lamp-in-context/`);
    const rows = await page.locator('.data-section table.data tbody tr').evaluateAll((trs) =>
      trs.map((tr) => {
        const cells = [...tr.children].map((c) => c.textContent ?? '');
        return { left: cells[3]!, keyword: cells[4]!, right: cells[5]!, href: tr.querySelector('td.places a')?.getAttribute('href') ?? '' };
      }),
    );
    expect(rows.length).toBe(21);
    for (const row of sample(rows, 6)) {
      const { text } = await land(page, row.href);
      const before = `${flat(row.left).split(' ').at(-1)} ${flat(row.keyword)}`;
      const after = `${flat(row.keyword)}${flat(row.right).startsWith(',') || flat(row.right).startsWith('.') ? '' : ' '}${flat(row.right).split(' ')[0]}`;
      expect(text.includes(before) || text.includes(after), `${row.href}: “${before}” or “${after}” in “${text.slice(0, 120)}…”`).toBe(true);
    }
  });

  test('quotations land on the paragraph that holds them, word for word', async ({ page }) => {
    await page.goto(`${BASE}voices/who-speaks/`);
    const quoteColumn = await page.locator('.data-section table.data thead th').evaluateAll((ths) => ths.findIndex((th) => th.textContent === 'Quotation'));
    const rows = await page.locator('.data-section table.data tbody tr').evaluateAll(
      (trs, col) => trs.map((tr) => ({ quote: tr.children[col]!.textContent ?? '', href: tr.querySelector('td.places a')?.getAttribute('href') ?? '' })),
      quoteColumn,
    );
    expect(rows.length).toBeGreaterThan(100);
    for (const row of sample(rows, 8)) {
      const { text } = await land(page, row.href);
      expect(text).toContain(flat(row.quote));
    }
  });

  test('notes at a paragraph and at a segment link into the text', async ({ page }) => {
    await page.goto(`${BASE}weather/mood-by-chapter/`);
    const note = page.locator('.notes li', { hasText: 'beam of oak' }).locator('a');
    await expect(note).toHaveText('Chapter IV: The Night of the High Water, paragraph 33');
    const { text, hash } = await land(page, (await note.getAttribute('href'))!);
    expect(hash).toBe('#p33');
    expect(text).toContain('It was a great beam of oak with iron bolts');
    // A segment: the paragraph where the slice begins.
    await page.goto(`${BASE}shape/presence-strip/`);
    const seg = page.locator('.notes li', { hasText: 'tide-gauge post' }).locator('a');
    await expect(seg).toHaveText('Segment 30 of 40');
    await land(page, (await seg.getAttribute('href'))!);
    // A chapter: its page.
    await page.goto(`${BASE}shape/chapter-lengths/`);
    const chapter = page.locator('.notes li').first().locator('a');
    await chapter.click();
    await expect(page.locator('h1')).toHaveText('Chapter IV: The Night of the High Water');
  });

  test('a word’s occurrences in a dispersion table land on paragraphs holding the word', async ({ page }) => {
    await page.goto(`${BASE}words/where-words-fall/`);
    const sluice = await page.locator('.data-section table.data tbody tr', { hasText: 'sluice' }).locator('td.places a').evaluateAll((as) => as.map((a) => a.getAttribute('href')!));
    expect(sluice.length).toBeGreaterThan(1);
    for (const href of sluice) expect((await land(page, href)).text.toLowerCase()).toContain('sluice');
  });

  test('a paragraph shows the panels that cite it, and the contents page leads to every chapter', async ({ page }) => {
    await page.goto(`${BASE}texts/lamps/4/#p33`);
    const cited = page.locator('#p33 .cited a');
    await expect(cited.filter({ hasText: 'Brighter and darker chapters' })).toHaveCount(1);
    await cited.filter({ hasText: 'Brighter and darker chapters' }).click();
    await expect(page.locator('h1')).toHaveText('Brighter and darker chapters');
    await page.goto(`${BASE}texts/lamps/`);
    await expect(page.locator('.contents a')).toHaveCount(6);
    await expect(page.locator('.text-facts')).toContainText('lines 1–10');
    await page.locator('.contents a').nth(4).click();
    await expect(page.locator('h1')).toHaveText('Chapter V: What the River Took');
    await expect(page.locator('.para')).toHaveCount(9);
  });
});
