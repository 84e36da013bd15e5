/**
 * Small pieces every form shares (account, household and entry islands): a labelled field with
 * its hint and inline error (aria-invalid + aria-describedby), a form-level alert, and a JSON POST
 * that never throws.
 */
import type { ReactNode } from 'react';

export type FieldErrors = Record<string, string>;

/** aria-describedby for a field: its hint and its error, when there are any. Example: `describedBy('qty', 'Too big')` → 'qty-error' */
export function describedBy(id: string, error?: string, hint?: boolean): string | undefined {
  return [hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined;
}

/** The props that make an input report its error to assistive technology. */
export function invalidProps(id: string, error?: string, hint?: boolean) {
  return { id, 'aria-invalid': error ? true : undefined, 'aria-describedby': describedBy(id, error, hint) } as const;
}

/** A field's visible label and its optional hint (id `${id}-hint`). */
function LabelAndHint({ id, label, hint }: { id: string; label: ReactNode; hint?: ReactNode }) {
  return (
    <>
      <label htmlFor={id} className="block font-semibold">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-loam-700">
          {hint}
        </p>
      ) : null}
    </>
  );
}

/** A label, an optional hint, any control and its error. */
export function FieldShell({ id, label, hint, error, children, className = 'mt-4' }: { id: string; label: ReactNode; hint?: ReactNode; error?: string | undefined; children: ReactNode; className?: string }) {
  return (
    <div className={className}>
      <LabelAndHint id={id} label={label} hint={hint} />
      <div className="mt-1">{children}</div>
      <FieldError id={id} error={error} />
    </div>
  );
}

interface FieldProps {
  id: string;
  label: string;
  error?: string | undefined;
  hint?: ReactNode;
  type?: string;
  autoComplete?: string;
  defaultValue?: string;
  required?: boolean;
  inputMode?: 'email' | 'text';
}

/** A text-like input with a visible label, an optional hint and its error right below it. */
export function Field({ id, label, error, hint, type = 'text', autoComplete, defaultValue, required = true, inputMode }: FieldProps) {
  return (
    <div className="mt-4">
      <LabelAndHint id={id} label={label} hint={hint} />
      <input
        {...invalidProps(id, error, Boolean(hint))}
        name={id}
        type={type}
        className={`field mt-1 ${error ? 'border-berry-700 ring-1 ring-berry-700' : ''}`}
        autoComplete={autoComplete}
        defaultValue={defaultValue}
        required={required}
        inputMode={inputMode}
      />
      <FieldError id={id} error={error} />
    </div>
  );
}

/** The error line of a field, id `${id}-error` (point aria-describedby at it). */
export function FieldError({ id, error }: { id: string; error?: string | undefined }) {
  return error ? (
    <p id={`${id}-error`} className="mt-1 text-sm font-semibold text-berry-700">
      {error}
    </p>
  ) : null;
}

/** A message about the whole form; role=alert so screen readers read it when it appears. */
export function FormAlert({ message, tone = 'error' }: { message: string | null; tone?: 'error' | 'ok' }) {
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} aria-live={tone === 'error' ? 'assertive' : 'polite'}>
      {message ? (
        <p className={`mt-4 rounded-xl p-3 font-semibold ${tone === 'error' ? 'bg-berry-700/10 text-berry-700' : 'bg-sprout-100 text-sprout-900'}`}>{message}</p>
      ) : null}
    </div>
  );
}

export interface JsonAnswer {
  status: number;
  body: any;
  headers: Headers;
}

/** Sends JSON and reads JSON back; a network failure is status 0 with a sentence. */
export async function sendJson(method: string, url: string, body?: unknown): Promise<JsonAnswer> {
  try {
    const res = await fetch(url, {
      method,
      headers: body === undefined ? {} : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
    });
    const text = await res.text();
    let parsed: unknown = null;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      parsed = { message: text };
    }
    return { status: res.status, body: parsed, headers: res.headers };
  } catch {
    return { status: 0, body: { message: 'Could not reach Selfsown. Check your connection and try again.' }, headers: new Headers() };
  }
}

/** The sentence of an error answer, in either shape (ours: {error:{message}}, better-auth's: {message}). */
export function answerMessage(a: JsonAnswer, fallback = 'Something went wrong. Please try again.'): string {
  return a.body?.error?.message ?? a.body?.message ?? fallback;
}

/** Moves focus to the first field with an error, so keyboard and screen-reader users land on it. */
export function focusFirstError(form: HTMLFormElement | null, errors: FieldErrors): void {
  const first = Object.keys(errors)[0];
  if (!form || !first) return;
  const el = form.querySelector<HTMLElement>(`[name="${CSS.escape(first)}"]`);
  el?.focus();
}
