/** Minimal types for the parts of jstat (no bundled types) that the tests use as a reference. */
declare module 'jstat' {
  interface Cdf {
    cdf(x: number, ...parameters: number[]): number;
    inv(p: number, ...parameters: number[]): number;
  }
  export const jStat: {
    chisquare: Cdf;
    centralF: Cdf;
    beta: Cdf;
    gammafn(x: number): number;
  };
}
