/** The "join this household" button on /invite/{token} (React island). */
import { useState } from 'react';
import { answerMessage, FormAlert, sendJson } from '../forms';

export function AcceptInvitation({ token, householdName }: { token: string; householdName: string }) {
  const [busy, setBusy] = useState(false);
  const [alert, setAlert] = useState<string | null>(null);
  async function accept() {
    setBusy(true);
    setAlert(null);
    const a = await sendJson('POST', '/api/invitations/accept', { token });
    if (a.status === 200) {
      window.location.assign(`/households/${a.body.householdId}`);
      return;
    }
    setBusy(false);
    setAlert(answerMessage(a));
  }
  return (
    <div>
      <button type="button" className="btn-primary mt-6" onClick={accept} disabled={busy}>
        {busy ? 'Joining…' : `Join ${householdName}`}
      </button>
      <FormAlert message={alert} />
    </div>
  );
}
