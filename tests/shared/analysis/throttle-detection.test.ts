import { describe, expect, it } from 'vitest';
import { detectThrottle } from '../../../shared/domain/analysis/throttle-detection';

const settings = { fraction: 0.85, minSeconds: 10, intervalS: 1 };

function clock(durationS: number, mhzAt: (t: number) => number) {
  const timeS = Float64Array.from({ length: durationS }, (_, t) => t);
  return { timeS, signal: timeS.map(mhzAt) };
}

describe('throttle detection: a sustained drop below a share of the loaded median', () => {
  it('finds a clock cut from 4600 to 2800 MHz at minute 30 that lasts to the end (first principles)', () => {
    const { timeS, signal } = clock(3600, (t) => (t >= 1800 ? 2800 : 4600));
    const result = detectThrottle(timeS, signal, 0, settings);
    // The run's median is 3700 MHz, the first five loaded minutes' 4600 MHz; the higher is the reference, and
    // 0.85 × 4600 = 3910 MHz.
    expect(result.loadedMedian).toBe(4600);
    expect(result.threshold).toBeCloseTo(3910, 9);
    expect(result).toMatchObject({ detected: true, firstAtS: 1800, shareThrottled: 0.5 });
  });

  it('finds a throttle that lasts most of the run, which the run median alone would hide', () => {
    const { timeS, signal } = clock(3600, (t) => (t >= 600 ? 3000 : 4600));
    const result = detectThrottle(timeS, signal, 0, settings);
    expect(result).toMatchObject({ detected: true, firstAtS: 600, loadedMedian: 4600 });
    expect(result.shareThrottled).toBeCloseTo(3000 / 3600, 12);
  });

  it('ignores a dip shorter than the minimum duration', () => {
    const { timeS, signal } = clock(600, (t) => (t >= 100 && t < 105 ? 2000 : 4600));
    expect(detectThrottle(timeS, signal, 0, settings)).toMatchObject({
      detected: false,
      firstAtS: null,
      shareThrottled: 0,
    });
  });

  it('counts several episodes and their share of the loaded time', () => {
    const { timeS, signal } = clock(1000, (t) => ((t >= 100 && t < 150) || (t >= 500 && t < 600) ? 3000 : 4600));
    const result = detectThrottle(timeS, signal, 0, settings);
    expect(result.episodes).toEqual([
      { startS: 100, endS: 150 },
      { startS: 500, endS: 600 },
    ]);
    expect(result.shareThrottled).toBeCloseTo(0.15, 12);
  });

  it('lets a gap in the clock neither start nor end a drop', () => {
    const { timeS, signal } = clock(600, (t) => (t >= 200 && t < 230 ? 3000 : 4600));
    signal[210] = Number.NaN;
    expect(detectThrottle(timeS, signal, 0, settings).episodes).toEqual([{ startS: 200, endS: 230 }]);
  });

  it('judges only the loaded part: an idle clock before the load start is no throttle', () => {
    const { timeS, signal } = clock(1200, (t) => (t < 120 ? 800 : 4600));
    expect(detectThrottle(timeS, signal, 0, settings).detected).toBe(false);
    expect(detectThrottle(timeS, signal, 120, settings).detected).toBe(false);
  });

  it('still finds a throttle after an idle start', () => {
    const { timeS, signal } = clock(1200, (t) => (t < 120 ? 800 : t >= 600 ? 2500 : 4600));
    // Loaded from 120 s: 480 s at 4600 MHz, 600 s at 2500 MHz; the drop is 600 / 1080 of it (first principles).
    expect(detectThrottle(timeS, signal, 0, settings)).toMatchObject({ detected: true, firstAtS: 600 });
    expect(detectThrottle(timeS, signal, 0, settings).shareThrottled).toBeCloseTo(600 / 1080, 12);
  });
});
