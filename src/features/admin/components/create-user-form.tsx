import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import type { Role } from '../../../../shared/contracts/common';
import { adminCreatedRoles } from '../../../../shared/workflow/roles';
import { createUserInputSchema } from '../../../../shared/contracts/users';
import { formFailureFrom, parseForm } from '../../../utils/form';
import { roleName } from '../../../utils/roles';
import type { FieldErrors } from '../../../lib/api-client';
import { isApiError } from '../../../lib/api-client';
import { useCreateUser } from '../api/create-user';

const emptyValues = { name: '', email: '', password: '', role: 'forecaster' as Role };

/** Creates a staff account. Subscribers register themselves on the public site. */
export function CreateUserForm() {
  const createUser = useCreateUser();
  const [values, setValues] = useState(emptyValues);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [created, setCreated] = useState<string | null>(null);

  const set = <K extends keyof typeof values>(field: K, value: (typeof values)[K]) => setValues((current) => ({ ...current, [field]: value }));

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    setCreated(null);
    const parsed = parseForm(createUserInputSchema, values);
    if (!parsed.ok) {
      setFieldErrors(parsed.error);
      return;
    }
    setFieldErrors({});
    createUser.mutate(parsed.value, {
      onSuccess: (user) => {
        setCreated(`${user.name} (${user.email}) can now sign in as ${roleName(user.role).toLowerCase()}.`);
        setValues(emptyValues);
      },
      onError: (error) => {
        const failure = formFailureFrom(error);
        if (isApiError(error) && error.code === 'ALREADY_EXISTS') {
          setFieldErrors({ email: failure.message });
          return;
        }
        setFieldErrors(failure.fields);
        setFormError(failure.message);
      },
    });
  }

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-3" aria-label="Create staff user">
      {created ? <Notice tone="success">{created}</Notice> : null}
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <TextField label="Name" name="name" autoComplete="off" value={values.name} onChange={(e) => set('name', e.target.value)} error={fieldErrors.name} />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="off"
        value={values.email}
        onChange={(e) => set('email', e.target.value)}
        error={fieldErrors.email}
      />
      <TextField
        label="Temporary password"
        name="password"
        type="password"
        autoComplete="new-password"
        value={values.password}
        onChange={(e) => set('password', e.target.value)}
        error={fieldErrors.password}
        hint="At least 10 characters. Ask them to change it with “Forgot your password?”."
      />
      <SelectField
        label="Role"
        name="role"
        value={values.role}
        onChange={(e) => {
          const role = adminCreatedRoles.find((r) => r === e.target.value);
          if (role) set('role', role);
        }}
        options={adminCreatedRoles.map((role) => ({ value: role, label: roleName(role) }))}
        error={fieldErrors.role}
      />
      <Button type="submit" busy={createUser.isPending}>
        {createUser.isPending ? 'Creating…' : 'Create user'}
      </Button>
    </form>
  );
}
