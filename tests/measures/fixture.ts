import { buildTextModel } from '../../pipeline/text/build.ts';
import { findMentions } from '../../pipeline/text/mentions.ts';
import type { CastMember } from '../../pipeline/text/model.ts';
import type { MeasureContext } from '../../pipeline/measures/types.ts';

/** A measure context for an invented text and cast. */
export function context(text: string, cast: CastMember[] = [], language = 'en'): MeasureContext {
  const model = buildTextModel(text, { id: 'fixture' });
  return { model, cast, mentions: findMentions(model, cast), language };
}

export const TALE = [
  'CHAPTER I.',
  '',
  'Milo Brack rowed the skiff across the grey estuary at dawn. The estuary was',
  'calm, and Milo sang to the gulls.',
  '',
  '“Row on,” said Nessa Quill from the bank. “The estuary will not wait.”',
  '',
  'CHAPTER II.',
  '',
  'Nessa waited by the lock. The lock-keeper counted barges; barges, barges,',
  'always barges. Brack came late, and the lock was shut.',
  '',
  'CHAPTER III.',
  '',
  'Nessa and Milo walked home along the estuary wall.',
  '',
].join('\n');

export const TALE_CAST: CastMember[] = [
  { id: 'milo', name: 'Milo Brack', aliases: [], pronoun: 'he' },
  { id: 'nessa', name: 'Nessa Quill', aliases: ['Nessa'], pronoun: 'she' },
];
