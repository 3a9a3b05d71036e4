// Type declarations for the reference libraries the statistics tests compare against (they ship none).

declare module 'jstat' {
  export const jStat: {
    mean(values: number[]): number;
    /** Population standard deviation unless `flag` is true. */
    stdev(values: number[], flag?: boolean): number;
    chisquare: { inv(p: number, dof: number): number; cdf(x: number, dof: number): number };
    normal: { inv(p: number, mean: number, sd: number): number };
  };
}

declare module 'dct' {
  /** DCT-II: X_k = scale · Σ x_n cos(π k (n + ½) / N); scale defaults to 2. */
  export default function dct(signal: number[], scale?: number): number[];
}

declare module 'sentiment' {
  export default class Sentiment {
    analyze(text: string): { score: number; words: string[]; tokens: string[] };
  }
}
