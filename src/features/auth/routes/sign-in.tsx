import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { signInInputSchema } from '../../../../shared/contracts/auth';
import { formFailureFrom, parseForm } from '../../../utils/form';
import { pathAfterSignIn } from '../../../utils/roles';
import type { FieldErrors } from '../../../lib/api-client';
import { useSignIn } from '../api/sign-in';
import { AuthCard } from '../components/auth-card';

export function SignInPage() {
  const navigate = useNavigate();
  const [searchParams] = useSearchParams();
  const signIn = useSignIn();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const notice = searchParams.get('notice');

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    const parsed = parseForm(signInInputSchema, { email, password });
    if (!parsed.ok) {
      setFieldErrors(parsed.error);
      return;
    }
    setFieldErrors({});
    signIn.mutate(parsed.value, {
      onSuccess: (me) => {
        void navigate(pathAfterSignIn(me.user.role, searchParams.get('next')), { replace: true });
      },
      onError: (error) => {
        const failure = formFailureFrom(error);
        setFieldErrors(failure.fields);
        setFormError(failure.message);
      },
    });
  }

  return (
    <AuthCard
      title="Sign in to Stormdraft"
      description="Forecasters, lead forecasters, administrators and alert subscribers sign in here."
      footer={
        <>
          <p>
            <Link className="font-medium text-accent underline-offset-2 hover:underline" to="/forgot-password">
              Forgot your password?
            </Link>
          </p>
          <p>
            Emergency manager without an account?{' '}
            <Link className="font-medium text-accent underline-offset-2 hover:underline" to="/register">
              Register for alerts
            </Link>
          </p>
        </>
      }
    >
      {notice === 'password-reset' ? (
        <Notice tone="success" title="Password changed" className="mb-4">
          Sign in with your new password.
        </Notice>
      ) : null}
      {notice === 'verify-email' ? (
        <Notice tone="success" title="Check your e-mail" className="mb-4">
          We sent you a link to confirm your address. Open it to sign in and set up your alerts.
        </Notice>
      ) : null}
      {notice === 'registered' ? (
        <Notice tone="success" title="Account created" className="mb-4">
          Sign in to set up your alerts.
        </Notice>
      ) : null}
      {formError ? (
        <Notice tone="error" className="mb-4">
          {formError}
        </Notice>
      ) : null}
      <form noValidate onSubmit={handleSubmit} className="space-y-4">
        <TextField
          label="E-mail"
          type="email"
          name="email"
          autoComplete="email"
          value={email}
          onChange={(event) => setEmail(event.target.value)}
          error={fieldErrors.email}
          required
        />
        <TextField
          label="Password"
          type="password"
          name="password"
          autoComplete="current-password"
          value={password}
          onChange={(event) => setPassword(event.target.value)}
          error={fieldErrors.password}
          required
        />
        <Button type="submit" className="w-full" busy={signIn.isPending}>
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </Button>
      </form>
    </AuthCard>
  );
}
