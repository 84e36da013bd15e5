/**
 * Loading a built-in dataset (SR28, IFCT 2017) again from its package (React island on /admin):
 * a button per dataset, a confirmation that says what it changes, then the job followed by polling
 * GET /api/admin/jobs/{id} until it is loaded or failed; the latest reloads below.
 */
import { useMutation, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { FormAlert } from '@/components/forms';
import { QueryProvider } from '@/components/QueryProvider';
import { get, request } from '@/components/request';
import type { UploadJobJson } from '@/lib/dataset-upload';
import { formatAmount } from '@/lib/format-number';
import { ProgressBar } from './ProgressBar';

export interface BuiltinChoice {
  slug: string;
  name: string;
  /** The packaged release, and the one loaded now (null when the dataset is not loaded yet). */
  release: string;
  loadedRelease: string | null;
}

const when = (iso: string) => iso.replace('T', ' ').slice(0, 16) + ' UTC';

function JobProgress({ id }: { id: number }) {
  const job = useQuery({
    queryKey: ['dataset-job', id],
    queryFn: () => get<{ job: UploadJobJson }>(`/api/admin/jobs/${id}`).then((r) => r.job),
    refetchInterval: (q) => (q.state.data && q.state.data.status !== 'applying' ? false : 700),
  });
  const j = job.data;
  if (!j) return <p className="mt-3">Starting…</p>;
  const total = j.bytesTotal;
  return (
    <div className="mt-3" aria-live="polite" data-testid="reload-job" data-status={j.status}>
      <p className="font-semibold" data-testid="reload-phase">
        {j.status === 'applied' ? 'Loaded: ' : j.status === 'failed' ? 'Failed: ' : ''}
        {j.phase}
      </p>
      <ProgressBar done={j.status === 'applied' ? total : j.rowsRead} total={total} label={`Loading ${j.slug}`} />
      {total > 0 ? (
        <p className="mt-1 text-sm text-loam-700">
          {formatAmount(j.rowsRead)} of {formatAmount(total)} rows written ({formatAmount(j.foodCount)} foods, {formatAmount(j.amountCount)} nutrient amounts)
        </p>
      ) : null}
    </div>
  );
}

function Dataset({ d }: { d: BuiltinChoice }) {
  const [asking, setAsking] = useState(false);
  const [jobId, setJobId] = useState<number | null>(null);
  const start = useMutation({
    mutationFn: () => request<{ job: UploadJobJson }>('POST', `/api/admin/datasets/${d.slug}/reload`),
    onSuccess: (r) => {
      setAsking(false);
      setJobId(r.job.id);
    },
  });
  return (
    <li className="card" data-testid={`builtin-${d.slug}`}>
      <h4 className="text-lg font-bold">
        {d.name} <span className="font-mono text-base">({d.slug})</span>
      </h4>
      <p className="text-sm text-loam-700">
        In the package: {d.release}. {d.loadedRelease === null ? 'Not loaded yet.' : `Loaded now: ${d.loadedRelease}.`}
      </p>
      {asking ? (
        <div className="caution mt-3">
          <p>
            This replaces the foods and nutrient amounts of {d.slug} with the packaged release, for every household that uses it. Their figures may move, and
            every stored share report is worked out again. Entries keep their foods.
          </p>
          <div className="mt-3 flex flex-wrap gap-2">
            <button type="button" className="btn-primary" onClick={() => start.mutate()} disabled={start.isPending}>
              {start.isPending ? 'Starting…' : `Load ${d.slug} again`}
            </button>
            <button type="button" className="btn-quiet" onClick={() => setAsking(false)} disabled={start.isPending}>
              Keep it as it is
            </button>
          </div>
        </div>
      ) : (
        <button type="button" className="btn-quiet mt-3" onClick={() => setAsking(true)}>
          Load again from the package…
        </button>
      )}
      <FormAlert message={start.error ? (start.error as Error).message : null} />
      {jobId !== null ? <JobProgress key={jobId} id={jobId} /> : null}
    </li>
  );
}

function Reloads({ builtins, recent }: { builtins: BuiltinChoice[]; recent: UploadJobJson[] }) {
  return (
    <>
      <ul className="mt-3 grid gap-3 md:grid-cols-2">
        {builtins.map((d) => (
          <Dataset key={d.slug} d={d} />
        ))}
      </ul>
      {recent.length > 0 ? (
        <>
          <h4 className="mt-4 font-bold">Latest loads from the packages</h4>
          <ul className="mt-1 grid gap-1 text-sm" data-testid="builtin-jobs">
            {recent.map((j) => (
              <li key={j.id}>
                #{j.id} · <span className="font-mono">{j.slug}</span> · {when(j.createdAt)} · {j.status} · {j.phase}
              </li>
            ))}
          </ul>
        </>
      ) : null}
    </>
  );
}

export function BuiltinReload(props: { builtins: BuiltinChoice[]; recent: UploadJobJson[] }) {
  return (
    <QueryProvider>
      <Reloads {...props} />
    </QueryProvider>
  );
}
