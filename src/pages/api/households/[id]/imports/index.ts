import { getPool } from '@/db/client';
import { todayIn } from '@/lib/months';
import { householdRoute } from '@/server/authz';
import { householdDatasetOrder } from '@/server/datasets';
import { importEntries, readImportRequest } from '@/server/entry-import';
import { json } from '@/server/http';

/**
 * POST /api/households/{id}/imports (owner, grower), multipart/form-data: file, kind=harvests|purchases,
 * mode=preview|commit, createCrops (JSON list of crops to create first). A food_code shared by two
 * datasets is read by the row's dataset column or "slug:code", else by the household's dataset order. Preview → 200 with rows and
 * errors by row; commit → 201 { ok: true, created } or 422 with the errors, writing nothing.
 */
export const POST = householdRoute('write', async (ctx, a) => {
  const req = await readImportRequest(ctx.request);
  const household = {
    id: a.household.id,
    pint: a.household.units === 'us' ? 'pint_us' : 'pint_imp',
    // A code two datasets share means the food of the household's first dataset (or the row's own).
    datasetOrder: await householdDatasetOrder(getPool(), a.household),
  } as const;
  const { status, body } = await importEntries(household, a.userId, req, todayIn(a.household.timezone));
  return json(body, status);
});
