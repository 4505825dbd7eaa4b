import { z } from 'zod';
import { instantSchema, pathIdsSchema } from './common';
import { productBriefSchema } from './catalog';
import {
  amountMinorSchema,
  calendarDateSchema,
  currencySchema,
  entryRecordFields,
  moneySchema,
  optionalTextSchema,
} from './planning-fields';
import { planningDateSchema } from './dates';
import { optionalMultiLineText } from './text';
import { whenValid } from './checks';

export const sampleSources = ['retail', 'vendor-loan'] as const;
export const sampleSourceSchema = z.enum(sampleSources);
export type SampleSource = z.infer<typeof sampleSourceSchema>;
export const sampleSourceLabels: Record<SampleSource, string> = {
  retail: 'Retail purchase',
  'vendor-loan': 'Vendor loan',
};

export const sampleStatuses = ['ordered', 'received', 'on-the-bench', 'tested', 'returned', 'kept'] as const;
export const sampleStatusSchema = z.enum(sampleStatuses);
export type SampleStatus = z.infer<typeof sampleStatusSchema>;
export const sampleStatusLabels: Record<SampleStatus, string> = {
  ordered: 'Ordered',
  received: 'Received',
  'on-the-bench': 'On the bench',
  tested: 'Tested',
  returned: 'Returned',
  kept: 'Kept',
};

/**
 * The physical sample behind a tested roundup entry (reference entries have none). Created with the entry
 * (status ordered, source not yet set). A vendor loan is overdue once its return-by date has ended in the
 * roundup's time zone while the sample is neither returned nor kept (shared/domain/planning/loan-overdue.ts).
 */
export const sampleSchema = z.object({
  ...entryRecordFields,
  product: productBriefSchema,
  source: sampleSourceSchema.nullable(),
  /** Retail: the shop's order reference. */
  orderReference: z.string().nullable(),
  /** Retail: what it cost. */
  cost: moneySchema.nullable(),
  /** Vendor loan: who lent it (name, e-mail or phone). */
  vendorContact: z.string().nullable(),
  /** Vendor loan: date it must be back, in the roundup's time zone. */
  returnBy: calendarDateSchema.nullable(),
  receivedOn: calendarDateSchema.nullable(),
  returnedOn: calendarDateSchema.nullable(),
  serialNumber: z.string().nullable(),
  conditionNotes: z.string().nullable(),
  /** Firmware/BIOS version the board arrived with. */
  firmwareOnArrival: z.string().nullable(),
  status: sampleStatusSchema,
  overdue: z.boolean(),
  /** Whole days past the return-by date in the roundup's time zone (0 unless overdue). */
  daysOverdue: z.number().int(),
  updatedAt: instantSchema,
});
export type Sample = z.infer<typeof sampleSchema>;
export const sampleListSchema = z.object({ timeZone: z.string(), samples: z.array(sampleSchema) });

/**
 * Partial update. The server checks the merged record: a retail purchase needs an order reference and a
 * cost; a vendor loan needs a contact and a return-by date; received and later statuses need a received
 * date; returned needs a vendor loan and a returned date. Dates keep their order: a loan's return-by date and a
 * returned date are not before the received date (checked here when sent together, and on the merged record).
 */
export const updateSampleRequestSchema = z
  .strictObject({
    source: sampleSourceSchema.nullable(),
    orderReference: optionalTextSchema(120),
    costMinor: amountMinorSchema.nullable(),
    costCurrency: currencySchema.nullable(),
    vendorContact: optionalTextSchema(200),
    returnBy: planningDateSchema.nullable(),
    receivedOn: planningDateSchema.nullable(),
    returnedOn: planningDateSchema.nullable(),
    serialNumber: optionalTextSchema(80),
    conditionNotes: optionalMultiLineText(1000),
    firmwareOnArrival: optionalTextSchema(80),
    status: sampleStatusSchema,
  })
  .partial()
  .superRefine(
    (sample, ctx) => {
      for (const [path, message] of Object.entries(sampleDateOrderProblems(sample))) {
        ctx.addIssue({ code: 'custom', path: [path], message });
      }
    },
    { when: whenValid('returnBy', 'receivedOn', 'returnedOn') },
  );
export type UpdateSampleRequest = z.input<typeof updateSampleRequestSchema>;
export type ParsedUpdateSampleRequest = z.output<typeof updateSampleRequestSchema>;

/** Dates of one sample that cannot all be true, by field (ISO dates compare as text). */
export function sampleDateOrderProblems(sample: {
  receivedOn?: string | null;
  returnBy?: string | null;
  returnedOn?: string | null;
}): Record<string, string> {
  const problems: Record<string, string> = {};
  if (sample.receivedOn && sample.returnBy && sample.returnBy < sample.receivedOn) {
    problems.returnBy = `The return-by date cannot be before the day it arrived (${sample.receivedOn}).`;
  }
  if (sample.receivedOn && sample.returnedOn && sample.returnedOn < sample.receivedOn) {
    problems.returnedOn = 'It cannot go back before it arrived.';
  }
  return problems;
}

export const sampleParamsSchema = pathIdsSchema('id', 'sampleId');

/** An overdue loan as the dashboard lists it. */
export const overdueSampleSchema = sampleSchema.extend({ roundupTitle: z.string() });
export type OverdueSample = z.infer<typeof overdueSampleSchema>;
