import {
  effectivePhaseCount,
  stagesPerPhaseProblem,
  vcoreStageCount,
  type PhaseMultiplication,
} from '../planning/power-design';

/**
 * Electrical load on a board's VRM from first principles (REFERENCES.md, "Physics and trade practice", no published
 * source): core current ≈ core-rail power / core voltage; an ideally balanced multiphase buck shares it evenly over its
 * phases and the power stages within each phase.
 */

export interface VrmLoadInput {
  packagePowerW: number;
  coreVoltageV: number;
  /**
   * Share of package power drawn from the core rail. Default 1: package power also feeds other rails, so all of it on
   * the core rail is an upper bound on the current, the safe side for judging the power stages.
   */
  coreRailShare?: number;
  /** Phases the PWM controller drives. */
  controllerPhases: number;
  /** As the catalog records it; see planning/power-design for direct, doubled and teamed. */
  multiplication: PhaseMultiplication;
  /** Power stages in parallel on each effective phase: 1 for direct and doubled, 2 or more for teamed. */
  stagesPerPhase: number;
  /** Continuous current rating of one power stage, A. */
  stageRatingA: number;
  /** Optional on-resistance of one stage, mΩ, for an I²R conduction-loss estimate. */
  stageOnResistanceMilliohm?: number;
}

export interface VrmLoad {
  coreRailPowerW: number;
  coreCurrentA: number;
  effectivePhases: number;
  totalStages: number;
  currentPerPhaseA: number;
  currentPerStageA: number;
  /** Per-stage current as a percentage of its continuous rating. */
  stageLoadPercent: number;
  /** I²R with the stage's average current, ripple ignored: a floor for the real conduction loss. */
  conductionLossPerStageW: number | null;
}

export const defaultCoreRailShare = 1;

function requirePositive(value: number, name: string): void {
  if (!(Number.isFinite(value) && value > 0)) throw new RangeError(`${name} must be a positive number.`);
}

export function vrmElectricalLoad(input: VrmLoadInput): VrmLoad {
  const share = input.coreRailShare ?? defaultCoreRailShare;
  requirePositive(input.packagePowerW, 'Package power');
  requirePositive(input.coreVoltageV, 'Core voltage');
  requirePositive(input.stageRatingA, 'Stage rating');
  if (!(share > 0 && share <= 1)) throw new RangeError('The core-rail share must be above 0 and at most 1.');
  for (const [value, name] of [
    [input.controllerPhases, 'Controller phases'],
    [input.stagesPerPhase, 'Stages per phase'],
  ] as const) {
    if (!(Number.isInteger(value) && value >= 1)) throw new RangeError(`${name} must be a whole number of at least 1.`);
  }
  const stagesProblem = stagesPerPhaseProblem(input.multiplication, input.stagesPerPhase);
  if (stagesProblem) throw new RangeError(stagesProblem);
  if (input.stageOnResistanceMilliohm !== undefined) requirePositive(input.stageOnResistanceMilliohm, 'On-resistance');
  const coreRailPowerW = input.packagePowerW * share;
  const coreCurrentA = coreRailPowerW / input.coreVoltageV;
  const effectivePhases = effectivePhaseCount(input.controllerPhases, input.multiplication);
  const totalStages = vcoreStageCount(input.controllerPhases, input.multiplication, input.stagesPerPhase);
  const currentPerStageA = coreCurrentA / totalStages;
  const resistanceOhm = input.stageOnResistanceMilliohm === undefined ? null : input.stageOnResistanceMilliohm / 1000;
  return {
    coreRailPowerW,
    coreCurrentA,
    effectivePhases,
    totalStages,
    currentPerPhaseA: coreCurrentA / effectivePhases,
    currentPerStageA,
    stageLoadPercent: (currentPerStageA / input.stageRatingA) * 100,
    conductionLossPerStageW: resistanceOhm === null ? null : currentPerStageA * currentPerStageA * resistanceOhm,
  };
}
