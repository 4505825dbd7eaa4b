import { mean, sampleStandardDeviation } from 'simple-statistics';
import { studentTCritical } from './student-t';

export interface RepeatRunStatistics {
  runs: number;
  mean: number;
  /** Sample standard deviation (n − 1); null for a single run. */
  standardDeviation: number | null;
  confidence: number;
  tCritical: number | null;
  /** mean ± t · s / √n; null for a single run. */
  halfWidth: number | null;
  low: number | null;
  high: number | null;
}

/** Mean, sample standard deviation and Student-t confidence interval of one figure over repeated runs of a cell. */
export function repeatRunStatistics(values: readonly number[], confidence = 0.95): RepeatRunStatistics {
  if (values.length === 0) throw new RangeError('Give at least one run.');
  if (!values.every(Number.isFinite)) throw new RangeError('Every run needs a finite value.');
  const average = mean([...values]);
  if (values.length === 1) {
    return {
      runs: 1,
      mean: average,
      standardDeviation: null,
      confidence,
      tCritical: null,
      halfWidth: null,
      low: null,
      high: null,
    };
  }
  const standardDeviation = sampleStandardDeviation([...values]);
  const tCritical = studentTCritical(confidence, values.length - 1);
  const halfWidth = (tCritical * standardDeviation) / Math.sqrt(values.length);
  return {
    runs: values.length,
    mean: average,
    standardDeviation,
    confidence,
    tCritical,
    halfWidth,
    low: average - halfWidth,
    high: average + halfWidth,
  };
}
