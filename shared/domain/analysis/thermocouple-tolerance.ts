import type { ToleranceClass } from '../../schemas/analysis';

export interface ToleranceClassDefinition {
  standard: string;
  minC: number;
  maxC: number;
  fixedC: number;
  /** Fraction of |t| in °C. */
  fraction: number;
}

/** Type K tolerance classes; the larger of the fixed and the proportional value applies. */
export const thermocoupleToleranceClasses: Record<ToleranceClass, ToleranceClassDefinition> = {
  'iec-60584-1-class-1': { standard: 'IEC 60584-1:2013 Class 1', minC: -40, maxC: 1000, fixedC: 1.5, fraction: 0.004 },
  'iec-60584-1-class-2': { standard: 'IEC 60584-1:2013 Class 2', minC: -40, maxC: 1200, fixedC: 2.5, fraction: 0.0075 },
  'astm-e230-standard': { standard: 'ASTM E230 standard limits', minC: 0, maxC: 1260, fixedC: 2.2, fraction: 0.0075 },
  'astm-e230-special': { standard: 'ASTM E230 special limits', minC: 0, maxC: 1260, fixedC: 1.1, fraction: 0.004 },
};

export class ToleranceRangeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ToleranceRangeError';
  }
}

/** ± tolerance in °C of a type K reading of `celsius` for the given class. */
export function thermocoupleToleranceC(celsius: number, toleranceClass: ToleranceClass): number {
  const definition = thermocoupleToleranceClasses[toleranceClass];
  if (!Number.isFinite(celsius) || celsius < definition.minC || celsius > definition.maxC) {
    throw new ToleranceRangeError(
      `${definition.standard} covers ${definition.minC}…${definition.maxC} °C; ${celsius} °C is outside it.`,
    );
  }
  return Math.max(definition.fixedC, definition.fraction * Math.abs(celsius));
}
