/**
 * The landing page's live preview: the demo household's home share over its current growing year,
 * read-only and without any member or person data. The demo is found by its owner's account
 * (`npm start` seeds it, src/cli/seed-demo.ts); without one there is no preview. The answer is
 * kept a minute per process: signed-out visitors should not each cost a share report, and a
 * second app server keeping its own copy changes nothing.
 */
import { and, asc, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { households, memberships, user } from '@/db/schema';
import { growingYear, growingYearLabel } from '@/lib/growing-year';
import { currentMonth } from './people';
import { householdShare } from './share-data';

/** The demo owner's address: src/cli/seed-demo.ts creates the account under it. */
export const DEMO_OWNER_EMAIL = 'demo@selfsown.invalid';
const KEEP_MS = 60 * 1000;

export interface DemoPreview {
  name: string;
  /** The growing year shown, e.g. '2026/27'. */
  yearLabel: string;
  /** Home share of the energy and protein need over the year so far; null when not known. */
  energyShare: number | null;
  proteinShare: number | null;
  months: { month: string; energyShare: number | null; future: boolean; beforeRecords: boolean }[];
}

let kept: { at: number; value: DemoPreview | null } | null = null;

/** The preview, or null when there is no demo household. */
export async function demoPreview(now: Date = new Date()): Promise<DemoPreview | null> {
  if (kept && now.getTime() - kept.at < KEEP_MS) return kept.value;
  const value = await readPreview(now);
  // "No demo" is one cheap query and may change at any time (a seed): only a found preview is kept.
  kept = value ? { at: now.getTime(), value } : null;
  return value;
}

async function readPreview(now: Date): Promise<DemoPreview | null> {
  const [row] = await getDb()
    .select({ household: households })
    .from(memberships)
    .innerJoin(user, eq(user.id, memberships.userId))
    .innerJoin(households, eq(households.id, memberships.householdId))
    .where(and(eq(user.email, DEMO_OWNER_EMAIL), eq(memberships.role, 'owner')))
    .orderBy(asc(households.id))
    .limit(1);
  if (!row) return null;
  const h = row.household;
  const range = growingYear(currentMonth(h.timezone, now), h.yearStartMonth);
  const share = await householdShare(h, range.from, range.to, undefined, now);
  return {
    name: h.name,
    yearLabel: growingYearLabel(range),
    energyShare: share.headline?.values.energy_kcal.shareOfNeed ?? null,
    proteinShare: share.headline?.values.protein_g.shareOfNeed ?? null,
    months: share.months.map((m) => ({ month: m.month, energyShare: m.values.energy_kcal.shareOfNeed, future: m.future, beforeRecords: m.beforeRecords })),
  };
}
