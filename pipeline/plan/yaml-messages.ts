/**
 * Plain-language wording for the YAML parser's complaints. The parser names
 * the place; these say what is wrong there and what to do about it.
 */
import type { YAMLError } from 'yaml';

/** What is wrong at the place (the catalogue's "plan/yaml-syntax" puts it after "the YAML is not well-formed here: "), and what to do. */
export interface YamlWording {
  detail: string;
  hint?: string;
}

function said(detail: string, hint?: string): YamlWording {
  return hint === undefined ? { detail } : { detail, hint };
}

/** The parser's own first line, without its "at line …" tail, for cases not worded here. */
function parserSays(error: YAMLError): string {
  const first = error.message.split('\n')[0] ?? '';
  return first.replace(/ at line \d+, column \d+:?$/, '').trim();
}

/** Words a YAML syntax error for a curator. */
export function wordYamlError(error: YAMLError): YamlWording | 'duplicate-key' {
  const raw = parserSays(error);
  switch (error.code) {
    case 'TAB_AS_INDENT':
      return said('a tab is used for indentation', 'indent with spaces');
    case 'DUPLICATE_KEY':
      return 'duplicate-key';
    case 'BAD_INDENT':
      if (/flow/i.test(raw)) {
        return said('a [ list ] or { mapping } is not closed, or its next line is not indented enough', 'close the brackets, or indent the continuation further than its key');
      }
      if (/block scalar/i.test(raw)) {
        return said('the lines of a | or > block are not indented consistently', 'indent every line of the block at least as far as its first line');
      }
      return said('the indentation does not line up', 'items of the same list or mapping must start in the same column; indent nested items further than their parent key');
    case 'MISSING_CHAR':
      if (/quote/i.test(raw)) return said('a quoted value is not closed', 'add the closing quote');
      if (/Flow map/i.test(raw)) return said('a { mapping } is not closed', 'add the closing }');
      if (/Flow sequence/i.test(raw)) return said('a [ list ] is not closed', 'add the closing ]');
      if (/followed by map values/i.test(raw)) return said('a key has no colon after it', 'write "key: value"');
      if (/Missing , /i.test(raw)) return said('a comma is missing between items', 'separate the items of [ … ] or { … } with commas');
      if (/Comments must be separated/i.test(raw)) return said('a # comment touches the text before it', 'put a space before the #, or quote the value if the # belongs to it');
      if (/without - indicator/i.test(raw)) return said('a list item has no "-" in front of it', 'start every list item with "- "');
      return said(`a character is missing (${raw})`);
    case 'BLOCK_AS_IMPLICIT_KEY':
      return said('a second "key:" appears on the same line', 'start the nested mapping on a new line, indented; or put the value in quotes if it contains ": "');
    case 'MULTILINE_IMPLICIT_KEY':
      return said('a key runs over more than one line', 'keep each "key:" on one line; put values that contain ": " in quotes');
    case 'UNEXPECTED_TOKEN':
      return said('something is left over where the value should have ended', 'check the indentation, and put values that contain ": ", " #" or start with a special character in quotes');
    case 'MULTIPLE_DOCS':
      return said('the file holds more than one YAML document (a second "---" line)', 'keep a single plan in the file');
    case 'BAD_DQ_ESCAPE':
      return said('a backslash in a double-quoted value starts an unknown escape', 'write a backslash as "\\\\", or use single quotes');
    case 'BAD_ALIAS':
    case 'ALIAS_PROPS':
    case 'MULTIPLE_ANCHORS':
      return said(`an anchor (&name) or alias (*name) is written wrongly (${raw})`, 'check the & and * names');
    case 'BAD_SCALAR_START':
      return said('a value starts with a character YAML reserves', 'put the value in quotes');
    case 'BLOCK_IN_FLOW':
      return said('an indented block appears inside [ … ] or { … }', 'write the whole value either in brackets or as an indented block');
    case 'KEY_OVER_1024_CHARS':
      return said('a key is longer than 1024 characters', 'shorten the key, or check for a missing colon or line break');
    case 'TAG_RESOLVE_FAILED':
    case 'MULTIPLE_TAGS':
    case 'BAD_PROP_ORDER':
      return said(`a !tag cannot be used here (${raw})`, 'remove the !tag; plans need none');
    default:
      return said(raw.charAt(0).toLowerCase() + raw.slice(1));
  }
}
