/**
 * The FoodData Central formats an upload may be and the life of an upload job, as plain lists the
 * schema's enums import (kept apart from the CSV reader so the schema pulls in nothing else).
 */
export const FDC_FORMATS = ['sr_legacy', 'foundation'] as const;
export type FdcFormat = (typeof FDC_FORMATS)[number];

/** The life of an upload job: reading → ready (or failed) → applying → applied, or cancelled. */
export const DATASET_JOB_STATUSES = ['reading', 'ready', 'failed', 'applying', 'applied', 'cancelled'] as const;
export type DatasetJobStatus = (typeof DATASET_JOB_STATUSES)[number];
