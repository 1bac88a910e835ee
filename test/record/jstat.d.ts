// Just the jstat calls the record tests use as independent references (jstat ships no types).
declare module 'jstat' {
  const jStat: {
    beta: { inv(p: number, a: number, b: number): number };
    chisquare: { inv(p: number, dof: number): number };
  };
  export default jStat;
}
