/**
 * The FoodData Central formats an upload may be and the life of an upload job, as plain lists the
 * schema's enums import (kept apart from the CSV reader so the schema pulls in nothing else).
 */
export const FDC_FORMATS = ['sr_legacy', 'foundation'] as const;
export type FdcFormat = (typeof FDC_FORMATS)[number];

/**
 * The life of a job. An upload: reading → ready (or failed) → applying → applied, or cancelled. A
 * reload of a built-in dataset: applying → applied (or failed). Reading and applying are running.
 */
export const DATASET_JOB_STATUSES = ['reading', 'ready', 'failed', 'applying', 'applied', 'cancelled'] as const;
export type DatasetJobStatus = (typeof DATASET_JOB_STATUSES)[number];

/** What a job does: read and apply an administrator's FDC upload, or load a dataset Selfsown ships. */
export const DATASET_JOB_KINDS = ['fdc_upload', 'builtin_load'] as const;
export type DatasetJobKind = (typeof DATASET_JOB_KINDS)[number];

/** The statuses of a job that a server process is working on. */
export const RUNNING_JOB_STATUSES = ['reading', 'applying'] as const satisfies readonly DatasetJobStatus[];
