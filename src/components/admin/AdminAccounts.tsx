/**
 * The administrator's account list (React island): search by address or name, disable or enable
 * an account, send a new confirmation mail to an address not yet confirmed.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { FormAlert } from '@/components/forms';
import { QueryProvider } from '@/components/QueryProvider';
import { get, qs, request } from '@/components/request';
import { countText } from '@/lib/plural';

interface Account {
  id: string;
  name: string;
  email: string;
  emailVerified: boolean;
  disabled: boolean;
  admin: boolean;
  households: number;
}

function Accounts({ selfId }: { selfId: string }) {
  const [text, setText] = useState('');
  const [q, setQ] = useState('');
  useEffect(() => {
    const t = setTimeout(() => setQ(text.trim()), 250);
    return () => clearTimeout(t);
  }, [text]);
  const client = useQueryClient();
  const list = useQuery({ queryKey: ['admin-accounts', q], queryFn: () => get<{ accounts: Account[] }>(`/api/admin/accounts${qs({ q })}`) });
  const [note, setNote] = useState<string | null>(null);
  const disable = useMutation({
    mutationFn: (a: { id: string; disabled: boolean }) => request('PATCH', `/api/admin/accounts/${a.id}`, { disabled: a.disabled }),
    onSuccess: (_r, a) => {
      setNote(a.disabled ? 'Disabled: signed out everywhere, sign-in refused.' : 'Enabled again.');
      void client.invalidateQueries({ queryKey: ['admin-accounts'] });
    },
  });
  const resend = useMutation({
    mutationFn: (id: string) => request('POST', `/api/admin/accounts/${id}/confirmation`),
    onSuccess: () => setNote('A new confirmation mail is on its way.'),
  });
  const failure = (disable.error ?? resend.error) as Error | null;

  return (
    <section aria-label="Accounts">
      <label htmlFor="account-q" className="block font-semibold">Search by address or name</label>
      <input id="account-q" type="search" className="field mt-1 max-w-xl" value={text} onChange={(e) => setText(e.target.value)} autoComplete="off" />
      <FormAlert message={failure ? failure.message : null} />
      <FormAlert message={note} tone="ok" />
      {list.isError ? <FormAlert message={(list.error as Error).message} /> : null}
      <ul className="mt-4 grid gap-2" data-testid="admin-accounts">
        {(list.data?.accounts ?? []).map((a) => (
          <li key={a.id} className="card flex flex-wrap items-center justify-between gap-3">
            <span>
              <span className="font-semibold">{a.name}</span> <span className="text-loam-700">{a.email}</span>
              <span className="block text-sm text-loam-700">
                {a.emailVerified ? 'confirmed' : 'not confirmed'} · {countText(a.households, 'household')}{a.admin ? ' · site administrator' : ''}
                {a.disabled ? ' · DISABLED' : ''}
              </span>
            </span>
            <span className="flex flex-wrap gap-2">
              {!a.emailVerified ? (
                <button type="button" className="btn-quiet" disabled={resend.isPending} aria-label={`Resend confirmation to ${a.email}`} onClick={() => resend.mutate(a.id)}>
                  Resend confirmation
                </button>
              ) : null}
              {a.id !== selfId ? (
                <button
                  type="button"
                  className={a.disabled ? 'btn-quiet' : 'btn-danger'}
                  disabled={disable.isPending}
                  aria-label={`${a.disabled ? 'Enable' : 'Disable'} ${a.email}`}
                  onClick={() => disable.mutate({ id: a.id, disabled: !a.disabled })}
                >
                  {a.disabled ? 'Enable' : 'Disable'}
                </button>
              ) : null}
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}

export function AdminAccounts({ selfId }: { selfId: string }) {
  return (
    <QueryProvider>
      <Accounts selfId={selfId} />
    </QueryProvider>
  );
}
