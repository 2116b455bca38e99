import { clsx } from 'clsx';
import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from 'react';

export const inputClasses =
  'block w-full rounded-md border border-line-strong bg-panel px-2.5 py-1.5 text-sm text-ink placeholder:text-ink-faint aria-[invalid=true]:border-danger disabled:bg-sunken disabled:text-ink-muted';

export function FieldError({ id, children }: { id?: string; children: ReactNode }) {
  return (
    <p id={id} className="mt-1 text-[13px] font-medium text-danger">
      {children}
    </p>
  );
}

interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: string;
  error?: string | undefined;
  hint?: ReactNode;
}

/** A labelled input; its error (from the shared schema or the server) sits right under it. */
export function TextField({ label, error, hint, className, ...input }: TextFieldProps) {
  const id = useId();
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="mb-1 block text-[13px] font-medium text-ink">
        {label}
      </label>
      <input id={id} className={inputClasses} aria-invalid={error ? true : undefined} aria-describedby={describedBy} {...input} />
      {hint && !error ? (
        <p id={`${id}-hint`} className="mt-1 text-[13px] text-ink-muted">
          {hint}
        </p>
      ) : null}
      {error ? <FieldError id={`${id}-error`}>{error}</FieldError> : null}
    </div>
  );
}

interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> {
  label: string;
  error?: string | undefined;
  options: readonly { value: string; label: string }[];
  hideLabel?: boolean;
}

export function SelectField({ label, error, options, className, hideLabel = false, ...select }: SelectFieldProps) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className={clsx('mb-1 block text-[13px] font-medium text-ink', hideLabel && 'sr-only')}>
        {label}
      </label>
      <select
        id={id}
        className={clsx(inputClasses, 'pr-8')}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        {...select}
      >
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
      {error ? <FieldError id={`${id}-error`}>{error}</FieldError> : null}
    </div>
  );
}
