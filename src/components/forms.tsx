/**
 * Small pieces every form shares (account, household, people and entry islands): a labelled field
 * with its hint and inline error (aria-invalid + aria-describedby), a form-level alert, and the
 * react-hook-form setup that checks a form with the same zod schema its endpoint uses and shows the
 * server's own field errors beside the fields.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import type { ReactNode } from 'react';
import { useForm, type DefaultValues, type FieldValues, type Path, type UseFormRegisterReturn, type UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';
import { ApiError } from './request';
import { useThumbFloat } from './thumb-float';

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
  /** The input's react-hook-form registration (`register(name)`); its name is the field's. */
  registration?: UseFormRegisterReturn;
}

/** A text-like input with a visible label, an optional hint and its error right below it. */
export function Field({ id, label, error, hint, type = 'text', autoComplete, defaultValue, required = true, inputMode, registration }: FieldProps) {
  return (
    <div className="mt-4">
      <LabelAndHint id={id} label={label} hint={hint} />
      <input
        name={id}
        {...registration}
        {...invalidProps(id, error, Boolean(hint))}
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
  const float = useThumbFloat(message, tone === 'ok');
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} aria-live={tone === 'error' ? 'assertive' : 'polite'}>
      {message ? (
        <p className={`mt-4 rounded-xl p-3 font-semibold ${tone === 'error' ? 'bg-berry-700/10 text-berry-700' : 'bg-sprout-100 text-sprout-900'} ${float}`}>{message}</p>
      ) : null}
    </div>
  );
}

/** A zod schema whose input is a form's values (what `useSchemaForm` accepts). */
type FormSchema<Values extends FieldValues, Output> = z.ZodType<Output, Values>;

/**
 * A react-hook-form form checked by `schema` — the same zod schema the endpoint parses with — on
 * submit. Problems show beside their fields and the first one gets the focus; they are checked
 * again at the next submit, not on every key press. `handleSubmit` hands over the parsed values.
 * Example: `const form = useSchemaForm(signInInput, { email: '', password: '' })`
 */
export function useSchemaForm<Values extends FieldValues, Output>(schema: FormSchema<Values, Output>, defaultValues?: DefaultValues<Values>): UseFormReturn<Values, unknown, Output> {
  return useForm<Values, unknown, Output>({
    resolver: zodResolver(schema),
    reValidateMode: 'onSubmit',
    ...(defaultValues ? { defaultValues } : {}),
  });
}

/** The key of a message about the whole form (react-hook-form clears root errors at each submit). */
const FORM_MESSAGE = 'root.server';

/** The form-level message set by `showFormMessage`/`showFailure`, or null. */
export function formMessage<Values extends FieldValues>(form: UseFormReturn<Values, unknown, unknown>): string | null {
  return form.formState.errors.root?.server?.message ?? null;
}

/** Shows one sentence about the whole form in its alert. */
export function showFormMessage<Values extends FieldValues>(form: UseFormReturn<Values, unknown, unknown>, message: string): void {
  form.setError(FORM_MESSAGE as Path<Values>, { type: 'server', message });
}

/** Shows one field's problem (from the server) beside the field, and focuses it. */
export function showFieldProblem<Values extends FieldValues>(form: UseFormReturn<Values, unknown, unknown>, field: Path<Values>, message: string): void {
  form.setError(field, { type: 'server', message }, { shouldFocus: true });
}

/**
 * Shows a failed API call on the form: each of the API's `fields` beside its field (the first one
 * focused) and the error's sentence in the form's alert; anything but an ApiError shows `fallback`.
 */
export function showFailure<Values extends FieldValues>(form: UseFormReturn<Values, unknown, unknown>, err: unknown, fallback = 'Something went wrong. Please try again.'): void {
  if (!(err instanceof ApiError)) return showFormMessage(form, fallback);
  Object.entries(err.fields).forEach(([field, message], i) => form.setError(field as Path<Values>, { type: 'server', message }, { shouldFocus: i === 0 }));
  showFormMessage(form, err.message);
}
