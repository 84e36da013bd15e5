/**
 * The sign-up, sign-in, forgot-password and reset-password forms (React islands). They post to
 * better-auth's endpoints under /api/auth and validate first with the shared zod rules.
 */
import { useRef, useState, type FormEvent, type ReactNode } from 'react';
import type { z } from 'zod';
import { fieldErrors, forgotPasswordInput, PASSWORD_MIN, resetPasswordInput, signInInput, signUpInput } from '../../lib/account-schemas';
import { safeNext, withNext } from '../../lib/safe-next';
import { answerMessage, Field, FormAlert, focusFirstError, sendJson, type FieldErrors } from '../forms';

function formValues(form: HTMLFormElement): Record<string, string> {
  return Object.fromEntries([...new FormData(form).entries()].map(([k, v]) => [k, String(v)]));
}

function tooMany(retryAfter: string | null): string {
  const s = Number(retryAfter);
  return `Too many attempts from here. Wait ${s > 0 ? `${s} second${s === 1 ? '' : 's'}` : 'a minute'} and try again.`;
}

function OutboxHint({ outbox }: { outbox: boolean }) {
  return outbox ? (
    <p className="mt-2 text-sm text-loam-700">
      This install keeps mail locally: open the <a className="text-sprout-700 underline" href="/dev/mail">outbox</a> to read it.
    </p>
  ) : null;
}

/**
 * The state every account form shares, and its first step on submit: check the fields with the
 * shared zod rules, show each problem beside its field and focus the first. Returns the parsed
 * values, or null when something is wrong.
 */
function useCheckedForm() {
  const formRef = useRef<HTMLFormElement>(null);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [alert, setAlert] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  function check<T>(e: FormEvent<HTMLFormElement>, schema: { safeParse: (v: unknown) => z.ZodSafeParseResult<T> }): T | null {
    e.preventDefault();
    setAlert(null);
    const parsed = schema.safeParse(formValues(e.currentTarget));
    const errs = fieldErrors(parsed);
    setErrors(errs);
    if (!parsed.success) {
      focusFirstError(formRef.current, errs);
      return null;
    }
    return parsed.data;
  }
  /** Shows one field's problem from the server, focused. */
  function fieldProblem(field: string, message: string) {
    setErrors({ [field]: message });
    focusFirstError(formRef.current, { [field]: message });
  }
  return { formRef, errors, alert, setAlert, busy, setBusy, check, fieldProblem };
}

/** The "check your mail" card after a form sent a link. */
function SentCard({ title, children, outbox }: { title?: string; children: ReactNode; outbox: boolean }) {
  return (
    <div className="card mt-6" role="status">
      {title ? <h2 className="text-xl font-bold">{title}</h2> : null}
      {children}
      <OutboxHint outbox={outbox} />
    </div>
  );
}

export function SignUpForm({ next, email, outbox }: { next: string | null; email?: string; outbox: boolean }) {
  const { formRef, errors, alert, setAlert, busy, setBusy, check, fieldProblem } = useCheckedForm();
  const [sentTo, setSentTo] = useState<string | null>(null);

  async function submit(e: FormEvent<HTMLFormElement>) {
    const data = check(e, signUpInput);
    if (!data) return;
    setBusy(true);
    const a = await sendJson('POST', '/api/auth/sign-up/email', { ...data, callbackURL: safeNext(next) });
    setBusy(false);
    if (a.status === 200) return setSentTo(data.email);
    if (a.status === 429) return setAlert(tooMany(a.headers.get('x-retry-after')));
    const code: string = a.body?.code ?? '';
    if (code.startsWith('PASSWORD')) return fieldProblem('password', `Use ${PASSWORD_MIN} to 128 characters.`);
    if (code === 'INVALID_EMAIL') return fieldProblem('email', 'Enter an e-mail address, e.g. robin@example.org.');
    setAlert(answerMessage(a));
  }

  if (sentTo) {
    return (
      <SentCard title="Check your mail" outbox={outbox}>
        <p className="mt-2">
          We sent a link to <strong>{sentTo}</strong>. Open it to confirm the address; you are signed in as soon as you do.
        </p>
        <p className="mt-2 text-sm text-loam-700">No mail after a few minutes? Look in the spam folder, or sign in to get a new link.</p>
      </SentCard>
    );
  }
  return (
    <form ref={formRef} onSubmit={submit} noValidate className="card mt-6 max-w-md" aria-describedby="sign-up-alert">
      <Field id="name" label="Your name" autoComplete="name" error={errors.name} hint="Shown to the people in your households." />
      <Field id="email" label="E-mail" type="email" inputMode="email" autoComplete="email" defaultValue={email} error={errors.email} />
      <Field id="password" label="Password" type="password" autoComplete="new-password" error={errors.password} hint={`At least ${PASSWORD_MIN} characters. A few unrelated words work well.`} />
      <div id="sign-up-alert">
        <FormAlert message={alert} />
      </div>
      <button className="btn-primary mt-6 w-full" type="submit" disabled={busy}>
        {busy ? 'Creating your account…' : 'Create my account'}
      </button>
      <p className="mt-4 text-center">
        Already have an account? <a className="text-sprout-700 underline" href={withNext('/sign-in', next)}>Sign in</a>
      </p>
    </form>
  );
}

export function SignInForm({ next, outbox }: { next: string | null; outbox: boolean }) {
  const { formRef, errors, alert, setAlert, busy, setBusy, check } = useCheckedForm();
  const [unverified, setUnverified] = useState(false);

  async function submit(e: FormEvent<HTMLFormElement>) {
    setUnverified(false);
    const data = check(e, signInInput);
    if (!data) return;
    setBusy(true);
    const target = safeNext(next);
    const a = await sendJson('POST', '/api/auth/sign-in/email', { ...data, callbackURL: target });
    if (a.status === 200) {
      window.location.assign(target);
      return;
    }
    setBusy(false);
    if (a.status === 429) return setAlert(tooMany(a.headers.get('x-retry-after')));
    if (a.status === 403 && a.body?.code === 'EMAIL_NOT_VERIFIED') {
      setUnverified(true);
      return setAlert(`Confirm your address first: we have just sent a new link to ${data.email}.`);
    }
    if (a.status === 401) return setAlert('That e-mail and password do not match an account. Check both, or reset the password.');
    setAlert(answerMessage(a));
  }

  return (
    <form ref={formRef} onSubmit={submit} noValidate className="card mt-6 max-w-md">
      <Field id="email" label="E-mail" type="email" inputMode="email" autoComplete="email" error={errors.email} />
      <Field id="password" label="Password" type="password" autoComplete="current-password" error={errors.password} />
      <FormAlert message={alert} />
      {unverified ? <OutboxHint outbox={outbox} /> : null}
      <button className="btn-primary mt-6 w-full" type="submit" disabled={busy}>
        {busy ? 'Signing in…' : 'Sign in'}
      </button>
      <p className="mt-4 flex flex-wrap justify-between gap-2">
        <a className="text-sprout-700 underline" href="/forgot-password">Forgot your password?</a>
        <a className="text-sprout-700 underline" href={withNext('/sign-up', next)}>Create an account</a>
      </p>
    </form>
  );
}

export function ForgotPasswordForm({ outbox }: { outbox: boolean }) {
  const { formRef, errors, alert, setAlert, busy, setBusy, check } = useCheckedForm();
  const [sentTo, setSentTo] = useState<string | null>(null);

  async function submit(e: FormEvent<HTMLFormElement>) {
    const data = check(e, forgotPasswordInput);
    if (!data) return;
    setBusy(true);
    const a = await sendJson('POST', '/api/auth/request-password-reset', { email: data.email, redirectTo: '/reset-password' });
    setBusy(false);
    if (a.status === 200) return setSentTo(data.email);
    if (a.status === 429) return setAlert(tooMany(a.headers.get('x-retry-after')));
    setAlert(answerMessage(a));
  }

  if (sentTo) {
    return (
      <SentCard title="Check your mail" outbox={outbox}>
        <p className="mt-2">
          If <strong>{sentTo}</strong> has a Selfsown account, a link to choose a new password is on its way. It works once, for one hour.
        </p>
      </SentCard>
    );
  }
  return (
    <form ref={formRef} onSubmit={submit} noValidate className="card mt-6 max-w-md">
      <Field id="email" label="E-mail of your account" type="email" inputMode="email" autoComplete="email" error={errors.email} />
      <FormAlert message={alert} />
      <button className="btn-primary mt-6 w-full" type="submit" disabled={busy}>
        {busy ? 'Sending…' : 'Send me a link'}
      </button>
    </form>
  );
}

export function ResetPasswordForm({ token }: { token: string }) {
  const { formRef, errors, alert, setAlert, busy, setBusy, check } = useCheckedForm();
  const [done, setDone] = useState(false);

  async function submit(e: FormEvent<HTMLFormElement>) {
    const data = check(e, resetPasswordInput);
    if (!data) return;
    setBusy(true);
    const a = await sendJson('POST', '/api/auth/reset-password', { token, newPassword: data.password });
    setBusy(false);
    if (a.status === 200) return setDone(true);
    if (a.body?.code === 'INVALID_TOKEN') return setAlert('This link has expired or was already used. Ask for a new one below.');
    setAlert(answerMessage(a));
  }

  if (done) {
    return (
      <div className="card mt-6" role="status">
        <h2 className="text-xl font-bold">Password changed</h2>
        <p className="mt-2">Your new password is set, and every device that was signed in has been signed out.</p>
        <a className="btn-primary mt-4" href="/sign-in">Sign in</a>
      </div>
    );
  }
  return (
    <form ref={formRef} onSubmit={submit} noValidate className="card mt-6 max-w-md">
      <Field id="password" label="New password" type="password" autoComplete="new-password" error={errors.password} hint={`At least ${PASSWORD_MIN} characters.`} />
      <Field id="confirm" label="The same password again" type="password" autoComplete="new-password" error={errors.confirm} />
      <FormAlert message={alert} />
      <button className="btn-primary mt-6 w-full" type="submit" disabled={busy}>
        {busy ? 'Saving…' : 'Set the new password'}
      </button>
      <p className="mt-4">
        <a className="text-sprout-700 underline" href="/forgot-password">Ask for a new link</a>
      </p>
    </form>
  );
}

/** On /verify after a failed link: sends a fresh verification mail. */
export function ResendVerification({ next, outbox }: { next: string | null; outbox: boolean }) {
  const { formRef, errors, alert, setAlert, busy, setBusy, check } = useCheckedForm();
  const [sent, setSent] = useState(false);

  async function submit(e: FormEvent<HTMLFormElement>) {
    const data = check(e, forgotPasswordInput);
    if (!data) return;
    setBusy(true);
    const a = await sendJson('POST', '/api/auth/send-verification-email', { email: data.email, callbackURL: safeNext(next) });
    setBusy(false);
    if (a.status === 200) return setSent(true);
    if (a.status === 429) return setAlert(tooMany(a.headers.get('x-retry-after')));
    setAlert(answerMessage(a));
  }
  if (sent) {
    return (
      <SentCard outbox={outbox}>
        <p>If that address has an account still waiting for confirmation, a new link is on its way.</p>
      </SentCard>
    );
  }
  return (
    <form ref={formRef} onSubmit={submit} noValidate className="card mt-6 max-w-md">
      <Field id="email" label="Your e-mail" type="email" inputMode="email" autoComplete="email" error={errors.email} />
      <FormAlert message={alert} />
      <button className="btn-primary mt-6 w-full" type="submit" disabled={busy}>
        {busy ? 'Sending…' : 'Send a new link'}
      </button>
    </form>
  );
}
