// Minimal types for the parts of jstat (devDependency, no bundled types) that tests use.
declare module 'jstat' {
  interface JStat {
    tukey: {
      cdf(q: number, nmeans: number, df: number): number;
      inv(p: number, nmeans: number, df: number): number;
    };
    normal: {
      inv(p: number, mean: number, sd: number): number;
    };
    stdev(values: number[], sample?: boolean): number;
    mean(values: number[]): number;
  }
  const jStat: JStat & { jStat: JStat };
  export default jStat;
}
