/**
 * Setting running text into lines: pieces of known width flowed left to
 * right and broken where white space allows, first fit (each line takes as
 * many words as fit, the way most typesetting for the screen does).
 */

export interface FlowItem {
  /** Width of the piece. */
  width: number;
  /** White space before the piece: a line may break here. False glues it to the piece before. */
  breakBefore: boolean;
  /** Room left before the piece when it follows another on the same line (a word space, or a small gap). */
  spaceBefore: number;
  /** The piece opens a paragraph: it starts a new line. */
  paragraph: boolean;
}

export interface FlowLine {
  /** The line opens a paragraph (true for the first line too). */
  paragraph: boolean;
  /** The pieces on the line: their index in the input and their left edge. */
  items: { index: number; x: number }[];
  /** Width taken by the line. */
  width: number;
}

/**
 * Flows `items` into lines at most `maxWidth` wide. Pieces glued together
 * (no `breakBefore`) move as one word; a word wider than a line gets a line
 * of its own and overflows it.
 */
export function flowLines(items: readonly FlowItem[], maxWidth: number): FlowLine[] {
  // Words: runs of glued pieces.
  const words: number[][] = [];
  items.forEach((item, i) => {
    if (i === 0 || item.breakBefore || item.paragraph) words.push([i]);
    else words[words.length - 1].push(i);
  });
  const lines: FlowLine[] = [];
  let cur: FlowLine | null = null;
  for (const word of words) {
    const first = items[word[0]];
    let inner = 0;
    word.forEach((i, k) => (inner += items[i].width + (k > 0 ? items[i].spaceBefore : 0)));
    const fits = cur !== null && cur.items.length > 0 && cur.width + first.spaceBefore + inner <= maxWidth;
    if (cur === null || first.paragraph || (!fits && cur.items.length > 0)) {
      cur = { paragraph: cur === null || first.paragraph, items: [], width: 0 };
      lines.push(cur);
    }
    let x = cur.items.length ? cur.width + first.spaceBefore : 0;
    word.forEach((i, k) => {
      if (k > 0) x += items[i].spaceBefore;
      cur!.items.push({ index: i, x });
      x += items[i].width;
    });
    cur.width = x;
  }
  return lines;
}
