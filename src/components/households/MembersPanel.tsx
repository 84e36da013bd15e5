/**
 * The members page of a household (React island): everyone sees the members and can leave; owners
 * also invite by e-mail, withdraw pending invitations, change roles and remove members.
 */
import { QueryClient, QueryClientProvider, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRef, useState, type FormEvent } from 'react';
import { fieldErrors } from '../../lib/account-schemas';
import { invitationInput, ROLE_LABELS, ROLE_VALUES, type RoleValue } from '../../lib/household-schemas';
import { answerMessage, Field, FieldError, FormAlert, focusFirstError, sendJson, type FieldErrors, type JsonAnswer } from '../forms';

interface Member {
  userId: string;
  role: RoleValue;
  name: string;
  email: string;
}
interface Invitation {
  id: number;
  email: string;
  role: RoleValue;
  expiresAt: string;
}
interface Props {
  householdId: number;
  me: string;
  myRole: RoleValue;
}

class AnswerError extends Error {
  constructor(readonly answer: JsonAnswer) {
    super(answerMessage(answer));
  }
}

async function call(method: string, url: string, body?: unknown, ok = [200, 201, 204]): Promise<JsonAnswer> {
  const a = await sendJson(method, url, body);
  if (!ok.includes(a.status)) throw new AnswerError(a);
  return a;
}

export function MembersPanel(props: Props) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { retry: false, refetchOnWindowFocus: true } } }));
  return (
    <QueryClientProvider client={client}>
      <Members {...props} />
    </QueryClientProvider>
  );
}

function Members({ householdId, me, myRole }: Props) {
  const qc = useQueryClient();
  const base = `/api/households/${householdId}`;
  const isOwner = myRole === 'owner';
  const [notice, setNotice] = useState<{ text: string; tone: 'ok' | 'error' } | null>(null);

  const members = useQuery({ queryKey: ['members', householdId], queryFn: async () => (await call('GET', `${base}/members`)).body.members as Member[] });
  const invitations = useQuery({
    queryKey: ['invitations', householdId],
    enabled: isOwner,
    queryFn: async () => (await call('GET', `${base}/invitations`)).body.invitations as Invitation[],
  });
  const refresh = () => qc.invalidateQueries({ queryKey: ['members', householdId] });
  const fail = (e: unknown) => setNotice({ text: e instanceof Error ? e.message : String(e), tone: 'error' });

  const setRole = useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: RoleValue }) => call('PATCH', `${base}/members/${encodeURIComponent(userId)}`, { role }),
    onSuccess: (_a, v) => {
      setNotice({ text: `Role changed to ${v.role}.`, tone: 'ok' });
      if (v.userId === me) window.location.reload();
      else void refresh();
    },
    onError: fail,
  });
  const remove = useMutation({
    mutationFn: (userId: string) => call('DELETE', `${base}/members/${encodeURIComponent(userId)}`),
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
    mutationFn: (id: number) => call('DELETE', `${base}/invitations/${id}`),
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
                <span className="text-loam-700">as {inv.role} · until {new Date(inv.expiresAt).toLocaleDateString()}</span>
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

function MemberRow({ m, isMe, isOwner, busy, onRole, onRemove }: { m: Member; isMe: boolean; isOwner: boolean; busy: boolean; onRole: (r: RoleValue) => void; onRemove: () => void }) {
  const [role, setRole] = useState<RoleValue>(m.role);
  const selectId = `role-${m.userId}`;
  return (
    <li className="flex flex-wrap items-center gap-3 py-3" data-testid="member">
      <div className="min-w-48">
        <div className="font-semibold">{m.name}{isMe ? ' (you)' : ''}</div>
        <div className="text-sm text-loam-700">{m.email}</div>
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
  const formRef = useRef<HTMLFormElement>(null);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [alert, setAlert] = useState<string | null>(null);
  const invite = useMutation({
    mutationFn: (v: { email: string; role: RoleValue }) => call('POST', `${base}/invitations`, v),
    onSuccess: (_a, v) => {
      formRef.current?.reset();
      onSent(v.email);
    },
    onError: (e) => {
      if (e instanceof AnswerError && e.answer.body?.error?.fields) setErrors(e.answer.body.error.fields);
      setAlert(e.message);
    },
  });

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setAlert(null);
    const f = new FormData(e.currentTarget);
    const parsed = invitationInput.safeParse({ email: String(f.get('email') ?? ''), role: String(f.get('role') ?? '') });
    const errs = fieldErrors(parsed);
    setErrors(errs);
    if (!parsed.success) return focusFirstError(formRef.current, errs);
    invite.mutate(parsed.data);
  }

  return (
    <form ref={formRef} onSubmit={submit} noValidate className="card" aria-labelledby="invite-h">
      <h2 id="invite-h" className="text-xl font-bold">Invite someone</h2>
      <p className="text-loam-700">They get an e-mail with a link that works once, for 7 days.</p>
      <Field id="email" label="Their e-mail" type="email" inputMode="email" autoComplete="off" error={errors.email} />
      <div className="mt-4">
        <label htmlFor="role" className="block font-semibold">Their role</label>
        <select id="role" name="role" className="field mt-1" defaultValue="grower" aria-invalid={errors.role ? true : undefined} aria-describedby={errors.role ? 'role-error' : undefined}>
          {ROLE_VALUES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
        </select>
        <FieldError id="role" error={errors.role} />
      </div>
      <FormAlert message={alert} />
      <button type="submit" className="btn-primary mt-6" disabled={invite.isPending}>{invite.isPending ? 'Sending…' : 'Send the invitation'}</button>
    </form>
  );
}
