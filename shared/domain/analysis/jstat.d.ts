// jstat ships without type declarations; Benchwire uses only the Student's t quantile.
declare module 'jstat' {
  const jStat: {
    studentt: {
      inv(probability: number, degreesOfFreedom: number): number;
      cdf(value: number, degreesOfFreedom: number): number;
    };
  };
  export default jStat;
}
