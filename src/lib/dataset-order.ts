/**
 * A household's order of food composition datasets for search, stored as comma-separated slugs,
 * and the shape GET /api/datasets answers with. Shared by the settings form and the endpoint.
 */
import { z } from 'zod';

/** One dataset as the API lists it. */
export interface DatasetSummary {
  slug: string;
  name: string;
  release: string;
  publisher: string;
  licence: string;
  foodCount: number;
}

/** A dataset slug: lower-case letters, digits and dashes, 1–40 long (e.g. usda-sr28, ifct2017). */
export const datasetSlug = z.string().trim().regex(/^[a-z0-9][a-z0-9-]{0,39}$/, 'A dataset slug is 1–40 lower-case letters, digits or dashes.');

/** PUT /api/households/{id}/datasets: the slugs in the order to search them, each once. */
export const datasetOrderBody = z.object({
  order: z
    .array(datasetSlug)
    .min(1, 'Name at least one dataset.')
    .max(20)
    .refine((a) => new Set(a).size === a.length, 'Name each dataset once.'),
});

/** The stored text as slugs; null or blank is no order. Example: parseDatasetOrder('ifct2017,usda-sr28') → ['ifct2017', 'usda-sr28'] */
export function parseDatasetOrder(stored: string | null | undefined): string[] {
  return (stored ?? '').split(',').map((s) => s.trim()).filter(Boolean);
}
