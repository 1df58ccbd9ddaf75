// jstat ships no types; only what the engine uses. It is CommonJS: import the default export.
declare module 'jstat' {
  interface JStat {
    studentt: {
      inv(p: number, dof: number): number;
      cdf(x: number, dof: number): number;
    };
  }
  const jstat: { jStat: JStat };
  export default jstat;
}
