/** The "join this household" button on /invite/{token} (React island), a TanStack Query mutation. */
import { useMutation } from '@tanstack/react-query';
import { FormAlert } from '@/components/forms';
import { QueryProvider } from '@/components/QueryProvider';
import { request } from '@/components/request';

interface Props {
  token: string;
  householdName: string;
}

export function AcceptInvitation(props: Props) {
  return (
    <QueryProvider>
      <AcceptButton {...props} />
    </QueryProvider>
  );
}

function AcceptButton({ token, householdName }: Props) {
  const accept = useMutation({
    mutationFn: () => request<{ householdId: number }>('POST', '/api/invitations/accept', { token }),
    onSuccess: (a) => window.location.assign(`/households/${a.householdId}`),
  });
  // Joined: the button stays busy while the household's page loads.
  const busy = accept.isPending || accept.isSuccess;
  return (
    <div>
      <button type="button" className="btn-primary mt-6" onClick={() => accept.mutate()} disabled={busy}>
        {busy ? 'Joining…' : `Join ${householdName}`}
      </button>
      <FormAlert message={accept.error?.message ?? null} />
    </div>
  );
}
