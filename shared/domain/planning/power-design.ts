// A board's V-core power design, as the catalog records it. First principles of a multiphase buck converter:
// - direct: each controller phase drives its own stage(s); effective phases = controller phases.
// - doubled: a phase doubler splits each controller phase into two interleaved phases; effective = 2 × controller.
// - teamed: each controller phase drives two or more stages switching together (in parallel); the stages share
//   the phase's current but add no phase, so effective = controller phases.
// Stages per phase counts the stages on each effective phase: 1 for direct and doubled, 2 or more for teamed.

export const phaseMultiplications = ['direct', 'doubled', 'teamed'] as const;
export type PhaseMultiplication = (typeof phaseMultiplications)[number];

export const phaseMultiplicationLabels: Record<PhaseMultiplication, string> = {
  direct: 'Direct (one stage per controller phase)',
  doubled: 'Doubled (phase doublers)',
  teamed: 'Teamed (parallel stages per phase)',
};

export function effectivePhaseCount(controllerPhases: number, multiplication: PhaseMultiplication): number {
  return multiplication === 'doubled' ? controllerPhases * 2 : controllerPhases;
}

/** Power stages (or high/low-side MOSFET sets) on the V-core rail. */
export function vcoreStageCount(
  controllerPhases: number,
  multiplication: PhaseMultiplication,
  stagesPerPhase: number,
): number {
  return effectivePhaseCount(controllerPhases, multiplication) * stagesPerPhase;
}

/** Sum of the stages' continuous ratings, in amps: a rating total, not what the board can cool. */
export function vcoreRatedCurrentA(stageCount: number, stageCurrentA: number): number {
  return Math.round(stageCount * stageCurrentA * 10) / 10;
}

/** Null when stages per phase fits the multiplication, else the reason. */
export function stagesPerPhaseProblem(multiplication: PhaseMultiplication, stagesPerPhase: number): string | null {
  if (multiplication === 'teamed' && stagesPerPhase < 2) return 'Teamed phases have two or more stages per phase.';
  if (multiplication !== 'teamed' && stagesPerPhase !== 1) {
    return 'Direct and doubled phases have one stage per phase; several stages per phase means teamed.';
  }
  return null;
}
