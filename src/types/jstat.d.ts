// The parts of jstat (which ships no types) that Plumbline uses.
declare module 'jstat' {
  interface JStatStatic {
    erfc(x: number): number;
    normal: { inv(p: number, mean: number, sd: number): number; pdf(x: number, mean: number, sd: number): number };
    studentt: { inv(p: number, dof: number): number; cdf(x: number, dof: number): number };
    noncentralt: { cdf(x: number, dof: number, ncp: number): number };
    chisquare: { cdf(x: number, dof: number): number };
    lowRegGamma(a: number, x: number): number;
  }
  const jstat: { jStat: JStatStatic };
  export default jstat;
}
