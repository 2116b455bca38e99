import { useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { registerInputSchema } from '../../../../shared/contracts/auth';
import { formFailureFrom, parseForm } from '../../../utils/form';
import { homePathFor } from '../../../utils/roles';
import type { FieldErrors } from '../../../lib/api-client';
import { useRegister } from '../api/register';
import { authCodeOf } from '../api/auth-errors';
import { AuthCard } from '../components/auth-card';

export function RegisterPage() {
  const navigate = useNavigate();
  const register = useRegister();
  const [values, setValues] = useState({ name: '', email: '', password: '' });
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const update = (field: keyof typeof values) => (event: { target: { value: string } }) =>
    setValues((current) => ({ ...current, [field]: event.target.value }));

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    const parsed = parseForm(registerInputSchema, values);
    if (!parsed.ok) {
      setFieldErrors(parsed.error);
      return;
    }
    setFieldErrors({});
    register.mutate(parsed.value, {
      onSuccess: (me) => {
        void navigate(me ? homePathFor(me.user.role) : '/sign-in?notice=verify-email', { replace: true });
      },
      onError: (error) => {
        const failure = formFailureFrom(error);
        const isTakenEmail = authCodeOf(error)?.startsWith('USER_ALREADY_EXISTS') === true;
        setFieldErrors(isTakenEmail ? { ...failure.fields, email: failure.message } : failure.fields);
        setFormError(isTakenEmail ? null : failure.message);
      },
    });
  }

  return (
    <AuthCard
      title="Register for outlook alerts"
      description="For emergency managers, event organisers and utilities. You will choose your areas of interest and alert thresholds after registering. Staff accounts are created by the office administrator."
      footer={
        <p>
          Already registered?{' '}
          <Link className="font-medium text-accent underline-offset-2 hover:underline" to="/sign-in">
            Sign in
          </Link>
        </p>
      }
    >
      {formError ? (
        <Notice tone="error" className="mb-4">
          {formError}
        </Notice>
      ) : null}
      <form noValidate onSubmit={handleSubmit} className="space-y-4">
        <TextField label="Name" name="name" autoComplete="name" value={values.name} onChange={update('name')} error={fieldErrors.name} required />
        <TextField
          label="E-mail"
          type="email"
          name="email"
          autoComplete="email"
          value={values.email}
          onChange={update('email')}
          error={fieldErrors.email}
          required
        />
        <TextField
          label="Password"
          type="password"
          name="password"
          autoComplete="new-password"
          value={values.password}
          onChange={update('password')}
          error={fieldErrors.password}
          hint="At least 10 characters."
          minLength={10}
          required
        />
        <Button type="submit" className="w-full" busy={register.isPending}>
          {register.isPending ? 'Creating account…' : 'Create subscriber account'}
        </Button>
      </form>
    </AuthCard>
  );
}
