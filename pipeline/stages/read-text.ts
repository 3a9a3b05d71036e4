/**
 * Reading the texts a plan names: decode, build the text model, find the cast.
 * Models are kept in memory for the life of the process, keyed by the text's
 * bytes and reading options.
 */
import { readFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { readFileText } from '../text/decode.ts';
import { buildTextModel } from '../text/build.ts';
import { findMentions } from '../text/mentions.ts';
import type { CastMember, Mentions, TextModel, TextOptions } from '../text/model.ts';
import type { Problem } from '../problems/problem.ts';
import { problem } from '../problems/problem.ts';
import { stableJson } from '../cache/cache.ts';

export interface OpenedText {
  model: TextModel;
  mentions: Mentions;
  /** Warnings from decoding the file (an encoding that was guessed). */
  notes: Problem[];
}

/** Models built in this process, by the text's bytes, reading options and cast: the live preview reuses them across edits. */
const memo = new Map<string, OpenedText>();

/** sha256 of a file's bytes. */
export function hashBytes(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

export interface ReadText {
  /** sha256 of the file's bytes. */
  hash: string;
  /** Builds (or recalls) the model and the cast mentions: only called when a measure needs them. */
  open(): OpenedText;
}

/**
 * Reads a text file. Problems (unreadable file, bytes that are not text) are returned
 * with the file, line and column; the model itself is built lazily.
 */
export function readText(
  file: string,
  displayName: string,
  options: TextOptions,
  cast: CastMember[],
): { text: ReadText | null; problems: Problem[] } {
  let bytes: Uint8Array;
  try {
    bytes = readFileSync(file);
  } catch (e) {
    return {
      text: null,
      problems: [problem('text/unreadable', { reason: (e as NodeJS.ErrnoException).code ?? String(e) }, { file: displayName })],
    };
  }
  const hash = hashBytes(bytes);
  const key = hash + stableJson({ options, cast });
  const seen = memo.get(key);
  if (seen) return { text: { hash, open: () => seen }, problems: seen.notes.map((p) => ({ ...p, file: displayName })) };
  const decoded = readFileText(bytes, displayName);
  const problems = decoded.problems;
  if (decoded.text === null) return { text: null, problems };
  const source = decoded.text;
  const open = (): OpenedText => {
    let opened = memo.get(key);
    if (!opened) {
      const model = buildTextModel(source, options);
      opened = { model, mentions: findMentions(model, cast), notes: problems };
      memo.set(key, opened);
    }
    return opened;
  };
  return { text: { hash, open }, problems };
}
