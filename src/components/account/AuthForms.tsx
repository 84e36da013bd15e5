/**
 * The sign-up, sign-in, forgot-password and reset-password forms (React islands). Each is a
 * react-hook-form form checked with the shared zod rules of src/lib/account-schemas.ts (the ones
 * auth.ts uses) and sends through better-auth's own client (./auth-client.ts).
 */
import { useEffect, useState, type ReactNode } from 'react';
import { forgotPasswordInput, PASSWORD_MIN, resetPasswordInput, signInInput, signUpInput } from '@/lib/account-schemas';
import { safeNext, withNext } from '@/lib/safe-next';
import { Field, FormAlert, formMessage, showFieldProblem, showFormMessage, useSchemaForm } from '@/components/forms';
import { authCall, authClient, tooMany } from './auth-client';
import { clearRuntimeCaches } from '@/components/app-caches';

/**
 * False until the island has hydrated. Before that a submit would be the browser's own GET, putting
 * the password in the address bar and server logs: the buttons stay disabled and the forms say POST.
 */
function useHydrated(): boolean {
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);
  return hydrated;
}

function OutboxHint({ outbox }: { outbox: boolean }) {
  return outbox ? (
    <p className="mt-2 text-sm text-loam-700">
      This install keeps mail locally: open the <a className="text-sprout-700 underline" href="/dev/mail">outbox</a> to read it.
    </p>
  ) : null;
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
  const hydrated = useHydrated();
  const form = useSchemaForm(signUpInput, { name: '', email: email ?? '', password: '' });
  const { errors, isSubmitting } = form.formState;
  const [sentTo, setSentTo] = useState<string | null>(null);

  const submit = form.handleSubmit(async (data) => {
    const failure = await authCall((o) => authClient.signUp.email({ ...data, callbackURL: safeNext(next) }, o));
    if (!failure) return setSentTo(data.email);
    if (failure.status === 429) return showFormMessage(form, tooMany(failure.retryAfter));
    if (failure.code.startsWith('PASSWORD')) return showFieldProblem(form, 'password', `Use ${PASSWORD_MIN} to 128 characters.`);
    if (failure.code === 'INVALID_EMAIL') return showFieldProblem(form, 'email', 'Enter an e-mail address, e.g. robin@example.org.');
    showFormMessage(form, failure.message);
  });

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
    <form method="post" onSubmit={submit} noValidate className="card mt-6 max-w-md" aria-describedby="sign-up-alert">
      <Field id="name" label="Your name" autoComplete="name" registration={form.register('name')} error={errors.name?.message} hint="Shown to the people in your households." />
      <Field id="email" label="E-mail" type="email" inputMode="email" autoComplete="email" defaultValue={email} registration={form.register('email')} error={errors.email?.message} />
      <Field id="password" label="Password" type="password" autoComplete="new-password" registration={form.register('password')} error={errors.password?.message} hint={`At least ${PASSWORD_MIN} characters. A few unrelated words work well.`} />
      <div id="sign-up-alert">
        <FormAlert message={formMessage(form)} />
      </div>
      <button className="btn-primary mt-6 w-full" type="submit" disabled={!hydrated || isSubmitting}>
        {isSubmitting ? 'Creating your account…' : 'Create my account'}
      </button>
      <p className="mt-4 text-center">
        Already have an account? <a className="text-sprout-700 underline" href={withNext('/sign-in', next)}>Sign in</a>
      </p>
    </form>
  );
}

export function SignInForm({ next, outbox }: { next: string | null; outbox: boolean }) {
  const hydrated = useHydrated();
  const form = useSchemaForm(signInInput, { email: '', password: '' });
  const { errors, isSubmitting, isSubmitSuccessful } = form.formState;
  const [unverified, setUnverified] = useState(false);

  const check = form.handleSubmit(async (data) => {
    const target = safeNext(next);
    const failure = await authCall((o) => authClient.signIn.email({ ...data, callbackURL: target }, o));
    if (!failure) {
      // Household pages kept offline for whoever was signed in before are not this person's.
      await clearRuntimeCaches();
      window.location.assign(target);
      return;
    }
    if (failure.status === 429) return showFormMessage(form, tooMany(failure.retryAfter));
    if (failure.status === 403 && failure.code === 'EMAIL_NOT_VERIFIED') {
      setUnverified(true);
      return showFormMessage(form, `Confirm your address first: we have just sent a new link to ${data.email}.`);
    }
    if (failure.status === 401) return showFormMessage(form, 'That e-mail and password do not match an account. Check both, or reset the password.');
    showFormMessage(form, failure.message);
  });
  // A successful sign-in keeps the button busy while the next page loads.
  const busy = isSubmitting || isSubmitSuccessful;

  return (
    <form
      method="post"
      onSubmit={(e) => {
        setUnverified(false);
        void check(e);
      }}
      noValidate
      className="card mt-6 max-w-md"
    >
      <Field id="email" label="E-mail" type="email" inputMode="email" autoComplete="email" registration={form.register('email')} error={errors.email?.message} />
      <Field id="password" label="Password" type="password" autoComplete="current-password" registration={form.register('password')} error={errors.password?.message} />
      <FormAlert message={formMessage(form)} />
      {unverified ? <OutboxHint outbox={outbox} /> : null}
      <button className="btn-primary mt-6 w-full" type="submit" disabled={!hydrated || busy}>
        {busy ? 'Signing in…' : 'Sign in'}
      </button>
      <p className="mt-4 flex flex-wrap justify-between gap-2">
        <a className="link" href="/forgot-password">Forgot your password?</a>
        <a className="link" href={withNext('/sign-up', next)}>Create an account</a>
      </p>
    </form>
  );
}

export function ForgotPasswordForm({ outbox }: { outbox: boolean }) {
  const hydrated = useHydrated();
  const form = useSchemaForm(forgotPasswordInput, { email: '' });
  const { errors, isSubmitting } = form.formState;
  const [sentTo, setSentTo] = useState<string | null>(null);

  const submit = form.handleSubmit(async (data) => {
    const failure = await authCall((o) => authClient.requestPasswordReset({ email: data.email, redirectTo: '/reset-password' }, o));
    if (!failure) return setSentTo(data.email);
    if (failure.status === 429) return showFormMessage(form, tooMany(failure.retryAfter));
    showFormMessage(form, failure.message);
  });

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
    <form method="post" onSubmit={submit} noValidate className="card mt-6 max-w-md">
      <Field id="email" label="E-mail of your account" type="email" inputMode="email" autoComplete="email" registration={form.register('email')} error={errors.email?.message} />
      <FormAlert message={formMessage(form)} />
      <button className="btn-primary mt-6 w-full" type="submit" disabled={!hydrated || isSubmitting}>
        {isSubmitting ? 'Sending…' : 'Send me a link'}
      </button>
    </form>
  );
}

export function ResetPasswordForm({ token }: { token: string }) {
  const hydrated = useHydrated();
  const form = useSchemaForm(resetPasswordInput, { password: '', confirm: '' });
  const { errors, isSubmitting } = form.formState;
  const [done, setDone] = useState(false);

  const submit = form.handleSubmit(async (data) => {
    const failure = await authCall((o) => authClient.resetPassword({ token, newPassword: data.password }, o));
    if (!failure) return setDone(true);
    if (failure.code === 'INVALID_TOKEN') return showFormMessage(form, 'This link has expired or was already used. Ask for a new one below.');
    showFormMessage(form, failure.message);
  });

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
    <form method="post" onSubmit={submit} noValidate className="card mt-6 max-w-md">
      <Field id="password" label="New password" type="password" autoComplete="new-password" registration={form.register('password')} error={errors.password?.message} hint={`At least ${PASSWORD_MIN} characters.`} />
      <Field id="confirm" label="The same password again" type="password" autoComplete="new-password" registration={form.register('confirm')} error={errors.confirm?.message} />
      <FormAlert message={formMessage(form)} />
      <button className="btn-primary mt-6 w-full" type="submit" disabled={!hydrated || isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Set the new password'}
      </button>
      <p className="mt-4">
        <a className="link" href="/forgot-password">Ask for a new link</a>
      </p>
    </form>
  );
}

/** On /verify after a failed link: sends a fresh verification mail. */
export function ResendVerification({ next, outbox }: { next: string | null; outbox: boolean }) {
  const hydrated = useHydrated();
  const form = useSchemaForm(forgotPasswordInput, { email: '' });
  const { errors, isSubmitting } = form.formState;
  const [sent, setSent] = useState(false);

  const submit = form.handleSubmit(async (data) => {
    const failure = await authCall((o) => authClient.sendVerificationEmail({ email: data.email, callbackURL: safeNext(next) }, o));
    if (!failure) return setSent(true);
    if (failure.status === 429) return showFormMessage(form, tooMany(failure.retryAfter));
    showFormMessage(form, failure.message);
  });
  if (sent) {
    return (
      <SentCard outbox={outbox}>
        <p>If that address has an account still waiting for confirmation, a new link is on its way.</p>
      </SentCard>
    );
  }
  return (
    <form method="post" onSubmit={submit} noValidate className="card mt-6 max-w-md">
      <Field id="email" label="Your e-mail" type="email" inputMode="email" autoComplete="email" registration={form.register('email')} error={errors.email?.message} />
      <FormAlert message={formMessage(form)} />
      <button className="btn-primary mt-6 w-full" type="submit" disabled={!hydrated || isSubmitting}>
        {isSubmitting ? 'Sending…' : 'Send a new link'}
      </button>
    </form>
  );
}
