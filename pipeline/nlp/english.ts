/**
 * Parts of speech and lemmas come from an English model (wink-eng-lite-web-model).
 * On a text in any other language they would be nonsense, so every measure
 * that needs them calls `requireEnglish` first: it throws a message that says
 * what needs the model, what the text's language is, and what to do.
 */

/** Whether an ISO 639-1 language code (optionally with a region, "en-GB") is English. */
export function isEnglish(language: string): boolean {
  return /^en(?:[-_]|$)/i.test(language.trim());
}

export class NeedsEnglishModelError extends Error {
  readonly language: string;
  constructor(what: string, language: string, instead: string) {
    super(
      `${what} needs an English language model: parts of speech and lemmas come from wink-eng-lite-web-model, which reads English only, and the text's language is "${language}". ${instead}, or set the exhibit's language to "en" if the text is in English.`,
    );
    this.name = 'NeedsEnglishModelError';
    this.language = language;
  }
}

/**
 * Throw `NeedsEnglishModelError` unless `language` is English.
 * @param what what needs the model, e.g. 'unit "lemma"'.
 * @param instead what the curator can do instead, e.g. 'Use unit "form"'.
 */
export function requireEnglish(language: string, what: string, instead: string): void {
  if (!isEnglish(language)) throw new NeedsEnglishModelError(what, language, instead);
}
