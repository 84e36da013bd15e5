/**
 * The plan form and the plan: the grower picks targets (a share of need per nutrient), the basis
 * (the whole year, or every month on its own) and an optional area limit; "Make a plan" asks the
 * planner (POST …/plan). The plan shows as a list a grower can read and change — each crop's m²,
 * expected kg and seed needed against seed kept, the projected shares and the limits in words —
 * and "Turn into plantings" makes one planting per crop (POST …/plantings/from-plan).
 */
import { useMutation } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { FormAlert, formMessage, showFailure, useSchemaForm } from '@/components/forms';
import { useThumbFloat } from '@/components/thumb-float';
import type { GapsResponse } from '@/lib/gap-types';
import { PLAN_BASES, TARGET_PERCENTS, planBody, planForm, type PlanFormValues } from '@/lib/gaps-schemas';
import { formatAmount } from '@/lib/format-number';
import type { ShareNutrientKey } from '@/lib/nutrients';
import { projectYearShares, type YearFigure } from '@/lib/plan-projection';
import { percentText } from '@/lib/share-scale';
import { makePlan, plantFromPlan, type PlanAnswer } from './plan-api';
import { countText } from '@/lib/plural';

const BASIS_LABEL: Record<(typeof PLAN_BASES)[number], string> = {
  year: 'Over the whole year',
  month: 'In every month (fills the lean months too)',
};

export function PlanPanel({ householdId, report, canPlant }: { householdId: number; report: GapsResponse; canPlant: boolean }) {
  const form = useSchemaForm<PlanFormValues, ReturnType<typeof planForm.parse>>(planForm, { targets: {}, basis: 'year', maxAreaM2: '' });
  const [plan, setPlan] = useState<PlanAnswer | null>(null);
  const [areas, setAreas] = useState<Record<string, string>>({});
  const [planted, setPlanted] = useState<number | null>(null);
  const plantedFloat = useThumbFloat(planted);

  const planning = useMutation({
    mutationFn: (body: Parameters<typeof makePlan>[1]) => makePlan(householdId, body),
    onSuccess: (answer) => {
      setPlan(answer);
      setPlanted(null);
      setAreas(Object.fromEntries(answer.crops.map((c) => [c.cropKey, String(Math.round(c.areaM2 * 10) / 10)])));
    },
    onError: (err) => showFailure(form, err),
  });
  const planting = useMutation({
    mutationFn: (crops: { cropKey: string; areaM2: number }[]) => plantFromPlan(householdId, report.year, crops),
    onSuccess: (answer, crops) => setPlanted(Array.isArray(answer.plantings) ? answer.plantings.length : crops.length),
  });

  const kept = useMemo(() => (plan ? plan.crops.filter((c) => Number(areas[c.cropKey]) > 0) : []), [plan, areas]);
  const edited = plan ? plan.crops.some((c) => String(Math.round(c.areaM2 * 10) / 10) !== (areas[c.cropKey] ?? '')) : false;
  const projectedEdit = useMemo(() => {
    const year = Object.fromEntries(report.nutrients.map((n) => [n.key, { home: n.home, need: n.need }])) as Record<ShareNutrientKey, YearFigure>;
    const perM2 = new Map(report.crops.map((c) => [c.key, c.perM2]));
    return projectYearShares(year, kept.map((c) => ({ areaM2: Number(areas[c.cropKey]), perM2: perM2.get(c.cropKey) ?? {} })));
  }, [report, kept, areas]);
  const targets = form.watch('targets');
  const shown = report.nutrients.filter((n) => (plan && plan.projected[n.key] !== undefined) || targets[n.key]);

  return (
    <section aria-labelledby="plan-h" className="rounded-2xl border border-loam-200 bg-white p-4 sm:p-6">
      <h2 id="plan-h" className="text-2xl font-extrabold">
        Plan what to plant
      </h2>
      <p className="mt-1 text-loam-700">
        Choose how much of the need the garden should cover. The planner finds the least added bed area that gets there, with
        sensible limits on how much of one crop a household eats.
      </p>
      <form
        noValidate
        onSubmit={form.handleSubmit((v) => planning.mutate(planBody(report.year, v)))}
        className="mt-4"
        data-testid="plan-form"
      >
        <fieldset>
          <legend className="font-semibold">Targets (share of need from home)</legend>
          <div className="mt-2 grid grid-cols-1 gap-x-4 gap-y-2 sm:grid-cols-2">
            {report.nutrients.map((n) => (
              <div key={n.key} className="flex items-center justify-between gap-2">
                <label htmlFor={`target-${n.key}`}>{n.name}</label>
                <select id={`target-${n.key}`} className="field w-32" {...form.register(`targets.${n.key}`)}>
                  <option value="">no target</option>
                  {TARGET_PERCENTS.map((p) => (
                    <option key={p} value={String(p)}>
                      {p} %
                    </option>
                  ))}
                </select>
              </div>
            ))}
          </div>
          {form.formState.errors.targets?.message ? (
            <p className="mt-2 text-sm font-semibold text-berry-700" role="alert">
              {String(form.formState.errors.targets.message)}
            </p>
          ) : null}
        </fieldset>
        <fieldset className="mt-4">
          <legend className="font-semibold">Cover the need</legend>
          <div className="mt-2 flex flex-wrap gap-2">
            {PLAN_BASES.map((b) => (
              <label key={b} className="chip">
                <input type="radio" value={b} {...form.register('basis')} className="chip-dot" />
                {BASIS_LABEL[b]}
              </label>
            ))}
          </div>
        </fieldset>
        <div className="mt-4">
          <label htmlFor="plan-max-area" className="block font-semibold">
            Most added area, m² <span className="font-normal text-loam-700">(optional)</span>
          </label>
          <input id="plan-max-area" inputMode="decimal" className="field mt-1 w-40" {...form.register('maxAreaM2')} aria-invalid={form.formState.errors.maxAreaM2 ? true : undefined} />
          {form.formState.errors.maxAreaM2 ? <p className="mt-1 text-sm font-semibold text-berry-700">{form.formState.errors.maxAreaM2.message}</p> : null}
        </div>
        <FormAlert message={formMessage(form)} />
        <button type="submit" className="btn-primary mt-4" disabled={planning.isPending}>
          {planning.isPending ? 'Planning…' : 'Make a plan'}
        </button>
      </form>

      {plan ? (
        <div className="mt-6" data-testid="plan" data-status={plan.status}>
          <h3 className="text-xl font-extrabold">
            {plan.status === 'optimal' ? 'The plan' : 'The best plan within the limits'}: {formatAmount(kept.reduce((s, c) => s + Number(areas[c.cropKey]), 0))} m² more
          </h3>
          {plan.status !== 'optimal' ? <p className="caution mt-2">The targets cannot all be met; this plan gets as close as it can. Why:</p> : null}
          {plan.limits.length > 0 ? (
            <ul className="mt-2 list-disc pl-6 text-loam-900" data-testid="plan-limits">
              {plan.limits.map((l, i) => (
                <li key={i}>{l.message}</li>
              ))}
            </ul>
          ) : null}
          {plan.crops.length === 0 ? <p className="mt-3">No crop to add: the targets are met already.</p> : null}
          <ul className="mt-3 divide-y divide-loam-100 rounded-xl border border-loam-200" data-testid="plan-crops">
            {plan.crops.map((c) => {
              const dropped = !(Number(areas[c.cropKey]) > 0);
              return (
                <li key={c.cropKey} className={`grid grid-cols-[1fr_auto] gap-x-3 gap-y-1 p-3 ${dropped ? 'opacity-60' : ''}`} data-testid={`plan-crop-${c.cropKey}`}>
                  <p className="font-bold">{c.name}</p>
                  <div className="flex items-center gap-1">
                    <label htmlFor={`area-${c.cropKey}`} className="sr-only">
                      Area of {c.name}, m²
                    </label>
                    <input
                      id={`area-${c.cropKey}`}
                      inputMode="decimal"
                      className="field w-24 text-right"
                      value={areas[c.cropKey] ?? ''}
                      onChange={(e) => setAreas((a) => ({ ...a, [c.cropKey]: e.target.value }))}
                    />
                    <span>m²</span>
                  </div>
                  <p className="text-sm text-loam-700">
                    about {formatAmount((c.expectedKg * (Number(areas[c.cropKey]) || 0)) / (c.areaM2 || 1))} kg expected ({formatAmount(c.yieldKgM2)} kg/m²
                    {c.ownYield ? ', your own yield' : ', reference yield'})
                  </p>
                  <button type="button" className="btn-quiet min-h-11 text-sm" onClick={() => setAreas((a) => ({ ...a, [c.cropKey]: dropped ? String(Math.round(c.areaM2 * 10) / 10) : '0' }))}>
                    {dropped ? 'Put back' : 'Drop'}
                  </button>
                  <p className="col-span-2 text-sm" data-testid={`seed-${c.cropKey}`}>
                    Seed: {c.seedNeeded === null ? 'no sowing rate in the table' : `${formatAmount((c.seedNeeded.amount * (Number(areas[c.cropKey]) || 0)) / (c.areaM2 || 1))} ${c.seedNeeded.unit === 'g' ? 'g' : 'plants'} needed`}
                    {' · '}
                    {c.seedKept > 0 ? `${formatAmount(c.seedKept)} g kept last season` : 'none kept last season'}
                    {c.seedNeeded !== null && c.seedNeeded.unit === 'g' && c.seedKept > 0 && c.seedKept < (c.seedNeeded.amount * (Number(areas[c.cropKey]) || 0)) / (c.areaM2 || 1) ? ': find the rest' : ''}
                  </p>
                </li>
              );
            })}
          </ul>
          <h4 className="mt-4 font-bold">{edited ? 'Projected over the year, with your changes' : 'Projected share of need'}</h4>
          <ul className="mt-1 grid grid-cols-1 gap-1 sm:grid-cols-2" data-testid="plan-projected">
            {shown.map((n) => (
              <li key={n.key} className="flex justify-between gap-2 tabular-nums">
                <span>{n.name}</span>
                <span className="font-semibold" data-testid={`projected-${n.key}`}>
                  {percentText(n.shareOfNeed)} → {percentText(edited ? projectedEdit[n.key] : (plan.projected[n.key] ?? projectedEdit[n.key]))}
                </span>
              </li>
            ))}
          </ul>
          {edited ? <p className="mt-1 text-sm text-loam-700">Worked out here from the reference crops; make the plan again to place food by month.</p> : null}
          {canPlant ? (
          <div className="mt-4 flex flex-wrap items-center gap-3">
            <button
              type="button"
              className="btn-primary"
              disabled={kept.length === 0 || planting.isPending || planted !== null}
              onClick={() => planting.mutate(kept.map((c) => ({ cropKey: c.cropKey, areaM2: Number(areas[c.cropKey]) })))}
            >
              {planting.isPending ? 'Making plantings…' : 'Turn into plantings'}
            </button>
            {planted !== null ? (
              <p role="status" className={`rounded-xl bg-sprout-100 p-3 font-semibold text-sprout-900 ${plantedFloat}`} data-testid="planted">
                {countText(planted, 'planting')} made for {report.year}.{' '}
                <a className="link" href={`/households/${householdId}/beds`}>
                  See them on the Beds page
                </a>
              </p>
            ) : null}
            {planting.isError ? (
              <p role="alert" className="font-semibold text-berry-700">
                {planting.error.message}
              </p>
            ) : null}
          </div>
          ) : (
            <p className="mt-4 text-loam-700">An owner or grower can turn this plan into plantings.</p>
          )}
        </div>
      ) : null}
    </section>
  );
}
