/** The few jstat functions the engine uses (jstat ships without type declarations). */
declare module 'jstat' {
  export const jStat: {
    /** Natural logarithm of the gamma function. */
    gammaln(x: number): number;
    /** Regularised lower incomplete gamma function P(a, x). */
    lowRegGamma(a: number, x: number): number;
    chisquare: {
      /** Cumulative distribution function of the chi-squared distribution with `dof` degrees of freedom. */
      cdf(x: number, dof: number): number;
    };
    binomial: {
      /** Probability mass P(X = k) for X ~ Bin(n, p). */
      pdf(k: number, n: number, p: number): number;
      /** Cumulative distribution P(X <= k) for X ~ Bin(n, p). */
      cdf(k: number, n: number, p: number): number;
    };
  };
}
