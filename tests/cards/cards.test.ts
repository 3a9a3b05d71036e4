// Social cards: layout, palette and drawing. Card size 1200×630 (1.91:1) is the size link previews
// show large — common practice, no source. Pixel checks read the PNG back with sharp.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { charts } from '../../pipeline/charts/index.ts';
import { chapterWordsBars, mentionsBars } from '../charts/fixtures.ts';
import { chartPlaces, PALETTE } from '../../pipeline/cards/layout.ts';
import type { CardContent } from '../../pipeline/cards/layout.ts';
import { cardSvg, drawCard, fitChart } from '../../pipeline/cards/draw.ts';
import { CARD_SIZE } from '../../pipeline/share/addresses.ts';

const ROOT = join(import.meta.dirname, '../..');
const wide = charts.bars!.render(chapterWordsBars as never);
const other = charts.bars!.render(mentionsBars as never);
const picture = { svg: wide.svg, narrow: wide.svgNarrow ?? null };
const panel: CardContent = {
  kind: 'panel',
  exhibit: 'The Saltmarsh Ledger',
  organiser: 'The Wending Reach Society',
  room: { number: 1, title: 'The shape of the ledger' },
  title: 'How long is each entry?',
  chart: picture,
};

describe('card layout', () => {
  it('uses the site’s palette', () => {
    const css = readFileSync(join(ROOT, 'site/styles/exhibit.css'), 'utf8');
    const value = (name: string) => new RegExp(`--vt-${name}:\\s*(#[0-9a-f]{6})`, 'i').exec(css)![1]!.toLowerCase();
    expect(PALETTE).toEqual({ paper: value('paper'), ink: value('ink'), muted: value('muted'), rule: value('rule'), accent: value('accent'), panel: value('panel') });
  });

  it('places every chart inside the card, right of the column of type, without overlap', () => {
    const home = (n: number): CardContent => ({ kind: 'home', exhibit: 'E', subtitle: null, organiser: 'O', rooms: n, panels: n, charts: Array(n).fill(picture) });
    for (const card of [panel, home(1), home(2), home(3), home(4)]) {
      const places = chartPlaces(card);
      expect(places.length).toBe(card.kind === 'home' ? card.charts.length : 1);
      for (const p of places) {
        expect(p.x).toBeGreaterThan(CARD_SIZE.width / 3);
        expect(p.x + p.width).toBeLessThanOrEqual(CARD_SIZE.width);
        expect(p.y + p.height).toBeLessThanOrEqual(CARD_SIZE.height);
      }
      for (const a of places) for (const b of places) {
        if (a === b) continue;
        const apart = a.x + a.width <= b.x || b.x + b.width <= a.x || a.y + a.height <= b.y || b.y + b.height <= a.y;
        expect(apart).toBe(true);
      }
    }
    expect(chartPlaces({ kind: 'room', exhibit: 'E', organiser: 'O', number: 1, rooms: 1, title: 'T', panels: [], chart: null })).toEqual([]);
  });

  it('draws the layout of a chart that comes out larger: the narrow one when the frame is tall enough', () => {
    const box = chartPlaces(panel)[0]!;
    const fit = fitChart(picture, box);
    expect(fit.svg).toBe(wide.svgNarrow);
    // The 13-unit type of the narrow layout is set at 20 px or more on the card.
    expect(13 * fit.scale).toBeGreaterThanOrEqual(20);
    expect(fit.width).toBeLessThanOrEqual(box.width);
    expect(fit.height).toBeLessThanOrEqual(box.height);
    expect(fitChart({ svg: wide.svg, narrow: null }, box).svg).toBe(wide.svg);
  });
});

describe('drawCard', () => {
  it('draws a 1200×630 PNG with the chart set in its frame, the same bytes each time', async () => {
    const png = await drawCard(panel);
    const meta = await sharp(png).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(['png', 1200, 630]);
    expect((await drawCard(panel)).equals(png)).toBe(true);
    // The frame holds more than paper: the chart's bars (Okabe–Ito blue, theme.ts) are there.
    const p = chartPlaces(panel)[0]!;
    const { data, info } = await sharp(png).extract({ left: p.x, top: p.y, width: p.width, height: p.height }).raw().toBuffer({ resolveWithObject: true });
    let blue = 0;
    for (let i = 0; i < data.length; i += info.channels) if (data[i]! < 40 && data[i + 1]! > 90 && data[i + 1]! < 130 && data[i + 2]! > 160) blue++;
    expect(blue).toBeGreaterThan(2000);
    // A different chart gives a different card.
    expect((await drawCard({ ...panel, chart: { svg: other.svg, narrow: other.svgNarrow ?? null } })).equals(png)).toBe(false);
  });

  it('sets the card’s words as paths in the project’s faces, escaping nothing into markup', async () => {
    const svg = await cardSvg({ ...panel, title: 'Tides & <Tallies> of the “Reach”' });
    expect(svg).not.toMatch(/<text|Tallies/);
    expect(svg).toMatch(/<path/);
  });
});
