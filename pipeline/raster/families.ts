/**
 * The project's two typefaces by name: the family names inside the font
 * files, their packages, and the CSS font stacks an SVG that stands alone
 * names them with. Plain data, so pages and the standalone chart files can
 * use it without loading the font files (./fonts.ts does that).
 */

export type Family = 'serif' | 'sans';

export interface Face {
  family: Family;
  weight: 400 | 600;
  style: 'normal' | 'italic';
}

export interface FamilyInfo {
  /** The family name inside the font files, as CSS and fontconfig use it. */
  name: string;
  /** The npm package holding the files. */
  pkg: string;
  /** File name stem inside the package's files/ folder. */
  stem: string;
  /** The CSS font stack for SVG that stands alone: the face first, then fallbacks a reader's machine may have, then the generic family. */
  stack: string;
  generic: 'serif' | 'sans-serif';
}

export const FAMILIES: Record<Family, FamilyInfo> = {
  serif: {
    name: 'Source Serif 4',
    pkg: '@fontsource/source-serif-4',
    stem: 'source-serif-4',
    stack: "'Source Serif 4', Georgia, 'Times New Roman', serif",
    generic: 'serif',
  },
  sans: {
    name: 'Source Sans 3',
    pkg: '@fontsource/source-sans-3',
    stem: 'source-sans-3',
    stack: "'Source Sans 3', 'Helvetica Neue', Arial, sans-serif",
    generic: 'sans-serif',
  },
};

