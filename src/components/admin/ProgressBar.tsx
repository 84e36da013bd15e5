/** A job's progress as a bar with its share in words for screen readers (admin pages). */
export function ProgressBar({ done, total, label }: { done: number; total: number; label: string }) {
  const pct = total > 0 ? Math.min(100, Math.round((100 * done) / total)) : 0;
  return (
    <div className="mt-2 h-3 overflow-hidden rounded-full bg-loam-200" role="progressbar" aria-valuenow={pct} aria-valuemin={0} aria-valuemax={100} aria-label={label}>
      <div className="h-3 bg-sprout-500" style={{ width: `${pct}%` }} />
    </div>
  );
}
