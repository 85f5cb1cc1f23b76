// Minimal typings for the parts of jstat 1.9.6 that Seepwise uses.
// jstat ships as a UMD/CommonJS bundle whose `module.exports` is the jStat object,
// so it is imported with a default import: `import jStat from 'jstat'`.
declare module 'jstat' {
  interface JStatStudentT {
    cdf(x: number, dof: number): number;
    inv(p: number, dof: number): number;
  }
  interface JStatNormal {
    cdf(x: number, mean: number, std: number): number;
    inv(p: number, mean: number, std: number): number;
  }
  interface JStatNoncentralT {
    cdf(x: number, dof: number, ncp: number): number;
  }
  interface JStatChiSquare {
    cdf(x: number, dof: number): number;
  }
  interface JStatStatic {
    studentt: JStatStudentT;
    normal: JStatNormal;
    noncentralt: JStatNoncentralT;
    chisquare: JStatChiSquare;
  }
  const jStat: JStatStatic;
  export default jStat;
}
