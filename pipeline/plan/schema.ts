/**
 * The exhibit plan, schema version 1: the single source of truth for what a
 * curator may write in `exhibit.yaml`. Every field carries a description with
 * its default; the loader quotes these descriptions in its hints.
 *
 * Custom checks put their advice in `params.hint`, which the loader shows
 * after the message.
 */
import { z } from 'zod';
import { BASE_HINT } from '../problems/catalogue.ts';

/** Pattern every id follows: lower-case letters, digits and hyphens, not starting with a hyphen. */
export const ID_PATTERN = /^[a-z0-9][a-z0-9-]*$/;

/** Room ids the site uses for its own pages. */
export const RESERVED_ROOM_IDS: readonly string[] = ['methods', 'about', 'data', 'slides', 'cards', '_astro', 'texts', 'glossary'];

/** Schema version this loader reads. */
export const PLAN_VERSION = 1;

/** An id: `[a-z0-9][a-z0-9-]*`. */
export const idSchema = z.string().refine((s) => ID_PATTERN.test(s), {
  error: (issue) => {
    const input = String(issue.input);
    const shown = JSON.stringify(input.length > 40 ? `${input.slice(0, 37)}…` : input);
    const hidden = /[\u200B-\u200F\u202A-\u202E\u2060-\u2069\uFEFF]/u.exec(input);
    return hidden
      ? `${shown} is not a valid id: it holds the invisible character U+${hidden[0].codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`
      : `${shown} is not a valid id`;
  },
  params: {
    hint: 'ids use lower-case letters, digits and hyphens, and start with a letter or digit (e.g. "chapter-lengths")',
  },
});

/**
 * Longest values the plan accepts, in characters. Each is far above any
 * sensible value; they are there so that a pasted file or a runaway
 * value is refused with a message rather than copied onto every page (a 5 MB
 * title once made a 224 MB site). Common practice, no source.
 */
export const LIMITS = {
  /** Exhibit, room and panel titles; the organiser. */
  title: 200,
  /** Subtitles, credit lines, editions, licences, note texts, alt texts. */
  prose: 2000,
  /** Cast names and aliases, speech verbs. */
  name: 200,
  /** Trim markers, first words of a pinned quotation, chapter patterns. */
  marker: 500,
  /** File paths. */
  path: 500,
} as const;

/** Invisible characters that change the direction text is shown in: embeddings, overrides and isolates. */
export const BIDI_CONTROLS = /[\u202A-\u202E\u2066-\u2069]/u;

/** Required text: not empty, not only white space, at most `max` characters. */
function text(max: number) {
  return z
    .string()
    .min(1)
    .max(max)
    .refine((s) => s === '' || s.trim() !== '', {
      error: 'the value is only white space',
      params: { code: 'plan/blank', hint: 'write a value, or remove it' },
    });
}

const SITE_ADDRESS_HINT = 'write the address readers will open, with http:// or https://, e.g. "https://example.org/lamps/"';

/** Why a string cannot be the exhibit's public address (an absolute http or https URL of a page), or null. */
export function siteAddressProblem(s: string): string | null {
  if (/[\s"'<>`\\]|[\u0000-\u001f\u007f]/u.test(s) || BIDI_CONTROLS.test(s)) {
    return `the address ${JSON.stringify(s)} holds a character that has no place in a web address (a space, a quotation mark, a backslash or an invisible character)`;
  }
  let url: URL;
  try {
    url = new URL(s);
  } catch {
    return `${JSON.stringify(s)} is not an absolute web address`;
  }
  if (url.protocol !== 'https:' && url.protocol !== 'http:') return `the address ${JSON.stringify(s)} must start with https:// or http://`;
  if (url.username || url.password) return `the address ${JSON.stringify(s)} must not carry a user name or password`;
  if (url.search || url.hash || s.includes('?') || s.includes('#')) return `the address ${JSON.stringify(s)} must not carry a query ("?") or a fragment ("#")`;
  return null;
}

/** A path to a file inside the exhibit folder, as the curator wrote it. */
const filePath = text(LIMITS.path);

/**
 * Why a base path cannot be used, or undefined when it can. The base must be
 * a path on the site's own host: "//host/" and "http://…" would send every
 * stylesheet and link off-site.
 */
export function basePathProblem(base: string): { message: string; hint: string } | undefined {
  const hint = BASE_HINT;
  const shown = JSON.stringify(base.length > 60 ? `${base.slice(0, 57)}…` : base);
  if (/^[a-z][a-z0-9+.-]*:/i.test(base)) return { message: `the base path ${shown} is a web address, not a path`, hint };
  if (base.startsWith('//') || base.startsWith('\\')) return { message: `the base path ${shown} names another host (it starts with "//"), so every page would load its stylesheets from there`, hint };
  if (!base.startsWith('/') || !base.endsWith('/')) return { message: `the base path ${shown} must start and end with "/"`, hint };
  if (/[\\?#\s"'<>`]|[\u0000-\u001f\u007f]/u.test(base) || BIDI_CONTROLS.test(base)) {
    return { message: `the base path ${shown} holds a character that has no place in a path (a space, a backslash, "?", "#", a quotation mark or an invisible character)`, hint };
  }
  if (base.split('/').some((seg) => seg === '.' || seg === '..')) return { message: `the base path ${shown} holds a "." or ".." step`, hint };
  return undefined;
}

function compiles(pattern: string): string | undefined {
  try {
    new RegExp(pattern, 'i');
    return undefined;
  } catch (e) {
    return e instanceof Error ? e.message : String(e);
  }
}

export const exhibitSchema = z
  .strictObject({
    title: text(LIMITS.title).describe(`Title of the exhibit, at most ${LIMITS.title} characters. Required.`),
    subtitle: text(LIMITS.prose).optional().describe(`Subtitle shown under the title, at most ${LIMITS.prose} characters. Optional, no default.`),
    organiser: text(LIMITS.title).describe(`Who puts the exhibit on (a person, circle or society), at most ${LIMITS.title} characters. Required.`),
    language: z
      .string()
      .regex(/^[a-z]{2}$/, { error: 'the language must be a two-letter ISO 639-1 code in lower case, e.g. "en"' })
      .default('en')
      .describe('ISO 639-1 code of the language of the texts. Default "en".'),
    base: z
      .string()
      .max(LIMITS.path)
      .superRefine((base, ctx) => {
        const wrong = basePathProblem(base);
        if (wrong) ctx.addIssue({ code: 'custom', message: wrong.message, params: { code: 'plan/bad-base', hint: wrong.hint } });
      })
      .default('/')
      .describe('Base path the site is served under: a path on the host that serves it, starting and ending with "/" (not a web address). Default "/".'),
    url: z
      .string()
      .max(LIMITS.path)
      .superRefine((s, ctx) => {
        const problem = siteAddressProblem(s);
        if (problem) ctx.addIssue({ code: 'custom', message: problem, params: { code: 'plan/bad-url', hint: SITE_ADDRESS_HINT } });
      })
      .optional()
      .describe(
        'The public address of the exhibit\'s home page once it is published, an absolute http or https URL such as "https://example.org/lamps/". Link previews (Open Graph and Twitter card tags), the social cards and the credit line of chart downloads need it to give absolute addresses. Optional, no default: without it pages carry no picture or address in their link previews, and check warns.',
      ),
    credit: text(LIMITS.prose).optional().describe(`Credit line shown in the footer, at most ${LIMITS.prose} characters. Optional, no default.`),
    intro: filePath.optional().describe('MDX file shown on the home page, relative to the exhibit folder. Optional, no default.'),
    rights: filePath
      .optional()
      .describe("MDX file with the curator's statement on the text's copyright status, relative to the exhibit folder. Optional, no default."),
  })
  .describe('The exhibit as a whole. Required.');

export const pinSchema = z
  .strictObject({
    chapter: z.number().int().positive().describe('Chapter of the quotation, 1-based. Required.'),
    startsWith: text(LIMITS.marker).describe(`The first words of the quotation, as printed (without the opening mark), at most ${LIMITS.marker} characters. Required.`),
    speaker: idSchema.nullable().describe('Cast id of who speaks, or null for nobody in the cast. Required.'),
    addressee: idSchema.nullable().optional().describe('Cast id of who is spoken to, or null. Optional, no default (found by the rules).'),
  })
  .describe("A curator's correction: who speaks one quotation.");

const MARKS_NAMES = ['auto', 'double', 'single', 'guillemets', 'low', 'dash'] as const;
const MARKS_HELP =
  'double (“…” or "…"), single (‘…’ or \'…\'), guillemets («…» or »…«), low („…“), dash (a paragraph opening with — or –), or auto (read from the text)';

export const marksNameSchema = z.enum(MARKS_NAMES).describe(`How speech is set off: ${MARKS_HELP}.`);

export const marksSchema = z
  .union([
    marksNameSchema,
    z.strictObject({
      default: marksNameSchema.default('auto').describe(`The marks for every chapter not listed: ${MARKS_HELP}. Default "auto".`),
      chapters: z
        .record(z.string().regex(/^[1-9][0-9]*$/, { error: 'a chapter is named by its number, 1-based (e.g. 3:)' }), marksNameSchema)
        .default({})
        .describe('Chapters (by number, 1-based) set in other marks, e.g. { 3: single, 7: dash }. Default {} (none).'),
    }),
  ])
  .default('auto')
  .describe(
    `The marks that set off speech in this text: one name for the whole text, or "default:" and "chapters:" for chapters that differ. Names: ${MARKS_HELP}. Default "auto": read from the text, chapter by chapter and scene by scene.`,
  );

export const dialogueSchema = z
  .strictObject({
    verbs: z
      .array(text(LIMITS.name))
      .default([])
      .describe('Speech verbs to add to the built-in list (said, asked, cried, …), in their -ed or present form as printed. Default [] (none).'),
    pins: z.array(pinSchema).default([]).describe("Curator's corrections of speakers. Default [] (none)."),
    marks: marksSchema,
    narrator: idSchema
      .optional()
      .describe('Cast id of the narrator when the text is told in the first person: "I said" in the narrative is theirs. Optional, no default (no narrator).'),
  })
  .describe('How dialogue is read in this text. Optional.');

export const lexiconSchema = z
  .strictObject({
    id: idSchema.describe('Id of the word list; measures name it in their "lexicon" parameter. Required.'),
    file: filePath.describe('A TSV or CSV file of words and categories, relative to the exhibit folder. Required.'),
    licence: text(LIMITS.prose).optional().describe(`Licence or terms of the word list, shown in the credits, at most ${LIMITS.prose} characters. Optional, no default.`),
  })
  .describe('A word list the curators supply (e.g. words and the emotions they evoke).');

export const textSchema = z
  .strictObject({
    id: idSchema.describe('Id of the text, unique among texts; panels name it in "text". Required.'),
    source: filePath.describe('The text file, relative to the exhibit folder. Required.'),
    format: z.enum(['plain']).default('plain').describe('Format of the text file; only "plain" in version 1. Default "plain".'),
    start: text(LIMITS.marker)
      .optional()
      .describe('Trim marker: everything up to and including the first line containing it is dropped. Optional, no default (nothing dropped).'),
    end: text(LIMITS.marker)
      .optional()
      .describe('Trim marker: everything from the first line containing it is dropped. Optional, no default (nothing dropped).'),
    chapters: text(LIMITS.marker)
      .superRefine((pattern, ctx) => {
        const error = compiles(pattern);
        if (error !== undefined) {
          ctx.addIssue({
            code: 'custom',
            message: `the chapter pattern is not a valid regular expression (${error})`,
            params: { hint: 'in YAML double quotes write a backslash as "\\\\", or use single quotes' },
          });
        }
      })
      .optional()
      .describe('Chapter-heading pattern: a regular expression matched per line, ignoring case. Optional, no default (headings are found by the text reader).'),
    edition: text(LIMITS.prose).optional().describe(`Note on the edition the text was taken from, at most ${LIMITS.prose} characters. Optional, no default.`),
    title: text(LIMITS.title)
      .optional()
      .describe(`The text's title as printed, for its reading edition and citations, at most ${LIMITS.title} characters. Optional, default: the text's id.`),
    author: text(LIMITS.name).optional().describe(`Who wrote the text, as the reading edition names them, at most ${LIMITS.name} characters. Optional, no default.`),
    dialogue: dialogueSchema.default({ verbs: [], pins: [], marks: 'auto' }),
  })
  .describe('A text the exhibit reads.');

export const pronounSchema = z.enum(['he', 'she', 'they', 'it']);

export const castMemberSchema = z
  .strictObject({
    id: idSchema.describe('Id of the character, unique within the cast; notes name it in "at: { character }". Required.'),
    name: text(LIMITS.name).describe(`Full name of the character as it appears in the text, at most ${LIMITS.name} characters. Required.`),
    aliases: z
      .array(text(LIMITS.name))
      .default([])
      .describe('Other names the character goes by in the text. Default [] (none).'),
    pronoun: pronounSchema.optional().describe('Pronoun of the character: he, she, they or it. Optional, no default.'),
  })
  .describe('A character of the texts.');

export const noteAnchorSchema = z
  .strictObject({
    part: z
      .number()
      .int()
      .positive()
      .optional()
      .describe('Part (BOOK, PART, VOLUME) of a two-level text, 1-based; with `chapter`, the chapter is counted within the part ({ part: 2, chapter: 3 } is the third chapter of the second part). Optional.'),
    chapter: z.number().int().positive().optional().describe('Chapter number, 1-based, counted through the whole text (or within `part` when one is given). Optional.'),
    paragraph: z
      .number()
      .int()
      .positive()
      .optional()
      .describe('Paragraph within `chapter`, 1-based, as the reading edition numbers them ({ chapter: 4, paragraph: 33 }); the note links to it. Optional.'),
    character: idSchema.optional().describe('Cast id of a character. Optional.'),
    word: text(LIMITS.name).optional().describe('A word of the text. Optional.'),
    segment: z.number().int().positive().optional().describe('Segment number, 1-based. Optional.'),
  })
  .superRefine((at, ctx) => {
    if (at.part !== undefined && at.chapter === undefined) {
      ctx.addIssue({
        code: 'custom',
        message: 'the note names a part but no chapter in it',
        params: { hint: 'add the chapter within the part, e.g. at: { part: 2, chapter: 3 }' },
      });
      return;
    }
    if (at.paragraph !== undefined && at.chapter === undefined) {
      ctx.addIssue({
        code: 'custom',
        message: 'the note names a paragraph but not its chapter',
        params: { hint: 'add the chapter the paragraph is counted in, e.g. at: { chapter: 4, paragraph: 33 }' },
      });
      return;
    }
    const given = Object.entries(at).filter(([k, v]) => v !== undefined && k !== 'part' && k !== 'paragraph').length;
    if (given !== 1) {
      ctx.addIssue({
        code: 'custom',
        message: given === 0 ? 'the note does not say what it points at' : 'the note points at more than one thing',
        params: { hint: 'give exactly one of: chapter, character, word, segment' },
      });
    }
  })
  .describe('What the note points at: exactly one of chapter (optionally within a part, or a paragraph of it), character, word, segment. Required.');

export const noteSchema = z
  .strictObject({
    at: noteAnchorSchema,
    text: text(LIMITS.prose).describe(`The note itself, at most ${LIMITS.prose} characters. Required.`),
  })
  .describe('A curator note pinned to the data.');

export const panelSchema = z
  .strictObject({
    id: idSchema.describe('Id of the panel, unique across the whole exhibit. Required.'),
    title: text(LIMITS.title).describe(`Title of the panel, usually a question, at most ${LIMITS.title} characters. Required.`),
    text: idSchema
      .optional()
      .describe('Id of the text the panel reads. Optional when the plan has exactly one text (that one is used).'),
    measure: text(LIMITS.name).describe('Name of a registered measure. Required.'),
    params: z
      .record(z.string(), z.unknown())
      .default({})
      .describe("Parameters of the measure, checked by the measure's own schema. Default {} (the measure's defaults)."),
    chart: text(LIMITS.name).describe('Chart kind the measure is drawn as; must be one the measure supports. Required.'),
    options: z
      .record(z.string(), z.unknown())
      .default({})
      .describe("Options of the chart, checked by the chart's own schema. Default {} (the chart's defaults)."),
    caption: filePath.describe('MDX (or .md) caption file, relative to the exhibit folder. Required.'),
    alt: text(LIMITS.prose).optional().describe(`Replaces the generated alt text of the chart, at most ${LIMITS.prose} characters. Optional, no default.`),
    notes: z.array(noteSchema).default([]).describe('Curator notes pinned to the data. Default [] (none).'),
  })
  .describe('A panel: one measure drawn as one chart, with its caption.');

export const roomSchema = z
  .strictObject({
    id: idSchema
      .refine((s) => !RESERVED_ROOM_IDS.includes(s), {
        error: (issue) => `the room id ${JSON.stringify(issue.input)} is reserved for the site's own pages`,
        params: { hint: `choose another id; reserved: ${RESERVED_ROOM_IDS.join(', ')}` },
      })
      .describe(`Id of the room, unique among rooms; not one of ${RESERVED_ROOM_IDS.join(', ')}. Required.`),
    title: text(LIMITS.title).describe(`Title of the room, at most ${LIMITS.title} characters. Required.`),
    intro: filePath.optional().describe('MDX file introducing the room, relative to the exhibit folder. Optional, no default.'),
    panels: z.array(panelSchema).min(1).describe('The panels of the room, in order. One or more.'),
  })
  .describe('A room: a page of panels.');

export const planSchema = z
  .strictObject({
    version: z.literal(PLAN_VERSION).describe('Schema version of the plan; must be 1. Required.'),
    exhibit: exhibitSchema,
    texts: z.array(textSchema).min(1).describe('The texts the exhibit reads. One or more.'),
    cast: z.array(castMemberSchema).default([]).describe('The characters, for measures that need them. Default [] (no cast).'),
    lexicons: z.array(lexiconSchema).default([]).describe('Word lists the curators supply. Default [] (none).'),
    rooms: z.array(roomSchema).min(1).describe('The rooms of the exhibit, in order. One or more.'),
  })
  .describe('An exhibit plan: "version: 1", then the exhibit, texts, cast (optional) and rooms sections.');

/** The plan as validated by the schema: defaults filled, paths still as written. */
export type PlanData = z.output<typeof planSchema>;
export type Pronoun = z.output<typeof pronounSchema>;
export type NoteAnchor = z.output<typeof noteAnchorSchema>;
export type DialogueData = z.output<typeof dialogueSchema>;
