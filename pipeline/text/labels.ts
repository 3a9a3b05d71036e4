/** Short labels shared by the measures' chart views. */

/** The tick label of a chapter: its number in Arabic figures, common practice for axis ticks. */
export function chapterTick(number: number): string {
  return String(number);
}

/** A segment's label: "Segment 3 (words 1,201–1,800)". */
export function segmentLabel(index: number, firstToken: number, endToken: number): string {
  return `Segment ${index + 1} (words ${fmt(firstToken + 1)}–${fmt(endToken)})`;
}

function fmt(n: number): string {
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}
