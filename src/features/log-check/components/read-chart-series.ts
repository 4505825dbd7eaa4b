import { readLogFile } from '../../../../shared/domain/analysis/analyse-log';
import { analysisRequestSchema, type AnalysisRequestInput } from '../../../../shared/schemas/analysis';

export interface ChartLine {
  column: string;
  /** [seconds, °C] pairs in time order; NaN °C breaks the line at a gap or dropout. */
  points: [number, number][];
}

export interface ChartSeries {
  endS: number;
  vrm: ChartLine[];
  ambient: ChartLine | null;
}

/** Points kept per line: the lowest and highest reading of each of this many time buckets, so no peak is lost. */
const bucketCount = 300;

function thin(column: string, timeS: Float64Array, valuesC: Float64Array, endS: number): ChartLine {
  const points: [number, number][] = [];
  const width = endS / bucketCount || 1;
  let bucket = -1;
  let low = -1;
  let high = -1;
  let gap = false;
  const flush = () => {
    if (low < 0) return;
    const [first, second] = low <= high ? [low, high] : [high, low];
    points.push([timeS[first], valuesC[first]]);
    if (second !== first) points.push([timeS[second], valuesC[second]]);
    low = high = -1;
  };
  for (let i = 0; i < timeS.length; i++) {
    const value = valuesC[i];
    if (Number.isNaN(value)) {
      if (!gap) {
        flush();
        points.push([timeS[i], Number.NaN]);
        gap = true;
      }
      continue;
    }
    gap = false;
    const at = Math.floor(timeS[i] / width);
    if (at !== bucket) {
      flush();
      bucket = at;
    }
    if (low < 0 || value < valuesC[low]) low = i;
    if (high < 0 || value > valuesC[high]) high = i;
  }
  flush();
  return { column, points };
}

/**
 * The temperature series of the file, read by the same pipeline the server runs (the shared file-text decoder and
 * logger reader), for the chart only: every figure on the page comes from the server's analysis. Null when the file
 * cannot be read here (the chart is then left out, nothing else changes).
 */
export async function readChartSeries(file: File, requestInput: AnalysisRequestInput): Promise<ChartSeries | null> {
  try {
    const request = analysisRequestSchema.safeParse(requestInput);
    if (!request.success) return null;
    const read = readLogFile(new Uint8Array(await file.arrayBuffer()), request.data);
    if (!read.ok) return null;
    const { timeS, vrm, ambient } = read.log;
    const endS = timeS[timeS.length - 1] ?? 0;
    if (!(endS > 0)) return null;
    return {
      endS,
      vrm: vrm.map((channel) => thin(channel.column, timeS, channel.valuesC, endS)),
      ambient: ambient ? thin(ambient.column, timeS, ambient.valuesC, endS) : null,
    };
  } catch {
    return null;
  }
}
