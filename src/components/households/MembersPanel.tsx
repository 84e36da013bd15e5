/**
 * The members page of a household (React island): everyone sees the members and can leave; owners
 * also invite by e-mail, withdraw pending invitations, change roles and remove members.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { InvitationJson, MemberJson } from '@/lib/api-types';
import { invitationInput, ROLE_LABELS, ROLE_VALUES, type RoleValue } from '@/lib/household-schemas';
import { Field, FieldError, FormAlert, formMessage, showFailure, useSchemaForm } from '@/components/forms';
import { QueryProvider } from '@/components/QueryProvider';
import { get, request } from '@/components/request';
import { formatInstantDate } from '@/lib/format-date';

interface Props {
  householdId: number;
  me: string;
  myRole: RoleValue;
}

export function MembersPanel(props: Props) {
  return (
    <QueryProvider>
      <Members {...props} />
    </QueryProvider>
  );
}

// Members and invitations change under other people's hands: ask again when the window comes back,
// and show a failure at once rather than retrying it.
const LIVE = { retry: false, refetchOnWindowFocus: true, staleTime: 0 } as const;

function Members({ householdId, me, myRole }: Props) {
  const qc = useQueryClient();
  const base = `/api/households/${householdId}`;
  const isOwner = myRole === 'owner';
  const [notice, setNotice] = useState<{ text: string; tone: 'ok' | 'error' } | null>(null);

  const members = useQuery({ ...LIVE, queryKey: ['members', householdId], queryFn: async () => (await get<{ members: MemberJson[] }>(`${base}/members`)).members });
  const invitations = useQuery({
    ...LIVE,
    queryKey: ['invitations', householdId],
    enabled: isOwner,
    queryFn: async () => (await get<{ invitations: InvitationJson[] }>(`${base}/invitations`)).invitations,
  });
  const refresh = () => qc.invalidateQueries({ queryKey: ['members', householdId] });
  const fail = (e: unknown) => setNotice({ text: e instanceof Error ? e.message : String(e), tone: 'error' });

  const setRole = useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: RoleValue }) => request<unknown>('PATCH', `${base}/members/${encodeURIComponent(userId)}`, { role }),
    onSuccess: (_a, v) => {
      setNotice({ text: `Role changed to ${v.role}.`, tone: 'ok' });
      if (v.userId === me) window.location.reload();
      else void refresh();
    },
    onError: fail,
  });
  const remove = useMutation({
    mutationFn: (userId: string) => request<unknown>('DELETE', `${base}/members/${encodeURIComponent(userId)}`),
    onSuccess: (_a, userId) => {
      if (userId === me) {
        window.location.assign('/households');
        return;
      }
      setNotice({ text: 'Member removed. They lost access at once.', tone: 'ok' });
      void refresh();
    },
    onError: fail,
  });
  const revoke = useMutation({
    mutationFn: (id: number) => request<unknown>('DELETE', `${base}/invitations/${id}`),
    onSuccess: () => {
      setNotice({ text: 'Invitation withdrawn: its link no longer works.', tone: 'ok' });
      void qc.invalidateQueries({ queryKey: ['invitations', householdId] });
    },
    onError: fail,
  });

  return (
    <div className="grid gap-6">
      <FormAlert message={notice?.text ?? null} tone={notice?.tone ?? 'ok'} />
      <section className="card" aria-labelledby="members-h">
        <h2 id="members-h" className="text-xl font-bold">Members</h2>
        {members.isPending ? <p className="mt-2">Loading…</p> : null}
        {members.isError ? <p className="mt-2 text-berry-700" role="alert">{members.error.message}</p> : null}
        <ul className="mt-2 divide-y divide-loam-200" data-testid="member-list">
          {(members.data ?? []).map((m) => (
            <MemberRow key={m.userId} m={m} isMe={m.userId === me} isOwner={isOwner} busy={setRole.isPending || remove.isPending}
              onRole={(role) => setRole.mutate({ userId: m.userId, role })}
              onRemove={() => {
                if (window.confirm(`Remove ${m.name} from this household? They lose access at once.`)) remove.mutate(m.userId);
              }}
            />
          ))}
        </ul>
        <div className="mt-4 border-t border-loam-200 pt-4">
          <button type="button" className="btn-quiet" disabled={remove.isPending}
            onClick={() => {
              if (window.confirm('Leave this household? You will need a new invitation to come back.')) remove.mutate(me);
            }}
          >
            Leave this household
          </button>
        </div>
      </section>
      {isOwner ? <InviteForm base={base} onSent={(email) => {
        setNotice({ text: `Invitation sent to ${email}.`, tone: 'ok' });
        void qc.invalidateQueries({ queryKey: ['invitations', householdId] });
      }} /> : null}
      {isOwner ? (
        <section className="card" aria-labelledby="pending-h">
          <h2 id="pending-h" className="text-xl font-bold">Invitations waiting for an answer</h2>
          {invitations.data?.length === 0 ? <p className="mt-2 text-loam-700">None.</p> : null}
          <ul className="mt-2 divide-y divide-loam-200" data-testid="invitation-list">
            {(invitations.data ?? []).map((inv) => (
              <li key={inv.id} className="flex flex-wrap items-center gap-3 py-3">
                <span className="font-semibold">{inv.email}</span>
                <span className="text-loam-700">as {inv.role} · until {formatInstantDate(inv.expiresAt)}</span>
                <button type="button" className="btn-quiet ml-auto" disabled={revoke.isPending} onClick={() => revoke.mutate(inv.id)} aria-label={`Withdraw the invitation to ${inv.email}`}>
                  Withdraw
                </button>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}

function MemberRow({ m, isMe, isOwner, busy, onRole, onRemove }: { m: MemberJson; isMe: boolean; isOwner: boolean; busy: boolean; onRole: (r: RoleValue) => void; onRemove: () => void }) {
  const [role, setRole] = useState<RoleValue>(m.role);
  const selectId = `role-${m.userId}`;
  return (
    <li className="flex flex-wrap items-center gap-3 py-3" data-testid="member">
      <div className="min-w-48">
        <div className="font-semibold">{m.name}{isMe ? ' (you)' : ''}</div>
        {m.email ? <div className="text-sm text-loam-700">{m.email}</div> : null}
      </div>
      {isOwner ? (
        <div className="ml-auto flex flex-wrap items-center gap-2">
          <label htmlFor={selectId} className="sr-only">Role of {m.name}</label>
          <select id={selectId} className="field min-h-12 w-auto" value={role} onChange={(e) => setRole(e.target.value as RoleValue)}>
            {ROLE_VALUES.map((r) => <option key={r} value={r}>{r}</option>)}
          </select>
          <button type="button" className="btn-quiet" disabled={busy || role === m.role} onClick={() => onRole(role)}>Change role</button>
          {!isMe ? <button type="button" className="btn-danger" disabled={busy} onClick={onRemove} aria-label={`Remove ${m.name}`}>Remove</button> : null}
        </div>
      ) : (
        <span className="ml-auto rounded-full bg-loam-100 px-3 py-1 text-sm font-semibold">{m.role}</span>
      )}
    </li>
  );
}

function InviteForm({ base, onSent }: { base: string; onSent: (email: string) => void }) {
  const form = useSchemaForm(invitationInput, { email: '', role: 'grower' });
  const { errors } = form.formState;
  const invite = useMutation({
    mutationFn: (v: { email: string; role: RoleValue }) => request<unknown>('POST', `${base}/invitations`, v),
    onSuccess: (_a, v) => {
      form.reset();
      onSent(v.email);
    },
    onError: (e) => showFailure(form, e),
  });
  const submit = form.handleSubmit((data) => invite.mutate(data));

  return (
    <form onSubmit={submit} noValidate className="card" aria-labelledby="invite-h">
      <h2 id="invite-h" className="text-xl font-bold">Invite someone</h2>
      <p className="text-loam-700">They get an e-mail with a link that works once, for 7 days.</p>
      <Field id="email" label="Their e-mail" type="email" inputMode="email" autoComplete="off" registration={form.register('email')} error={errors.email?.message} />
      <div className="mt-4">
        <label htmlFor="role" className="block font-semibold">Their role</label>
        <select id="role" {...form.register('role')} className="field mt-1" defaultValue="grower" aria-invalid={errors.role ? true : undefined} aria-describedby={errors.role ? 'role-error' : undefined}>
          {ROLE_VALUES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
        </select>
        <FieldError id="role" error={errors.role?.message} />
      </div>
      <FormAlert message={formMessage(form)} />
      <button type="submit" className="btn-primary mt-6" disabled={invite.isPending}>{invite.isPending ? 'Sending…' : 'Send the invitation'}</button>
    </form>
  );
}
