/**
 * A small, strict XML well-formedness check for the SVG the charts write:
 * one root element, properly nested and closed tags, quoted attributes
 * without "<", no duplicate attributes, and only the five predefined or
 * numeric entity references. Returns the problems found (empty when well formed).
 * Source: Extensible Markup Language (XML) 1.0, 5th ed., W3C 2008 — §2.1
 * (well-formed documents), §3.1 (start tags, end tags, attributes; WFC
 * "Unique Att Spec", "No < in Attribute Values"), §4.1/§4.6 (references and
 * predefined entities).
 */

const NAME = /^[A-Za-z_][A-Za-z0-9_.:-]*/;
const REF = /^&(?:amp|lt|gt|quot|apos|#[0-9]+|#x[0-9A-Fa-f]+);/;

function checkRefs(s: string, where: string, problems: string[]): void {
  for (let i = s.indexOf('&'); i !== -1; i = s.indexOf('&', i + 1)) {
    if (!REF.test(s.slice(i))) problems.push(`bad entity reference in ${where}: ${JSON.stringify(s.slice(i, i + 12))}`);
  }
}

export function wellFormednessProblems(xml: string): string[] {
  const problems: string[] = [];
  const stack: string[] = [];
  let roots = 0;
  let i = 0;
  while (i < xml.length) {
    if (xml[i] !== '<') {
      const next = xml.indexOf('<', i);
      const text = xml.slice(i, next === -1 ? xml.length : next);
      if (stack.length === 0 && text.trim() !== '') problems.push(`text outside the root element: ${JSON.stringify(text.slice(0, 20))}`);
      checkRefs(text, 'text', problems);
      i = next === -1 ? xml.length : next;
      continue;
    }
    if (xml.startsWith('<!--', i)) {
      const end = xml.indexOf('-->', i + 4);
      if (end === -1) return [...problems, 'unclosed comment'];
      i = end + 3;
      continue;
    }
    if (xml.startsWith('<?', i)) {
      const end = xml.indexOf('?>', i + 2);
      if (end === -1) return [...problems, 'unclosed processing instruction'];
      i = end + 2;
      continue;
    }
    if (xml.startsWith('</', i)) {
      const m = NAME.exec(xml.slice(i + 2));
      const name = m?.[0] ?? '';
      const close = i + 2 + name.length;
      if (!m || xml[close] !== '>') return [...problems, `malformed end tag at ${i}`];
      const open = stack.pop();
      if (open !== name) return [...problems, `end tag </${name}> does not match <${open ?? 'nothing'}>`];
      i = close + 1;
      continue;
    }
    const m = NAME.exec(xml.slice(i + 1));
    if (!m) return [...problems, `"<" not starting a tag at ${i}`];
    const name = m[0];
    let j = i + 1 + name.length;
    const seen = new Set<string>();
    let selfClosing = false;
    for (;;) {
      const ws = /^\s*/.exec(xml.slice(j))![0].length;
      j += ws;
      if (xml.startsWith('/>', j)) {
        selfClosing = true;
        j += 2;
        break;
      }
      if (xml[j] === '>') {
        j += 1;
        break;
      }
      if (ws === 0) return [...problems, `missing space before attribute in <${name}> at ${j}`];
      const a = NAME.exec(xml.slice(j));
      if (!a) return [...problems, `malformed attribute in <${name}> at ${j}`];
      if (seen.has(a[0])) problems.push(`duplicate attribute ${a[0]} in <${name}>`);
      seen.add(a[0]);
      j += a[0].length;
      if (xml[j] !== '=') return [...problems, `attribute ${a[0]} without a value in <${name}>`];
      const q = xml[j + 1];
      if (q !== '"' && q !== "'") return [...problems, `unquoted attribute ${a[0]} in <${name}>`];
      const end = xml.indexOf(q, j + 2);
      if (end === -1) return [...problems, `unclosed attribute ${a[0]} in <${name}>`];
      const value = xml.slice(j + 2, end);
      if (value.includes('<')) problems.push(`"<" inside attribute ${a[0]} of <${name}>`);
      checkRefs(value, `attribute ${a[0]}`, problems);
      j = end + 1;
    }
    if (stack.length === 0) roots++;
    if (!selfClosing) stack.push(name);
    i = j;
  }
  if (stack.length) problems.push(`unclosed elements: ${stack.join(' > ')}`);
  if (roots !== 1) problems.push(`expected one root element, found ${roots}`);
  return problems;
}
