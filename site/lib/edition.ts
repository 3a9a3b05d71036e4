/**
 * The reading edition on the site: the address of each chapter and paragraph,
 * the words for a passage ("Ch. 4 ¶ 33", as the concordance and the phrase
 * places write them), and which panels point at each paragraph.
 */
import { exhibit } from './exhibit.ts';
import { href, panelHref } from './paths.ts';
import type { PreparedPanel, PreparedText } from '../../pipeline/stages/prepared.ts';
import type { Passage } from '../../pipeline/edition/edition.ts';

export function textHref(text: string): string {
  return href(`texts/${text}/`);
}

export function chapterHref(text: string, chapter: number): string {
  return href(`texts/${text}/${chapter}/`);
}

/** The anchor of a paragraph on its chapter's page. */
export function paragraphId(paragraph: number): string {
  return `p${paragraph}`;
}

/** The address of a passage: its chapter's page, at its paragraph when it names one. */
export function passageHref(text: string, at: { chapter: number; paragraph: number | null }): string {
  return at.paragraph === null ? chapterHref(text, at.chapter) : `${chapterHref(text, at.chapter)}#${paragraphId(at.paragraph)}`;
}

/** A passage in words, short: "Ch. 4 ¶ 33" (or "Ch. 4"). */
export function passageLabel(at: { chapter: number; paragraph: number | null }): string {
  return at.paragraph === null ? `Ch. ${at.chapter}` : `Ch. ${at.chapter} ¶ ${at.paragraph}`;
}

/** A passage in full words, for screen readers and titles: "Chapter IV: The Night of the High Water, paragraph 33". */
export function passageName(text: PreparedText, at: { chapter: number; paragraph: number | null }): string {
  const title = text.pages.chapters[at.chapter - 1]?.title ?? `Chapter ${at.chapter}`;
  return at.paragraph === null ? title : `${title}, paragraph ${at.paragraph}`;
}

export function textOf(id: string): PreparedText {
  const t = exhibit.texts.find((x) => x.id === id);
  if (!t) throw new Error(`The exhibit has no text "${id}".`);
  return t;
}

/** A panel that points at a passage, and how. */
export interface Citing {
  panel: PreparedPanel;
  href: string;
}

const key = (chapter: number, paragraph: number | null) => `${chapter}.${paragraph ?? ''}`;

let index: Map<string, Map<string, Citing[]>> | null = null;

/** Panel by panel: every passage its notes and its table rows point at, each panel once per passage. */
function buildIndex(): Map<string, Map<string, Citing[]>> {
  const byText = new Map<string, Map<string, Citing[]>>();
  const add = (text: string, at: Passage | { chapter: number; paragraph: number | null }, panel: PreparedPanel) => {
    let m = byText.get(text);
    if (!m) byText.set(text, (m = new Map()));
    const k = key(at.chapter, at.paragraph);
    const list = m.get(k) ?? [];
    if (!list.some((c) => c.panel.id === panel.id)) list.push({ panel, href: panelHref(panel.room, panel.id) });
    m.set(k, list);
  };
  for (const room of exhibit.rooms) {
    for (const panel of room.panels) {
      for (const n of panel.notes) if (n.passage) add(panel.text, n.passage, panel);
      for (const row of panel.passages ?? []) for (const at of row ?? []) add(panel.text, at, panel);
    }
  }
  return byText;
}

/** The panels that point at a paragraph (or, with `paragraph` null, at the chapter as a whole), in exhibit order. */
export function citingPanels(text: string, chapter: number, paragraph: number | null): Citing[] {
  index ??= buildIndex();
  return index.get(text)?.get(key(chapter, paragraph)) ?? [];
}
