/**
 * The resolved plan turned into the work the pipeline does: which texts to
 * read with which options, and which panels to measure and draw.
 */
import { relative } from 'node:path';
import type { Plan, Where } from '../plan/types.ts';
import type { CastMember, TextOptions } from '../text/model.ts';
import type { DialogueSettings } from '../measures/types.ts';

export type { Where };

export interface TextJob {
  id: string;
  /** Absolute path. */
  file: string;
  /** As written in the plan. */
  source: string;
  /** As shown in messages: relative to the working directory. */
  display: string;
  options: TextOptions;
  edition: string | null;
  /** The text's title as printed (the plan's, else its id) and its author, for the reading edition. */
  title: string;
  author: string | null;
  dialogue: DialogueSettings;
  where: Where;
}

export interface LexiconJob {
  id: string;
  /** Absolute path. */
  file: string;
  display: string;
  licence: string | null;
  where: Where;
}

export interface PanelJob {
  id: string;
  room: string;
  title: string;
  text: string;
  measure: string;
  params: Record<string, unknown>;
  chart: string;
  options: Record<string, unknown>;
  /** Caption file as written (relative to the exhibit folder, normalised). */
  caption: string;
  alt: string | null;
  notes: { at: { part?: number; chapter?: number; paragraph?: number; character?: string; word?: string; segment?: number }; text: string; where: Where }[];
  where: Where;
  measureWhere: Where;
}

export interface ExhibitJobs {
  exhibit: {
    title: string;
    subtitle: string | null;
    organiser: string;
    language: string;
    base: string;
    /** The public address of the home page, ending in "/"; null when the plan gives none. */
    url: string | null;
    credit: string | null;
    intro: string | null;
    rights: string | null;
  };
  texts: TextJob[];
  cast: CastMember[];
  /** Per cast member: where its name and each alias are written in the plan. */
  castPlaces: { name: Where; aliases: Where[] }[];
  lexicons: LexiconJob[];
  rooms: { id: string; title: string; intro: string | null; panels: PanelJob[] }[];
}

export function planJobs(plan: Plan, cwd = process.cwd()): ExhibitJobs {
  const rel = (abs: string) => relative(plan.dir, abs).split('\\').join('/');
  return {
    exhibit: {
      title: plan.exhibit.title,
      subtitle: plan.exhibit.subtitle ?? null,
      organiser: plan.exhibit.organiser,
      language: plan.exhibit.language,
      base: plan.exhibit.base,
      url: plan.exhibit.url ? siteAddress(plan.exhibit.url) : null,
      credit: plan.exhibit.credit ?? null,
      intro: plan.exhibit.intro ? rel(plan.exhibit.intro.absolute) : null,
      rights: plan.exhibit.rights ? rel(plan.exhibit.rights.absolute) : null,
    },
    texts: plan.texts.map((t) => ({
      id: t.id,
      file: t.source.absolute,
      source: rel(t.source.absolute),
      display: relative(cwd, t.source.absolute) || t.source.absolute,
      options: {
        id: t.id,
        ...(t.start !== undefined ? { start: t.start } : {}),
        ...(t.end !== undefined ? { end: t.end } : {}),
        ...(t.chapters !== undefined ? { chapterPattern: t.chapters } : {}),
      },
      edition: t.edition ?? null,
      title: t.title ?? t.id,
      author: t.author ?? null,
      dialogue: {
        verbs: t.dialogue.verbs,
        pins: t.dialogue.pins.map((p) => ({
          chapter: p.chapter,
          startsWith: p.startsWith,
          speaker: p.speaker,
          ...(p.addressee !== undefined ? { addressee: p.addressee } : {}),
        })),
        ...(t.dialogue.marks !== 'auto' ? { marks: t.dialogue.marks } : {}),
        ...(t.dialogue.narrator !== undefined ? { narrator: t.dialogue.narrator } : {}),
      },
      where: t.where,
    })),
    lexicons: plan.lexicons.map((l) => ({
      id: l.id,
      file: l.file.absolute,
      display: relative(cwd, l.file.absolute) || l.file.absolute,
      licence: l.licence ?? null,
      where: l.where,
    })),
    cast: plan.cast.map((c) => ({ id: c.id, name: c.name, aliases: c.aliases, ...(c.pronoun ? { pronoun: c.pronoun } : {}) })),
    castPlaces: plan.cast.map((c) => ({ name: c.nameWhere, aliases: c.aliasWhere })),
    rooms: plan.rooms.map((r) => ({
      id: r.id,
      title: r.title,
      intro: r.intro ? rel(r.intro.absolute) : null,
      panels: r.panels.map((p) => ({
        id: p.id,
        room: r.id,
        title: p.title,
        text: p.text,
        measure: p.measure,
        params: p.params as Record<string, unknown>,
        chart: p.chart,
        options: p.options as Record<string, unknown>,
        caption: rel(p.caption.absolute),
        alt: p.alt ?? null,
        notes: p.notes.map((n) => ({ at: n.at, text: n.text, where: n.where })),
        where: p.where,
        measureWhere: { ...p.where, path: `${p.where.path}.measure` },
      })),
    })),
  };
}

/** The home page's address as links are made from it: parsed (so the host is in lower case) and ending in "/". */
export function siteAddress(written: string): string {
  const url = new URL(written);
  if (!url.pathname.endsWith('/')) url.pathname += '/';
  return url.href;
}
