import lists from 'stopwords-iso/stopwords-iso.json' with { type: 'json' };

const table = lists as Record<string, string[]>;
const cache = new Map<string, Set<string>>();

/** Languages that stopwords-iso has a list for. */
export function hasStopwords(language: string): boolean {
  return Object.hasOwn(table, language);
}

/** The stopword list of a language (ISO 639-1), apostrophes normalised to ', or an empty set. */
export function stopwords(language: string): Set<string> {
  let set = cache.get(language);
  if (!set) {
    set = new Set((table[language] ?? []).map((w) => w.toLowerCase().replace(/’/g, "'")));
    cache.set(language, set);
  }
  return set;
}
