// jstat ships no types; this covers the parts the statistics specs check against.
declare module 'jstat' {
  interface Distribution {
    cdf(x: number, ...parameters: number[]): number;
    inv(p: number, ...parameters: number[]): number;
  }
  interface JStat {
    chisquare: Distribution;
    normal: Distribution;
    erf(x: number): number;
  }
  const jStat: JStat;
  export default jStat;
}
