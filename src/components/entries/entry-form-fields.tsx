/**
 * Two fields the harvest form and the bought-food form both end with: the "already trimmed" tick
 * on a card, and the optional note. Each form keeps its own words and element ids; the markup, the
 * 500-character limit and the error wiring are written once here so the two forms cannot drift.
 */
import type { UseFormRegisterReturn } from 'react-hook-form';
import { ErrorText, invalidProps } from './ui';

/** A checkbox on a card with a bold title and a quieter line saying what ticking it means. */
export function CheckCard({ registration, title, hint }: { registration: UseFormRegisterReturn; title: string; hint: string }) {
  return (
    <label className="flex min-h-12 cursor-pointer items-center gap-3 self-end rounded-xl border border-loam-200 bg-loam-50 px-4 py-2">
      <input type="checkbox" {...registration} className="size-6 accent-sprout-700" />
      <span>
        <span className="font-semibold">{title}</span>
        <span className="block text-sm text-loam-700">{hint}</span>
      </span>
    </label>
  );
}

/** The optional note (at most 500 characters) with its error; `id` is the input's element id. */
export function NoteField({ id, registration, error, placeholder }: { id: string; registration: UseFormRegisterReturn; error: string | undefined; placeholder?: string }) {
  return (
    <div className="mt-4">
      <label htmlFor={id} className="block font-semibold">
        Note <span className="font-normal text-loam-700">(optional)</span>
      </label>
      <input {...invalidProps(id, error)} {...registration} type="text" className="field mt-1" maxLength={500} placeholder={placeholder} />
      <ErrorText id={id} error={error} />
    </div>
  );
}
