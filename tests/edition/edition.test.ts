import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { htmlToHast } from 'satteri';
import { buildTextModel } from '../../pipeline/text/build.ts';
import { tokenise } from '../../pipeline/text/tokens.ts';
import { buildEdition, paragraphAt, passageOfSegment, passageOfToken } from '../../pipeline/edition/edition.ts';
import { indentOf, inlines, ordinaryIndent, plainText, setParagraph } from '../../pipeline/edition/typography.ts';
import type { Inline } from '../../pipeline/edition/typography.ts';
import { escapeHtml, linesOf, paragraphHtml } from '../../pipeline/edition/html.ts';
import { equalSegments } from '../../pipeline/stats/windows.ts';

const fixture = (name: string) => readFileSync(new URL(`../fixtures/${name}`, import.meta.url), 'utf8');
const ledger = buildTextModel(fixture('edition/the-salt-ledger.txt'), { id: 'ledger' });
const lamps = buildTextModel(fixture('../../content/texts/the-lamps-of-wendle-staithe.txt'), { id: 'lamps', start: 'BEGIN TEXT', end: 'END TEXT' });

/** The text of an HTML fragment as an HTML parser (satteri's, the site's own) reads it. */
function textOfHtml(html: string): string {
  const walk = (n: { type: string; value?: string; children?: unknown[] }): string =>
    n.type === 'text' ? (n.value ?? '') : (n.children ?? []).map((c) => walk(c as never)).join('');
  return walk(htmlToHast(html, { fragment: true }) as never);
}

const words = (s: string) => tokenise(s).map((t) => s.slice(t.start, t.end));
const measure = { wrap: 72, firstIndent: 0, indent: 0 };

describe('typography: the conventions of plain-text e-texts read back (common practice, no source)', () => {
  it('reads _underscores_ as italics, and leaves a lone or word-inner underscore alone', () => {
    expect(inlines('the _Margery Vane_, forty feet', true)).toEqual([
      { t: 'text', v: 'the ' },
      { t: 'i', c: [{ t: 'text', v: 'Margery Vane' }] },
      { t: 'text', v: ', forty feet' },
    ]);
    expect(inlines('snake_case and a _ alone', true)).toEqual([{ t: 'text', v: 'snake_case and a _ alone' }]);
    expect(inlines('an _open one never closed', true)).toEqual([{ t: 'text', v: 'an _open one never closed' }]);
    expect(inlines('(_sic_)', true)).toEqual([{ t: 'text', v: '(' }, { t: 'i', c: [{ t: 'text', v: 'sic' }] }, { t: 'text', v: ')' }]);
  });

  it('sets words of two or more capitals in small capitals, in runs, but not a lone capital or an all-capitals paragraph', () => {
    expect(inlines('a board said KEEP THE DOOR SHUT in letters', true)).toEqual([
      { t: 'text', v: 'a board said ' },
      { t: 'sc', v: 'KEEP THE DOOR SHUT' },
      { t: 'text', v: ' in letters' },
    ]);
    expect(inlines('I said A word', true)).toEqual([{ t: 'text', v: 'I said A word' }]);
    expect(inlines('McDONALD’S boat', true)).toEqual([{ t: 'text', v: 'McDONALD’S boat' }]);
    expect(setParagraph(['HERE LIES A BOATWRIGHT'], measure).content).toEqual([{ t: 'text', v: 'HERE LIES A BOATWRIGHT' }]);
  });

  it('joins wrapped lines, keeps a break after a short line or before a deeper one', () => {
    const p = setParagraph(['Dear Hobb,', 'I write to say that the timber you ordered from the upper yard is', 'cut and seasoned, and will come down on the Thursday tide.', '                    P. Garrow.'], measure);
    expect(p.form).toBe('prose');
    expect(linesOf(p.content).map((l) => [l.indent, plainText(l.runs)])).toEqual([
      [0, 'Dear Hobb,'],
      [0, 'I write to say that the timber you ordered from the upper yard is cut and seasoned, and will come down on the Thursday tide.'],
      [20, 'P. Garrow.'],
    ]);
  });

  it('keeps the lines of verse with their indentation, in running text or set off', () => {
    const song = setParagraph(['    Tar in the seam and oak in the frame,', '      Pitch for the keel and a name for the name;'], measure);
    expect(song.form).toBe('verse');
    expect(linesOf(song.content).map((l) => l.indent)).toEqual([0, 2]);
    expect(setParagraph(['Your brother,', 'Jory.'], measure).form).toBe('verse');
  });

  it('sets off a block indented further than the ordinary paragraphs, and finds the ordinary indentation', () => {
    expect(ordinaryIndent([['  First line', 'second'], ['  Another', 'more', 'more'], ['    Set off', '    block']])).toEqual({ firstIndent: 2, indent: 0 });
    expect(setParagraph(['    A long line of a letter that runs almost to the wrap width of the text,', '    and goes on.'], measure).form).toBe('set-off');
    expect(setParagraph(['  An ordinary paragraph with its first line indented by two spaces', 'as the text indents them all.'], { wrap: 72, firstIndent: 2, indent: 0 }).form).toBe('prose');
    expect(indentOf('\t  x')).toBe(6);
  });

  it('reads a paragraph of ornaments as a section break', () => {
    expect(setParagraph(['* * *'], measure).form).toBe('break');
  });

  it('cuts an italic run in two where it crosses a kept line break', () => {
    const content: Inline[] = [{ t: 'i', c: [{ t: 'text', v: 'Row her' }, { t: 'br', indent: 2 }, { t: 'text', v: 'out' }] }];
    expect(linesOf(content)).toEqual([
      { indent: 0, runs: [{ t: 'i', c: [{ t: 'text', v: 'Row her' }] }] },
      { indent: 2, runs: [{ t: 'i', c: [{ t: 'text', v: 'out' }] }] },
    ]);
  });
});

describe('the reading edition of a text', () => {
  it('numbers chapters through the text and paragraphs within each chapter, as the text model counts them', () => {
    for (const model of [ledger, lamps]) {
      const e = buildEdition(model);
      expect(e.chapters.map((c) => c.paragraphs.length)).toEqual(model.chapters.map((c) => c.paragraphCount));
      for (const c of e.chapters) expect(c.paragraphs.map((p) => p.n)).toEqual(c.paragraphs.map((_, k) => k + 1));
    }
  });

  it('never changes a word: each paragraph as shown holds exactly the words the model counted in it', () => {
    for (const model of [ledger, lamps]) {
      const e = buildEdition(model);
      for (const c of e.chapters) {
        for (const p of c.paragraphs) {
          const counted: string[] = [];
          for (let t = p.token; t < p.token + p.tokens; t++) counted.push(model.text.slice(model.tokens.start[t], model.tokens.end[t]));
          // Read back through an HTML parser, as a browser would.
          expect(words(textOfHtml(paragraphHtml(p)))).toEqual(counted);
        }
      }
    }
  });

  it('reads the typography of the invented test text', () => {
    const [ch1] = buildEdition(ledger).chapters;
    const forms = ch1!.paragraphs.map((p) => p.form);
    expect(forms).toEqual(['prose', 'prose', 'set-off', 'prose', 'break', 'prose', 'verse']);
    expect(paragraphHtml(ch1!.paragraphs[0]!)).toContain('the <i>Margery Vane</i>, forty feet');
    expect(paragraphHtml(ch1!.paragraphs[1]!)).toContain('<span class="sc">KEEP THE DOOR SHUT</span>');
    const letter = linesOf(ch1!.paragraphs[2]!.content).map((l) => plainText(l.runs));
    expect(letter[0]).toBe('Dear Hobb,');
    expect(letter.slice(-2)).toEqual(['Your servant,', 'P. Garrow.']);
    expect(paragraphHtml(ch1!.paragraphs[6]!)).toMatch(/^<span class="line">Tar in the seam and oak in the frame,<\/span><span class="line indent-1">Pitch/);
  });

  it('sets the painted notice of the demo tale in small capitals and escapes everything else', () => {
    const e = buildEdition(lamps);
    const notice = e.chapters[1]!.paragraphs.find((p) => plainText(p.content).startsWith('“NOTICE.'))!;
    expect(paragraphHtml(notice)).toContain('“<span class="sc">NOTICE</span>. The Sluice Gates at Hollin Weir will be kept <span class="sc">CLOSED</span> from');
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;');
    expect(paragraphHtml({ form: 'prose', content: [{ t: 'text', v: '<script>' }] })).toBe('&lt;script&gt;');
  });

  it('finds the paragraph of any word, and of the start of an equal segment', () => {
    const e = buildEdition(lamps);
    for (const t of [0, 1, 500, 3000, lamps.tokens.count - 1]) {
      const at = passageOfToken(e, t)!;
      const ch = lamps.chapters[at.chapter - 1]!;
      expect(lamps.tokens.paragraph[t]).toBe(ch.firstParagraph + at.paragraph - 1);
      expect(paragraphAt(e, at)!.token).toBeLessThanOrEqual(t);
    }
    expect(passageOfToken(e, -1)).toBeNull();
    expect(passageOfToken(e, lamps.tokens.count)).toBeNull();
    const [start] = equalSegments(lamps.tokens.count, 40)[29]!;
    const seg = passageOfSegment(e, 30, 40)!;
    expect(lamps.tokens.paragraph[start]).toBe(lamps.chapters[seg.chapter - 1]!.firstParagraph + seg.paragraph - 1);
    expect(passageOfSegment(e, 41, 40)).toBeNull();
  });
});
