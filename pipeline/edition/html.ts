/**
 * A set paragraph (./typography.ts) as HTML: italics as `<i>`, small capitals
 * as `<span class="sc">`, and, when the paragraph keeps its line breaks, each
 * line as `<span class="line">` with its indentation as a class (the pages'
 * Content-Security-Policy allows no inline styles). Every character of the
 * text is escaped; nothing of the source becomes markup but what the rules of
 * ./typography.ts read.
 */
import type { Inline, SetParagraph } from './typography.ts';

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/**
 * Indentation classes: character widths grouped into the few steps a printer would use
 * (`indent-1` about two ems' worth of characters, up to `indent-4`, set far in, as a
 * signature is). The site's stylesheet gives each its width.
 */
export function indentClass(chars: number): string | null {
  if (chars <= 0) return null;
  if (chars <= 2) return 'indent-1';
  if (chars <= 5) return 'indent-2';
  if (chars <= 11) return 'indent-3';
  return 'indent-4';
}

function runHtml(r: Inline): string {
  switch (r.t) {
    case 'text':
      return escapeHtml(r.v);
    case 'sc':
      return `<span class="sc">${escapeHtml(r.v)}</span>`;
    case 'i':
      return `<i>${r.c.map(runHtml).join('')}</i>`;
    case 'br':
      return '<br>';
  }
}

/** The runs cut into lines at each kept break (an italic run that crosses a break is cut in two), each with its indentation. */
export function linesOf(content: readonly Inline[], firstIndent = 0): { indent: number; runs: Inline[] }[] {
  const lines: { indent: number; runs: Inline[] }[] = [{ indent: firstIndent, runs: [] }];
  const push = (r: Inline) => lines[lines.length - 1]!.runs.push(r);
  const newLine = (indent = 0) => lines.push({ indent, runs: [] });
  for (const r of content) {
    if (r.t === 'br') newLine(r.indent);
    else if (r.t === 'i') {
      let inner: Inline[] = [];
      push({ t: 'i', c: inner });
      for (const x of r.c) {
        if (x.t !== 'br') {
          inner.push(x);
          continue;
        }
        newLine(x.indent);
        inner = [];
        push({ t: 'i', c: inner });
      }
    } else push(r);
  }
  // Italic runs emptied by a break at their edge say nothing.
  for (const l of lines) l.runs = l.runs.filter((r) => !(r.t === 'i' && r.c.length === 0));
  return lines;
}

/** The inside of the paragraph's `<p>`: its runs, and its lines as blocks when it keeps line breaks. */
export function paragraphHtml(p: SetParagraph): string {
  const lines = linesOf(p.content, p.indent ?? 0);
  if (lines.length === 1 && !lines[0]!.indent) return lines[0]!.runs.map(runHtml).join('');
  return lines
    .map((l) => {
      const indent = indentClass(l.indent);
      return `<span class="${indent ? `line ${indent}` : 'line'}">${l.runs.map(runHtml).join('')}</span>`;
    })
    .join('');
}
