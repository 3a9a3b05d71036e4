/**
 * Panel cross-references: the text a panel reads, its measure and chart
 * against the registry, their params/options against the registry's schemas,
 * and characters named in notes against the cast.
 */
import type { z } from 'zod';
import { foldMisspeltKeys, wordIssues } from './issues.ts';
import type { UnknownKeyWording, WordedIssue } from './issues.ts';
import { asList, asRecord, asText, idsOf, panelsOf } from './raw.ts';
import type { RawRecord, Reporter } from './raw.ts';
import type { Registry } from './registry.ts';
import { registryNames } from './registry.ts';
import { allowedKeys, dropsUnknownKeys, schemaAt } from './schema-walk.ts';
import type { PathSegment } from './source.ts';
import { suggestionHint } from './suggest.ts';
import { wording } from '../problems/problem.ts';

/** Parsed params and options of each panel, keyed by `${room}/${panel}` indices. */
export interface PanelSettings {
  params: Map<string, unknown>;
  options: Map<string, unknown>;
}

export function panelKey(room: number, panel: number): string {
  return `${room}/${panel}`;
}

function quoted(names: readonly string[]): string {
  return names.map((n) => `"${n}"`).join(', ');
}

interface Settings {
  schema: z.ZodType;
  value: unknown;
  path: PathSegment[];
  unknownKey: UnknownKeyWording;
}

/**
 * Checks a measure's params or a chart's options against its schema, with
 * the plan's wording: unknown keys with the nearest allowed name, wrong values
 * with the expected type and the field's documented default. Paths are
 * relative to the settings. `output` is set when they are valid.
 */
export function checkSettingsValue(
  schema: z.ZodType,
  value: unknown,
  unknownKey: UnknownKeyWording,
): { worded: WordedIssue[]; output?: unknown } {
  const given = value === undefined ? {} : value;
  // Not a mapping: the plan schema already says so.
  if (asRecord(given) === undefined) return { worded: [] };
  const worded: WordedIssue[] = [];
  if (dropsUnknownKeys(schema)) {
    const allowed = allowedKeys(schema) ?? [];
    for (const key of Object.keys(given as object)) {
      if (allowed.includes(key)) continue;
      worded.push({ path: [key], key, wording: unknownKey.word(key, suggestionHint(key, allowed, unknownKey.plural)) });
    }
  }
  const parsed = schema.safeParse(given);
  if (!parsed.success) {
    const all = [...worded, ...wordIssues(parsed.error.issues, schema, given, unknownKey)];
    return { worded: foldMisspeltKeys(all, (parent) => allowedKeys(schemaAt(schema, parent)) ?? []) };
  }
  return worded.length === 0 ? { worded, output: parsed.data } : { worded };
}

/** Validates params or options; returns the parsed output when they are valid. */
function checkSettings(s: Settings, r: Reporter): { ok: boolean; output?: unknown } {
  const done = checkSettingsValue(s.schema, s.value, s.unknownKey);
  for (const { path, key, wording } of done.worded) {
    if (key !== undefined) r.reportKey([...s.path, ...path.slice(0, -1)], key, wording);
    else r.report([...s.path, ...path], wording);
  }
  return 'output' in done ? { ok: true, output: done.output } : { ok: false };
}

export function checkPanels(plan: RawRecord, registry: Registry, r: Reporter): PanelSettings {
  const settings: PanelSettings = { params: new Map(), options: new Map() };
  const textIds = idsOf(plan.texts).map((t) => t.id);
  const castIds = idsOf(plan.cast).map((c) => c.id);
  const hasCast = asList(plan.cast).length > 0;
  const measureNames = registryNames(registry.measures);
  const chartNames = registryNames(registry.charts);
  const castHint = (id: string) => (hasCast ? suggestionHint(id, castIds, 'cast ids') : 'the plan has no cast; add a "cast:" list naming the characters');

  for (const { panel, room, index, path } of panelsOf(plan)) {
    const key = panelKey(room, index);

    // The text the panel reads.
    const text = panel.text;
    if (text === undefined) {
      if (textIds.length > 1) {
        r.report([...path, 'text'], wording('plan/missing-text', { ids: quoted(textIds) }));
      }
    } else if (asText(text) !== undefined && !textIds.includes(text as string)) {
      r.report([...path, 'text'], wording('plan/unknown-text', { text: text as string, hint: suggestionHint(text as string, textIds, 'text ids') }));
    }

    // The measure and its params.
    const measureName = asText(panel.measure);
    const measure = measureName !== undefined && Object.hasOwn(registry.measures, measureName) ? registry.measures[measureName] : undefined;
    if (measureName !== undefined && measure === undefined) {
      r.report([...path, 'measure'], wording('plan/unknown-measure', { measure: measureName, hint: suggestionHint(measureName, measureNames, 'measures') }));
    }
    if (measure !== undefined && measure.needsCast && !hasCast) {
      r.report([...path, 'measure'], wording('plan/needs-cast', { measure: measureName! }));
    }
    if (measure !== undefined) {
      const done = checkSettings(
        {
          schema: measure.params,
          value: panel.params,
          path: [...path, 'params'],
          unknownKey: {
            word: (key, hint) => wording('plan/unknown-param', { key, measure: measureName!, hint }),
            plural: `parameters of "${measureName}"`,
          },
        },
        r,
      );
      if (done.ok) settings.params.set(key, done.output);
    }

    // The chart and its options.
    const chartName = asText(panel.chart);
    const chart = chartName !== undefined && Object.hasOwn(registry.charts, chartName) ? registry.charts[chartName] : undefined;
    if (chartName !== undefined && chart === undefined) {
      const supported = measure?.charts ?? [];
      const near = suggestionHint(chartName, supported, 'charts');
      r.report(
        [...path, 'chart'],
        wording('plan/unknown-chart', {
          chart: chartName,
          hint: near.startsWith('did you mean')
            ? near
            : measure !== undefined
              ? `"${measureName}" can be drawn as: ${quoted(supported)}`
              : suggestionHint(chartName, chartNames, 'charts'),
        }),
      );
    } else if (chartName !== undefined && measure !== undefined && !measure.charts.includes(chartName)) {
      r.report([...path, 'chart'], wording('plan/chart-not-supported', { measure: measureName!, chart: chartName, charts: quoted(measure.charts) }));
    }
    if (chart !== undefined) {
      const done = checkSettings(
        {
          schema: chart.options,
          value: panel.options,
          path: [...path, 'options'],
          unknownKey: {
            word: (key, hint) => wording('plan/unknown-option', { key, chart: chartName!, hint }),
            plural: `options of "${chartName}"`,
          },
        },
        r,
      );
      if (done.ok) settings.options.set(key, done.output);
    }

    // Characters named by notes.
    asList(panel.notes).forEach((note, n) => {
      const character = asText(asRecord(asRecord(note)?.at)?.character);
      if (character === undefined || castIds.includes(character)) return;
      r.report([...path, 'notes', n, 'at', 'character'], wording('plan/unknown-cast', { id: character, hint: castHint(character) }));
    });
  }
  // Speakers and addressees named by dialogue pins, and the narrator.
  asList(plan.texts).forEach((t, ti) => {
    const narrator = asText(asRecord(asRecord(t)?.dialogue)?.narrator);
    if (narrator !== undefined && !castIds.includes(narrator)) {
      r.report(['texts', ti, 'dialogue', 'narrator'], {
        code: 'plan/unknown-cast',
        message: `unknown cast member "${narrator}"`,
        hint: hasCast ? suggestionHint(narrator, castIds, 'cast ids') : 'the plan has no cast; add a "cast:" list naming the characters',
      });
    }
    asList(asRecord(asRecord(t)?.dialogue)?.pins).forEach((pin, pi) => {
      for (const key of ['speaker', 'addressee']) {
        const id = asText(asRecord(pin)?.[key]);
        if (id === undefined || castIds.includes(id)) continue;
        r.report(['texts', ti, 'dialogue', 'pins', pi, key], wording('plan/unknown-cast', { id, hint: castHint(id) }));
      }
    });
  });
  return settings;
}
