/**
 * An administrator's FoodData Central upload as the form sends it and the job as the page polls
 * it: one zod schema for the dataset's description, shared by the form and the endpoint.
 */
import { z } from 'zod';
import { datasetSlug } from './dataset-order';
import type { DatasetJobKind, DatasetJobStatus, FdcFormat } from './dataset-jobs';
import type { FdcRowError } from './fdc-csv';
import type { HouseholdChange } from './release-changes';

/** The whole upload (every CSV file together) may be this large. */
export const UPLOAD_MAX_BYTES = 200 * 1024 * 1024;

const text = (max: number, what: string) => z.string().trim().min(1, `Give the ${what}.`).max(max, `The ${what} is at most ${max} characters.`);

/** Which dataset the upload makes (a new slug) or gives a new release (an existing slug). */
export const uploadMeta = z.object({
  slug: datasetSlug,
  name: text(200, 'dataset name'),
  release: text(80, 'release'),
  publisher: text(200, 'publisher'),
  licence: text(200, 'licence'),
});
export type UploadMeta = z.infer<typeof uploadMeta>;

/** GET /api/admin/uploads/{id} and /api/admin/jobs/{id}: a dataset job (an upload or a built-in reload) as the page shows it. */
export interface UploadJobJson extends UploadMeta {
  id: number;
  kind: DatasetJobKind;
  status: DatasetJobStatus;
  format: FdcFormat | null;
  phase: string;
  rowsRead: number;
  bytesRead: number;
  bytesTotal: number;
  foodCount: number;
  amountCount: number;
  errors: FdcRowError[];
  /** For a new release of an existing dataset: households whose figures would move. Null for a new dataset. */
  changes: HouseholdChange[] | null;
  createdAt: string;
}
