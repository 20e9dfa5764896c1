/**
 * A labelled text input. The label is always visible and tied to the
 * input; an error (when given) is linked through aria-describedby.
 */
import { useId, type InputHTMLAttributes } from 'react';

export interface FieldProps extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  error?: string | null;
  help?: string;
}

export function Field({ label, error, help, className = '', ...input }: FieldProps) {
  const id = useId();
  const describedBy = [error ? `${id}-err` : null, help ? `${id}-help` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="field-label">{label}</label>
      <input id={id} className="field-input" aria-invalid={error ? true : undefined} aria-describedby={describedBy} {...input} />
      {help && <p id={`${id}-help`} className="mt-1 text-caption text-tide-600">{help}</p>}
      {error && <p id={`${id}-err`} className="mt-1 text-caption text-glasswort-700">{error}</p>}
    </div>
  );
}
