/**
 * Building the resolved plan from a plan that passed every check: files made
 * absolute, panels given their room, text, params and options, and every
 * entry its place in the YAML.
 */
import type { PanelSettings } from './check-panels.ts';
import { panelKey } from './check-panels.ts';
import type { PlanData } from './schema.ts';
import type { PathSegment, PlanSource } from './source.ts';
import { formatPath } from './source.ts';
import type { Plan, PlanFile, PlanPanel, PlanRoom, Where } from './types.ts';

export interface ResolveInput {
  data: PlanData;
  source: PlanSource;
  /** The plan file as shown to the user. */
  shownFile: string;
  /** Absolute plan file and exhibit folder. */
  file: string;
  dir: string;
  /** Absolute path of each checked file, keyed by its formatted plan path. */
  files: Map<string, string>;
  settings: PanelSettings;
}

function missing(what: string): Error {
  return new Error(`plan resolution reached an unchecked ${what}; the checks should have reported it`);
}

export function resolvePlan(input: ResolveInput): Plan {
  const { data, source, files, settings } = input;

  const where = (path: PathSegment[]): Where => {
    const pos = source.at(path);
    return { file: input.shownFile, line: pos.line, column: pos.column, path: formatPath(path) };
  };
  const file = (path: PathSegment[], written: string): PlanFile => {
    const absolute = files.get(formatPath(path));
    if (absolute === undefined) throw missing(`file at ${formatPath(path)}`);
    return { written, absolute };
  };
  const optionalFile = (path: PathSegment[], written: string | undefined): PlanFile | undefined =>
    written === undefined ? undefined : file(path, written);
  const onlyText = data.texts.length === 1 ? data.texts[0].id : undefined;

  const rooms: PlanRoom[] = data.rooms.map((room, r) => {
    const panels: PlanPanel[] = room.panels.map((panel, p) => {
      const path: PathSegment[] = ['rooms', r, 'panels', p];
      const key = panelKey(r, p);
      const text = panel.text ?? onlyText;
      if (text === undefined) throw missing(`text of ${formatPath(path)}`);
      if (!settings.params.has(key) || !settings.options.has(key)) throw missing(`params or options of ${formatPath(path)}`);
      return {
        id: panel.id,
        room: room.id,
        title: panel.title,
        text,
        measure: panel.measure,
        params: settings.params.get(key),
        chart: panel.chart,
        options: settings.options.get(key),
        caption: file([...path, 'caption'], panel.caption),
        ...(panel.alt !== undefined ? { alt: panel.alt } : {}),
        notes: panel.notes.map((note, n) => ({ at: note.at, text: note.text, where: where([...path, 'notes', n]) })),
        where: where(path),
      };
    });
    return {
      id: room.id,
      title: room.title,
      ...(room.intro !== undefined ? { intro: file(['rooms', r, 'intro'], room.intro) } : {}),
      panels,
      where: where(['rooms', r]),
    };
  });

  const { intro, rights, ...exhibit } = data.exhibit;
  const introFile = optionalFile(['exhibit', 'intro'], intro);
  const rightsFile = optionalFile(['exhibit', 'rights'], rights);

  return {
    version: 1,
    file: input.file,
    dir: input.dir,
    exhibit: {
      ...exhibit,
      ...(introFile ? { intro: introFile } : {}),
      ...(rightsFile ? { rights: rightsFile } : {}),
      where: { ...where(['exhibit']), ...source.keyAt([], 'exhibit') },
    },
    texts: data.texts.map((text, t) => ({ ...text, source: file(['texts', t, 'source'], text.source), where: where(['texts', t]) })),
    cast: data.cast.map((member, c) => ({
      ...member,
      where: where(['cast', c]),
      nameWhere: where(['cast', c, 'name']),
      aliasWhere: member.aliases.map((_, k) => where(['cast', c, 'aliases', k])),
    })),
    lexicons: data.lexicons.map((lex, l) => ({ ...lex, file: file(['lexicons', l, 'file'], lex.file), where: where(['lexicons', l]) })),
    rooms,
    panels: rooms.flatMap((room) => room.panels),
  };
}
