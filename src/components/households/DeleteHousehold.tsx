/**
 * The danger zone of the settings page (owner only): the exports offered first, then deletion
 * behind a typed confirmation — the button stays disabled until the household's exact name is
 * typed. The server call is DELETE /api/households/{id}, which removes everything in one
 * transaction; on success the browser lands on /households with a notice.
 */
import { useState } from 'react';
import { useMutation } from '@tanstack/react-query';
import { DELETION_REMOVES, deletionConfirmed } from '@/lib/household-settings';
import { FormAlert } from '@/components/forms';
import { ApiError, request } from '@/components/request';

const EXPORTS = [
  { file: 'backup.json', label: 'Whole household backup (JSON)' },
  { file: 'harvests.csv', label: 'Harvests (CSV)' },
  { file: 'purchases.csv', label: 'Bought food (CSV)' },
  { file: 'crops.csv', label: 'Crops (CSV)' },
  { file: 'people.csv', label: 'People (CSV)' },
] as const;

export function DeleteHousehold({ householdId, name }: { householdId: number; name: string }) {
  const [typed, setTyped] = useState('');
  const confirmed = deletionConfirmed(typed, name);
  const remove = useMutation({
    mutationFn: () => request<null>('DELETE', `/api/households/${householdId}`),
    onSuccess: () => window.location.assign('/households?deleted=1'),
  });
  const failure = remove.error ? (remove.error instanceof ApiError ? remove.error.message : 'Something went wrong. Please try again.') : null;
  const busy = remove.isPending || remove.isSuccess;
  const base = `/api/households/${householdId}/exports`;

  return (
    <section className="card mt-6 border-berry-700" aria-labelledby="danger-h" data-testid="danger-zone">
      <h2 id="danger-h" className="text-xl font-bold text-berry-700">Danger zone</h2>
      <div className="mt-3 rounded-xl bg-loam-100 p-3" data-testid="download-first">
        <h3 className="font-bold">Download everything first</h3>
        <p className="text-sm text-loam-700">The backup holds the whole household; the CSV files re-import into a new one.</p>
        <ul className="mt-2 flex flex-wrap gap-2">
          {EXPORTS.map((e) => (
            <li key={e.file}>
              <a className={e.file === 'backup.json' ? 'btn-primary' : 'btn-quiet'} href={`${base}/${e.file}`} download>{e.label}</a>
            </li>
          ))}
        </ul>
      </div>
      <h3 className="mt-5 font-bold">Delete this household</h3>
      <p className="mt-1 text-sm">Deleting “{name}” removes, for everyone:</p>
      <ul className="mt-1 list-disc pl-6 text-sm">
        {DELETION_REMOVES.map((item) => <li key={item}>{item}</li>)}
      </ul>
      <p className="mt-2 font-semibold">It cannot be undone. Members’ own accounts stay.</p>
      <form
        className="mt-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (confirmed && !busy) remove.mutate();
        }}
      >
        <label htmlFor="delete-confirm" className="block font-semibold">Type the household’s name to confirm</label>
        <p id="delete-confirm-hint" className="text-sm text-loam-700">Exactly as it is written: {name}</p>
        <input
          id="delete-confirm"
          className="field mt-1"
          autoComplete="off"
          value={typed}
          aria-describedby="delete-confirm-hint"
          onChange={(e) => setTyped(e.target.value)}
        />
        <FormAlert message={failure} />
        <button type="submit" className="btn-danger mt-4" disabled={!confirmed || busy}>
          {busy ? 'Deleting…' : 'Delete this household for good'}
        </button>
      </form>
    </section>
  );
}
