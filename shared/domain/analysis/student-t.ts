import jStat from 'jstat';

/**
 * Two-sided critical value of Student's t for `confidence` (e.g. 0.95) and ν degrees of freedom: the upper
 * (1 + confidence) / 2 quantile, as tabulated in the NIST/SEMATECH e-Handbook, §1.3.6.7.2.
 */
export function studentTCritical(confidence: number, degreesOfFreedom: number): number {
  if (!(confidence > 0 && confidence < 1)) throw new RangeError('The confidence level must be between 0 and 1.');
  if (!(degreesOfFreedom >= 1)) throw new RangeError('Student t needs at least one degree of freedom.');
  return jStat.studentt.inv((1 + confidence) / 2, degreesOfFreedom);
}
