/**
 * The administrator's FoodData Central upload (React island): the dataset's description and the
 * CSV files, then the job followed by polling its row — bytes and rows read, rejected rows by file,
 * line and column — and, once read, what a new release would change per household before "Apply".
 */
import { useMutation, useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { FormAlert } from '@/components/forms';
import { QueryProvider } from '@/components/QueryProvider';
import { ApiError, get, request } from '@/components/request';
import type { UploadJobJson } from '@/lib/dataset-upload';
import { formatAmount } from '@/lib/format-number';
import { countText } from '@/lib/plural';
import { ProgressBar } from './ProgressBar';

interface DatasetChoice {
  slug: string;
  name: string;
  release: string;
  publisher: string;
  licence: string;
}

const FIELDS = [
  ['slug', 'Slug (an existing one gives that dataset a new release)'],
  ['name', 'Dataset name'],
  ['release', 'Release (e.g. "SR Legacy, April 2018")'],
  ['publisher', 'Publisher'],
  ['licence', 'Licence'],
] as const;
type Meta = Record<(typeof FIELDS)[number][0], string>;

const BLANK: Meta = { slug: '', name: '', release: '', publisher: 'U.S. Department of Agriculture, Agricultural Research Service', licence: 'Public domain (U.S. Government work)' };
const ACTIVE = new Set(['reading', 'applying']);

function JobView({ id }: { id: number }) {
  const job = useQuery({
    queryKey: ['upload', id],
    queryFn: () => get<{ upload: UploadJobJson }>(`/api/admin/uploads/${id}`).then((r) => r.upload),
    refetchInterval: (q) => (q.state.data && !ACTIVE.has(q.state.data.status) ? false : 700),
  });
  const apply = useMutation({ mutationFn: () => request<{ upload: UploadJobJson }>('POST', `/api/admin/uploads/${id}/apply`), onSettled: () => job.refetch() });
  const cancel = useMutation({ mutationFn: () => request('DELETE', `/api/admin/uploads/${id}`), onSettled: () => job.refetch() });
  const j = apply.data?.upload ?? job.data;
  if (!j) return <p className="mt-4">Starting…</p>;
  const busy = ACTIVE.has(j.status) || apply.isPending;
  return (
    <section className="card mt-6" aria-live="polite" data-testid="upload-job" data-status={apply.isPending ? 'applying' : j.status}>
      <h2 className="text-xl font-bold">
        {j.name} · {j.release} <span className="font-mono text-base">({j.slug})</span>
      </h2>
      <p className="mt-1 font-semibold" data-testid="upload-phase">
        {apply.isPending ? 'Loading into the database…' : j.phase}
      </p>
      <ProgressBar done={j.bytesRead} total={j.bytesTotal} label="Read so far" />
      <p className="mt-1 text-sm text-loam-700">
        {formatAmount(j.bytesRead)} of {countText(j.bytesTotal, 'byte')}, {countText(j.rowsRead, 'row')} read · {countText(j.foodCount, 'food')},{' '}
        {countText(j.amountCount, 'nutrient amount')}{j.format ? ` · ${j.format === 'foundation' ? 'Foundation Foods' : 'SR Legacy'}` : ''}
      </p>
      {j.errors.length > 0 ? (
        <div className="mt-4 overflow-x-auto" tabIndex={0} role="region" aria-label="Rows refused">
          <h3 className="font-bold">Rows refused — nothing was loaded</h3>
          <table className="mt-2 w-full text-left text-sm" data-testid="upload-errors">
            <thead>
              <tr><th className="p-1">File</th><th className="p-1">Line</th><th className="p-1">Column</th><th className="p-1">Problem</th></tr>
            </thead>
            <tbody>
              {j.errors.map((e, i) => (
                <tr key={i} className="border-t border-loam-200"><td className="p-1">{e.file}</td><td className="p-1 tabular-nums">{e.line}</td><td className="p-1">{e.column}</td><td className="p-1">{e.message}</td></tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {j.status === 'ready' && !apply.isPending ? (
        <div className="mt-4" data-testid="upload-changes">
          {j.changes === null ? (
            <p>A new dataset: no household uses it yet.</p>
          ) : j.changes.length === 0 ? (
            <p>A new release of {j.slug}: no household’s energy or protein would move.</p>
          ) : (
            <>
              <h3 className="font-bold">A new release of {j.slug}: these households’ figures would move</h3>
              <ul className="mt-2 grid gap-1 text-sm">
                {j.changes.map((c) => (
                  <li key={c.householdId}>
                    {c.householdName} (#{c.householdId}), {countText(c.entries, 'entry')}: energy {formatAmount(c.kcalBefore)} → {formatAmount(c.kcalAfter)} kcal, protein{' '}
                    {formatAmount(c.proteinBefore)} → {formatAmount(c.proteinAfter)} g
                    {c.foodsDropped.length ? ` · foods no longer in the release: ${c.foodsDropped.join(', ')}` : ''}
                  </li>
                ))}
              </ul>
            </>
          )}
          <div className="mt-4 flex flex-wrap gap-2">
            <button type="button" className="btn-primary" onClick={() => apply.mutate()} disabled={busy}>Apply this release</button>
            <button type="button" className="btn-quiet" onClick={() => cancel.mutate()} disabled={busy}>Cancel</button>
          </div>
        </div>
      ) : null}
      {j.status === 'applied' ? (
        <p className="mt-4">
          Loaded. <a className="underline" href={`/foods?dataset=${j.slug}`}>Search its foods</a>.
        </p>
      ) : null}
      <FormAlert message={apply.error ? (apply.error as Error).message : cancel.error ? (cancel.error as Error).message : null} />
    </section>
  );
}

function Upload({ datasets, recent }: { datasets: DatasetChoice[]; recent: UploadJobJson[] }) {
  const [meta, setMeta] = useState<Meta>(BLANK);
  const [files, setFiles] = useState<File[]>([]);
  const [jobId, setJobId] = useState<number | null>(null);
  const start = useMutation({
    mutationFn: () => {
      const form = new FormData();
      for (const [k, v] of Object.entries(meta)) form.set(k, v);
      for (const f of files) form.append('files', f, f.name);
      return request<{ upload: UploadJobJson }>('POST', '/api/admin/uploads', form);
    },
    onSuccess: (r) => setJobId(r.upload.id),
  });
  const fieldErrors = start.error instanceof ApiError ? start.error.fields : {};

  function pick(slug: string) {
    const d = datasets.find((x) => x.slug === slug);
    setMeta(d ? { ...d, release: '' } : { ...meta, slug });
  }

  function submit(e: FormEvent) {
    e.preventDefault();
    setJobId(null);
    start.mutate();
  }

  return (
    <>
      <form onSubmit={submit} className="card grid max-w-2xl gap-3" noValidate data-testid="upload-form">
        <label className="block font-semibold" htmlFor="up-existing">New release of</label>
        <select id="up-existing" className="field" value={datasets.some((d) => d.slug === meta.slug) ? meta.slug : ''} onChange={(e) => pick(e.target.value)}>
          <option value="">— a new dataset —</option>
          {datasets.map((d) => (
            <option key={d.slug} value={d.slug}>{d.name} ({d.slug}, now {d.release})</option>
          ))}
        </select>
        {FIELDS.map(([k, label]) => (
          <div key={k}>
            <label className="block font-semibold" htmlFor={`up-${k}`}>{label}</label>
            <input id={`up-${k}`} name={k} className="field mt-1" value={meta[k]} onChange={(e) => setMeta({ ...meta, [k]: e.target.value })} aria-invalid={fieldErrors[k] ? true : undefined} />
            {fieldErrors[k] ? <p className="mt-1 text-sm font-semibold text-berry-700">{fieldErrors[k]}</p> : null}
          </div>
        ))}
        <div>
          <label className="block font-semibold" htmlFor="up-files">CSV files of the download</label>
          <input id="up-files" name="files" type="file" accept=".csv,text/csv" multiple className="mt-1 block" onChange={(e) => setFiles([...(e.target.files ?? [])])} />
          <p className="mt-1 text-sm text-loam-700">{files.length ? files.map((f) => f.name).join(', ') : 'No files chosen yet.'}</p>
        </div>
        <FormAlert message={start.error ? (start.error as Error).message : null} />
        <button type="submit" className="btn-primary" disabled={start.isPending || files.length === 0}>
          {start.isPending ? 'Uploading…' : 'Upload and check'}
        </button>
      </form>
      {jobId !== null ? <JobView key={jobId} id={jobId} /> : null}
      {recent.length > 0 ? (
        <section className="mt-8">
          <h2 className="text-xl font-bold">Recent uploads</h2>
          <ul className="mt-2 grid gap-1 text-sm">
            {recent.map((u) => (
              <li key={u.id}>
                #{u.id} · {u.slug} · {u.release} · {u.status} · {u.phase}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </>
  );
}

export function AdminUpload(props: { datasets: DatasetChoice[]; recent: UploadJobJson[] }) {
  return (
    <QueryProvider>
      <Upload {...props} />
    </QueryProvider>
  );
}
