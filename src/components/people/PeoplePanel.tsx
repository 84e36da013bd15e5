/**
 * People who eat in the household: list, add, edit and remove (owners), each with
 * their daily energy need and what it rests on. The form (PersonForm.tsx) is react-hook-form,
 * checked with the shared zod schema of src/lib/people-schemas.ts before sending and again by the
 * API; heights and weights are shown and typed in the household's units.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { PersonJson, PersonSummaryJson } from '@/lib/api-types';
import type { UnitSystem } from '@/lib/units';
import { Alert, ConfirmDelete } from '@/components/entries/ui';
import { QueryProvider } from '@/components/QueryProvider';
import { get, request } from '@/components/request';
import { PersonCard, PersonSummaryCard } from './PersonCard';
import { PersonForm } from './PersonForm';

interface Props {
  householdId: number;
  canWrite: boolean;
  /** The household's units: ft, in and lb in a US-units household (the API stays metric). */
  units?: UnitSystem;
}

export default function PeoplePanel(props: Props) {
  return (
    <QueryProvider>
      <People {...props} />
    </QueryProvider>
  );
}

/** Owners get whole people; growers and viewers a summary without body data (src/lib/privacy.ts). */
type PeopleList = { month: string; people: (PersonJson | PersonSummaryJson)[] };

function People({ householdId, canWrite, units = 'metric' }: Props) {
  const base = `/api/households/${householdId}/people`;
  const key = ['people', householdId];
  const client = useQueryClient();
  const list = useQuery({ queryKey: key, queryFn: () => get<PeopleList>(base) });
  const [editing, setEditing] = useState<number | 'new' | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const remove = useMutation({
    mutationFn: (id: number) => request<null>('DELETE', `${base}/${id}`),
    onSuccess: async () => {
      setNotice('Removed.');
      await client.invalidateQueries({ queryKey: key });
    },
  });

  const people = list.data?.people ?? [];
  const month = list.data?.month ?? '';
  return (
    <div>
      {list.isPending ? <p>Loading…</p> : null}
      {list.isError ? <Alert message={list.error.message} /> : null}
      {remove.isError ? <Alert message={remove.error.message} /> : null}
      <Alert message={notice} tone="ok" />
      {list.data && people.length === 0 ? (
        <p className="card mt-4 text-lg">Nobody is listed yet. Add everyone who eats from the household’s food, guests who stay for weeks included.</p>
      ) : null}
      <ul className="mt-4 grid gap-4" data-testid="people-list">
        {people.map((p) =>
          'bodyDataHidden' in p ? (
            <li key={p.id} className="card" data-testid="person">
              <PersonSummaryCard person={p} />
            </li>
          ) : editing === p.id ? (
            <li key={p.id} className="card">
              <PersonForm
                title={`Change ${p.name}`}
                initial={p}
                units={units}
                month={month}
                onCancel={() => setEditing(null)}
                onSave={async (body) => {
                  await request('PATCH', `${base}/${p.id}`, body);
                  await client.invalidateQueries({ queryKey: key });
                  setEditing(null);
                  setNotice(`Saved ${body.name}.`);
                }}
              />
            </li>
          ) : (
            <li key={p.id} className="card" data-testid="person">
              <PersonCard person={p} units={units} />
              {canWrite ? (
                <div className="mt-4 flex flex-wrap gap-2">
                  <button type="button" className="btn-quiet" onClick={() => (setNotice(null), setEditing(p.id))}>
                    Change
                  </button>
                  <ConfirmDelete what={p.name} label="Remove" busy={remove.isPending} onConfirm={() => remove.mutate(p.id)} />
                </div>
              ) : null}
            </li>
          ),
        )}
      </ul>
      {canWrite ? (
        editing === 'new' ? (
          <div className="card mt-4">
            <PersonForm
              title="Add a person"
              units={units}
              month={month}
              onCancel={() => setEditing(null)}
              onSave={async (body) => {
                await request('POST', base, body);
                await client.invalidateQueries({ queryKey: key });
                setEditing(null);
                setNotice(`Added ${body.name}.`);
              }}
            />
          </div>
        ) : (
          <button type="button" className="btn-primary mt-4" onClick={() => (setNotice(null), setEditing('new'))}>
            Add a person
          </button>
        )
      ) : (
        <p className="mt-4 text-loam-700" data-testid="people-owner-only">
          Ages, sizes and pregnancies stay with the household’s owners: an owner adds and changes people. You see each person’s
          name and the energy they need.
        </p>
      )}
    </div>
  );
}
