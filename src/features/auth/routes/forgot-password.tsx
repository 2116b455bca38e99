import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { forgotPasswordInputSchema } from '../../../../shared/contracts/auth';
import { formFailureFrom, parseForm } from '../../../utils/form';
import type { FieldErrors } from '../../../lib/api-client';
import { useRequestPasswordReset } from '../api/request-password-reset';
import { AuthCard } from '../components/auth-card';

export function ForgotPasswordPage() {
  const requestReset = useRequestPasswordReset();
  const [email, setEmail] = useState('');
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    const parsed = parseForm(forgotPasswordInputSchema, { email });
    if (!parsed.ok) {
      setFieldErrors(parsed.error);
      return;
    }
    setFieldErrors({});
    requestReset.mutate(parsed.value, {
      onSuccess: () => setSentTo(parsed.value.email),
      onError: (error) => {
        const failure = formFailureFrom(error);
        setFieldErrors(failure.fields);
        setFormError(failure.message);
      },
    });
  }

  return (
    <AuthCard
      title="Reset your password"
      description="Enter the e-mail address of your account. We will send a link to choose a new password."
      footer={
        <p>
          <Link className="font-medium text-accent underline-offset-2 hover:underline" to="/sign-in">
            Back to sign in
          </Link>
        </p>
      }
    >
      {sentTo ? (
        <Notice tone="success" title="Check your inbox">
          If an account exists for {sentTo}, we sent a link to reset its password. The link works once and expires
          after a short time.
        </Notice>
      ) : (
        <>
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
            <Button type="submit" className="w-full" busy={requestReset.isPending}>
              {requestReset.isPending ? 'Sending…' : 'Send reset link'}
            </Button>
          </form>
        </>
      )}
    </AuthCard>
  );
}
