/**
 * Drawing a social card: each chart rasterised at the size its frame gives
 * it, the layout (./layout.ts) set by satori with the project's faces (text
 * becomes paths), and the result rasterised by sharp into a 1200×630 PNG.
 *
 * Which of a chart's two layouts goes on a card: the one that comes out
 * larger in the frame. A wide chart scaled into the card's frame shrinks its
 * 13-unit type below 12 px; the narrow layout (360 units wide) of the same
 * chart is drawn at nearly twice the scale, so its type is about 20 px at
 * 1200 px, which stays readable when a preview shows the card at half size.
 */
import satori from 'satori';
import { CARD_SIZE } from '../share/addresses.ts';
import { viewBoxSize, withNamedFonts } from '../share/standalone.ts';
import { encodePng, rasterise } from '../raster/raster.ts';
import { satoriFonts } from '../raster/fonts.ts';
import type { SatoriFont } from '../raster/fonts.ts';
import sharp from 'sharp';
import { chartPlaces, cardTree } from './layout.ts';
import type { Box, CardContent, ChartPicture } from './layout.ts';

export interface Fitted {
  svg: string;
  /** Pixels per SVG unit. */
  scale: number;
  width: number;
  height: number;
}

/** The layout of `chart` that is drawn largest inside `box`, and its size there. */
export function fitChart(chart: ChartPicture, box: Box): Fitted {
  const options = [chart.svg, ...(chart.narrow ? [chart.narrow] : [])].map((svg) => {
    const size = viewBoxSize(svg);
    const scale = Math.min(box.width / size.width, box.height / size.height);
    return { svg, scale, width: Math.floor(size.width * scale), height: Math.floor(size.height * scale) };
  });
  return options.reduce((best, o) => (o.scale > best.scale + 1e-9 ? o : best));
}

let fonts: SatoriFont[] | null = null;

/** The card's type and empty frames, as satori lays them out (text as paths). */
export async function cardSvg(card: CardContent): Promise<string> {
  fonts ??= satoriFonts();
  return satori(cardTree(card) as Parameters<typeof satori>[0], { width: CARD_SIZE.width, height: CARD_SIZE.height, fonts });
}

/** The charts a card shows, in the order of its places. */
function chartsOf(card: CardContent): ChartPicture[] {
  return card.kind === 'home' ? card.charts : card.chart ? [card.chart] : [];
}

/**
 * The card as a 1200×630 PNG: the layout rasterised, each chart rasterised
 * at the size it takes in its frame (so its type is drawn at that size, not
 * scaled from another), and set in the frame's centre.
 */
export async function drawCard(card: CardContent): Promise<Buffer> {
  const charts = chartsOf(card);
  const layers = await Promise.all(
    chartPlaces(card).map(async (place, i) => {
      const fit = fitChart(charts[i]!, place);
      const input = await rasterise(withNamedFonts(fit.svg), { scale: fit.scale, width: fit.width, height: fit.height });
      return { input, left: place.x + Math.floor((place.width - fit.width) / 2), top: place.y + Math.floor((place.height - fit.height) / 2) };
    }),
  );
  const base = await rasterise(await cardSvg(card), { width: CARD_SIZE.width, height: CARD_SIZE.height });
  return layers.length ? encodePng(sharp(base).composite(layers)) : base;
}
