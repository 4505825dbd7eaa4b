import { z } from 'zod';
import { instantSchema, pathIdsSchema } from './common';
import { productBriefSchema } from './catalog';
import { calendarDateSchema, entryRecordFields, idSchema, namedRefSchema, personRefSchema } from './planning-fields';
import { cellActions, cellStates } from '../domain/planning/matrix-cell-states';
import { roundupStateSchema } from './roundup-state';
import { planningDateSchema } from './dates';
import { optionalMultiLineText } from './text';
import { whenValid } from './checks';

/**
 * Cell states and actions; labels and the rules of who may do what are in
 * shared/domain/planning/matrix-cell-states.ts (cellStateLabels, cellActionRules).
 */
export const cellStateSchema = z.enum(cellStates);
export const cellActionSchema = z.enum(cellActions);

export const matrixCellSchema = z.object({
  ...entryRecordFields,
  loadConfigurationId: z.number().int(),
  state: cellStateSchema,
  tester: personRefSchema.nullable(),
  dueDate: calendarDateSchema.nullable(),
  /** The due date has ended in the roundup's time zone and the cell is not recorded or accepted. */
  overdue: z.boolean(),
  /** The editor's reason when sending back for retest, or the last transition's note. */
  note: z.string().nullable(),
  stateChangedAt: instantSchema,
  /** Submitted test runs on the cell; "Mark recorded" is offered only with at least one. */
  runCount: z.number().int(),
  /** QA flags of the run the results matrix shows for the cell (run of record, else the newest), in words. */
  qaFlags: z.array(z.string()),
  /** What the signed-in user may do with this cell now. */
  actions: z.array(cellActionSchema),
});
export type MatrixCell = z.infer<typeof matrixCellSchema>;

export const matrixColumnSchema = z.object({
  loadConfigurationId: z.number().int(),
  name: z.string(),
  position: z.number().int(),
});

export const matrixRowSchema = z.object({
  entryId: z.number().int(),
  kind: z.enum(['tested', 'reference']),
  product: productBriefSchema,
  /** One per column, in column order; empty for reference entries (they are not re-tested). */
  cells: z.array(matrixCellSchema),
});

export const matrixProgressSchema = z.object({
  cellCount: z.number().int(),
  acceptedCount: z.number().int(),
  /** Accepted cells as a whole percentage of all cells (0 when there are none). */
  percentAccepted: z.number().int(),
  unassignedCount: z.number().int(),
  countsByState: z.record(cellStateSchema, z.number().int()),
});
export type MatrixProgress = z.infer<typeof matrixProgressSchema>;

export const roundupMatrixSchema = z.object({
  roundupId: z.number().int(),
  roundupState: roundupStateSchema,
  timeZone: z.string(),
  columns: z.array(matrixColumnSchema),
  rows: z.array(matrixRowSchema),
  progress: matrixProgressSchema,
});
export type RoundupMatrix = z.infer<typeof roundupMatrixSchema>;

/** Assign cells, whole rows (entryIds) or both to one tester with a due date. */
export const assignCellsRequestSchema = z
  .strictObject({
    cellIds: z.array(idSchema).max(500).default([]),
    entryIds: z.array(idSchema).max(200).default([]),
    testerId: idSchema,
    dueDate: planningDateSchema,
  })
  .refine((v) => v.cellIds.length + v.entryIds.length > 0, {
    path: ['cellIds'],
    message: 'Choose at least one cell or row.',
    when: whenValid('cellIds', 'entryIds'),
  });
export type AssignCellsRequest = z.input<typeof assignCellsRequestSchema>;
export type ParsedAssignCellsRequest = z.output<typeof assignCellsRequestSchema>;
export const assignCellsResponseSchema = z.object({ cells: z.array(matrixCellSchema) });

/** Move one cell. `note` is required for send-back (the reason) and optional otherwise. */
export const cellTransitionRequestSchema = z
  .strictObject({
    action: cellActionSchema,
    note: optionalMultiLineText(500),
    /** A tester's reason to start a run outside every booking of the cell; without it that start is a 409. */
    overrideReason: optionalMultiLineText(300),
  })
  .refine((v) => v.action !== 'send-back' || (v.note?.length ?? 0) > 0, {
    path: ['note'],
    message: 'Say why the cell needs a retest.',
    when: whenValid('action', 'note'),
  });
export type CellTransitionRequest = z.input<typeof cellTransitionRequestSchema>;

export const cellParamsSchema = pathIdsSchema('id', 'cellId');

export const testerListSchema = z.object({ testers: z.array(personRefSchema) });

/** A cell with enough context to show it outside its matrix (my bench, bookings, dashboard). */
export const queueItemSchema = z.object({
  cell: matrixCellSchema,
  roundup: z.object({ id: z.number().int(), title: z.string(), state: roundupStateSchema, timeZone: z.string() }),
  product: productBriefSchema,
  loadConfiguration: namedRefSchema,
});
export type QueueItem = z.infer<typeof queueItemSchema>;
