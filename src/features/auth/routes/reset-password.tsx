import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { Button, ButtonLink } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { resetPasswordInputSchema } from '../../../../shared/contracts/auth';
import { formFailureFrom, parseForm } from '../../../utils/form';
import type { FieldErrors } from '../../../lib/api-client';
import { useResetPassword } from '../api/reset-password';
import { authCodeOf } from '../api/auth-errors';
import { AuthCard } from '../components/auth-card';

function InvalidLink({ reason }: { reason: 'invalid' | 'missing' }) {
  return (
    <Notice
      tone="error"
      title={reason === 'invalid' ? 'This reset link is invalid or has expired' : 'This page needs the link from your e-mail'}
      actions={
        <ButtonLink to="/forgot-password" size="sm">
          Send a new link
        </ButtonLink>
      }
    >
      {reason === 'invalid'
        ? 'Reset links work once and expire after a short time. Ask for a new one and use the newest e-mail.'
        : 'Open the password-reset link from the e-mail we sent you, or ask for a new one.'}
    </Notice>
  );
}

export function ResetPasswordPage() {
  const navigate = useNavigate();
  const [searchParams] = useSearchParams();
  const token = searchParams.get('token');
  const linkError = searchParams.get('error');
  const resetPassword = useResetPassword();
  const [values, setValues] = useState({ newPassword: '', confirmPassword: '' });
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [tokenRejected, setTokenRejected] = useState(false);

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    if (token === null) return;
    setFormError(null);
    const parsed = parseForm(resetPasswordInputSchema, values);
    if (!parsed.ok) {
      setFieldErrors(parsed.error);
      return;
    }
    setFieldErrors({});
    resetPassword.mutate(
      { newPassword: parsed.value.newPassword, token },
      {
        onSuccess: () => void navigate('/sign-in?notice=password-reset', { replace: true }),
        onError: (error) => {
          const failure = formFailureFrom(error);
          if (authCodeOf(error) === 'INVALID_TOKEN') {
            setTokenRejected(true);
            return;
          }
          setFieldErrors({ ...failure.fields, ...(failure.fields.password ? { newPassword: failure.fields.password } : {}) });
          setFormError(failure.message);
        },
      },
    );
  }

  const invalid = linkError !== null || tokenRejected;

  return (
    <AuthCard
      title="Choose a new password"
      footer={
        <p>
          <Link className="font-medium text-accent underline-offset-2 hover:underline" to="/sign-in">
            Back to sign in
          </Link>
        </p>
      }
    >
      {invalid ? (
        <InvalidLink reason="invalid" />
      ) : token === null ? (
        <InvalidLink reason="missing" />
      ) : (
        <>
          {formError ? (
            <Notice tone="error" className="mb-4">
              {formError}
            </Notice>
          ) : null}
          <form noValidate onSubmit={handleSubmit} className="space-y-4">
            <TextField
              label="New password"
              type="password"
              name="newPassword"
              autoComplete="new-password"
              value={values.newPassword}
              onChange={(event) => setValues((v) => ({ ...v, newPassword: event.target.value }))}
              error={fieldErrors.newPassword}
              hint="At least 10 characters."
              required
            />
            <TextField
              label="Repeat the new password"
              type="password"
              name="confirmPassword"
              autoComplete="new-password"
              value={values.confirmPassword}
              onChange={(event) => setValues((v) => ({ ...v, confirmPassword: event.target.value }))}
              error={fieldErrors.confirmPassword}
              required
            />
            <Button type="submit" className="w-full" busy={resetPassword.isPending}>
              {resetPassword.isPending ? 'Saving…' : 'Save new password'}
            </Button>
          </form>
        </>
      )}
    </AuthCard>
  );
}
