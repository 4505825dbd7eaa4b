import { describe, expect, it } from 'vitest';
import { vrmElectricalLoad } from '../../../shared/domain/analysis/vrm-electrical-load';

describe('VRM electrical load (first principles: I = P / V, shared evenly over phases and stages)', () => {
  /** Each design, what it must come to (exact fields, and fields close to a value within `digits` decimals). */
  const designs: {
    title: string;
    design: Parameters<typeof vrmElectricalLoad>[0];
    exact: Partial<ReturnType<typeof vrmElectricalLoad>>;
    close: Partial<Record<keyof ReturnType<typeof vrmElectricalLoad>, [value: number, digits: number]>>;
  }[] = [
    {
      title:
        'puts 200 W at 1.375 V at about 145.5 A, 14.5 A per stage over 10 direct phases (common practice, no source)',
      // 200 / 1.375 = 145.45 A; / 10 stages = 14.55 A; of a 60 A stage = 24.2 %.
      design: {
        packagePowerW: 200,
        coreVoltageV: 1.375,
        controllerPhases: 10,
        multiplication: 'direct',
        stagesPerPhase: 1,
        stageRatingA: 60,
      },
      exact: { conductionLossPerStageW: null },
      close: {
        coreCurrentA: [145.45, 2],
        currentPerPhaseA: [14.545, 3],
        currentPerStageA: [14.545, 3],
        stageLoadPercent: [24.24, 2],
      },
    },
    {
      title: 'doubles the phases with doublers (first principles: 6 controller phases doubled = 12 phases)',
      // 240 W × 0.9 on the core rail = 216 W; / 1.2 V = 180 A; / 12 = 15 A per phase and stage.
      design: {
        packagePowerW: 240,
        coreVoltageV: 1.2,
        coreRailShare: 0.9,
        controllerPhases: 6,
        multiplication: 'doubled',
        stagesPerPhase: 1,
        stageRatingA: 50,
      },
      exact: { effectivePhases: 12, totalStages: 12 },
      close: { coreCurrentA: [180, 10], currentPerStageA: [15, 10], stageLoadPercent: [30, 10] },
    },
    {
      title: 'keeps the phase count and splits each phase over teamed stages, with I²R loss (first principles)',
      // 300 W / 1.25 V = 240 A; 8 phases → 30 A each; 2 stages per phase → 15 A each; 15² × 0.002 Ω = 0.45 W.
      design: {
        packagePowerW: 300,
        coreVoltageV: 1.25,
        controllerPhases: 8,
        multiplication: 'teamed',
        stagesPerPhase: 2,
        stageRatingA: 70,
        stageOnResistanceMilliohm: 2,
      },
      exact: { effectivePhases: 8, totalStages: 16 },
      close: { currentPerPhaseA: [30, 10], currentPerStageA: [15, 10], conductionLossPerStageW: [0.45, 10] },
    },
  ];

  it.each(designs)('$title', ({ design, exact, close }) => {
    const load = vrmElectricalLoad(design);
    expect(load).toMatchObject(exact);
    for (const [field, [value, digits]] of Object.entries(close)) {
      expect(load[field as keyof typeof load], field).toBeCloseTo(value, digits);
    }
  });

  /** A plain design of 100 W at 1 V over four direct 40 A phases. */
  const base = {
    packagePowerW: 100,
    coreVoltageV: 1,
    controllerPhases: 4,
    multiplication: 'direct',
    stagesPerPhase: 1,
    stageRatingA: 40,
  } as const;

  it('assumes all package power on the core rail unless told otherwise (an upper bound)', () => {
    expect(vrmElectricalLoad(base).coreCurrentA).toBe(100);
    expect(vrmElectricalLoad({ ...base, coreRailShare: 0.8 }).coreCurrentA).toBeCloseTo(80, 10);
  });

  it('refuses impossible designs and values', () => {
    expect(() => vrmElectricalLoad({ ...base, multiplication: 'teamed' })).toThrow(/two or more stages/);
    expect(() => vrmElectricalLoad({ ...base, coreVoltageV: 0 })).toThrow(RangeError);
    expect(() => vrmElectricalLoad({ ...base, coreRailShare: 1.2 })).toThrow(RangeError);
    expect(() => vrmElectricalLoad({ ...base, controllerPhases: 2.5 })).toThrow(RangeError);
  });
});
