import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { buildTextModel } from '../../pipeline/text/build.ts';
import type { TextModel, TextOptions } from '../../pipeline/text/model.ts';

export function fixture(name: string): string {
  return readFileSync(fileURLToPath(new URL(`../fixtures/text/${name}`, import.meta.url)), 'utf8');
}

export function model(source: string, options: Partial<TextOptions> = {}): TextModel {
  return buildTextModel(source, { id: 'test', ...options });
}

export function sentences(m: TextModel): string[] {
  const out: string[] = [];
  for (let i = 0; i < m.sentences.count; i++) out.push(m.text.slice(m.sentences.start[i], m.sentences.end[i]).replace(/\n/g, ' '));
  return out;
}

export function paragraphs(m: TextModel): string[] {
  const out: string[] = [];
  for (let i = 0; i < m.paragraphs.count; i++) out.push(m.text.slice(m.paragraphs.start[i], m.paragraphs.end[i]).replace(/\n/g, ' '));
  return out;
}

export function words(m: TextModel): string[] {
  const out: string[] = [];
  for (let i = 0; i < m.tokens.count; i++) out.push(m.text.slice(m.tokens.start[i], m.tokens.end[i]));
  return out;
}
