// jstat ships no type declarations; these cover the distribution functions the engine calls.
declare module 'jstat' {
  interface Distribution {
    cdf(x: number, ...parameters: number[]): number;
    inv(p: number, ...parameters: number[]): number;
  }
  const jstat: { jStat: { normal: Distribution; chisquare: Distribution } };
  export default jstat;
}
