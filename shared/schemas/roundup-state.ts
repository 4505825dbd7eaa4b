import { z } from 'zod';
import { roundupStates } from '../domain/planning/roundup-states';

/** Stored codes of a roundup's state; show them with `roundupStateLabels` (shared/domain/planning/roundup-states.ts). */
export const roundupStateSchema = z.enum(roundupStates);
