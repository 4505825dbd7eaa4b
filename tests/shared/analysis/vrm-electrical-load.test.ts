import { describe, expect, it } from 'vitest';
import { vrmElectricalLoad } from '../../../shared/domain/analysis/vrm-electrical-load';

describe('VRM electrical load (first principles: I = P / V, shared evenly over phases and stages)', () => {
  it('puts 200 W at 1.375 V at about 145.5 A, 14.5 A per stage over 10 direct phases (common practice, no source)', () => {
    // 200 / 1.375 = 145.45 A; / 10 stages = 14.55 A; of a 60 A stage = 24.2 %.
    const load = vrmElectricalLoad({
      packagePowerW: 200,
      coreVoltageV: 1.375,
      controllerPhases: 10,
      multiplication: 'direct',
      stagesPerPhase: 1,
      stageRatingA: 60,
    });
    expect(load.coreCurrentA).toBeCloseTo(145.45, 2);
    expect(load.currentPerPhaseA).toBeCloseTo(14.545, 3);
    expect(load.currentPerStageA).toBeCloseTo(14.545, 3);
    expect(load.stageLoadPercent).toBeCloseTo(24.24, 2);
    expect(load.conductionLossPerStageW).toBeNull();
  });

  it('doubles the phases with doublers (first principles: 6 controller phases doubled = 12 phases)', () => {
    // 240 W × 0.9 on the core rail = 216 W; / 1.2 V = 180 A; / 12 = 15 A per phase and stage.
    const load = vrmElectricalLoad({
      packagePowerW: 240,
      coreVoltageV: 1.2,
      coreRailShare: 0.9,
      controllerPhases: 6,
      multiplication: 'doubled',
      stagesPerPhase: 1,
      stageRatingA: 50,
    });
    expect(load).toMatchObject({ effectivePhases: 12, totalStages: 12 });
    expect(load.coreCurrentA).toBeCloseTo(180, 10);
    expect(load.currentPerStageA).toBeCloseTo(15, 10);
    expect(load.stageLoadPercent).toBeCloseTo(30, 10);
  });

  it('keeps the phase count and splits each phase over teamed stages, with I²R loss (first principles)', () => {
    // 300 W / 1.25 V = 240 A; 8 phases → 30 A each; 2 stages per phase → 15 A each; 15² × 0.002 Ω = 0.45 W.
    const load = vrmElectricalLoad({
      packagePowerW: 300,
      coreVoltageV: 1.25,
      controllerPhases: 8,
      multiplication: 'teamed',
      stagesPerPhase: 2,
      stageRatingA: 70,
      stageOnResistanceMilliohm: 2,
    });
    expect(load).toMatchObject({ effectivePhases: 8, totalStages: 16 });
    expect(load.currentPerPhaseA).toBeCloseTo(30, 10);
    expect(load.currentPerStageA).toBeCloseTo(15, 10);
    expect(load.conductionLossPerStageW).toBeCloseTo(0.45, 10);
  });

  it('assumes all package power on the core rail unless told otherwise (an upper bound)', () => {
    const base = {
      packagePowerW: 100,
      coreVoltageV: 1,
      controllerPhases: 4,
      multiplication: 'direct',
      stagesPerPhase: 1,
      stageRatingA: 40,
    } as const;
    expect(vrmElectricalLoad(base).coreCurrentA).toBe(100);
    expect(vrmElectricalLoad({ ...base, coreRailShare: 0.8 }).coreCurrentA).toBeCloseTo(80, 10);
  });

  it('refuses impossible designs and values', () => {
    const base = {
      packagePowerW: 100,
      coreVoltageV: 1,
      controllerPhases: 4,
      multiplication: 'direct',
      stagesPerPhase: 1,
      stageRatingA: 40,
    } as const;
    expect(() => vrmElectricalLoad({ ...base, multiplication: 'teamed' })).toThrow(/two or more stages/);
    expect(() => vrmElectricalLoad({ ...base, coreVoltageV: 0 })).toThrow(RangeError);
    expect(() => vrmElectricalLoad({ ...base, coreRailShare: 1.2 })).toThrow(RangeError);
    expect(() => vrmElectricalLoad({ ...base, controllerPhases: 2.5 })).toThrow(RangeError);
  });
});
