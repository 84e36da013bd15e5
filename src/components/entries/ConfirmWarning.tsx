/**
 * A question before saving: what looks odd, in sentences, and a button to save it as typed. The
 * harvest and people forms use it for figures that are unusual but possible (a 120 kg weighing,
 * a 70 cm adult), which they question instead of refusing or silently accepting.
 */
export function ConfirmWarning({ messages, confirmLabel, onConfirm, busy = false, testId }: { messages: readonly string[]; confirmLabel: string; onConfirm: () => void; busy?: boolean; testId: string }) {
  return (
    <div role="alert" data-testid={testId} className="mt-4 rounded-xl border-2 border-rind-700 bg-rind-100 p-3 text-loam-900">
      {messages.map((m) => (
        <p key={m} className="font-semibold">
          {m}
        </p>
      ))}
      <button type="button" className="btn-quiet mt-3" disabled={busy} onClick={onConfirm}>
        {confirmLabel}
      </button>
    </div>
  );
}
