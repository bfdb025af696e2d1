import { useId, type InputHTMLAttributes, type ReactNode, type Ref } from 'react';
import { cx } from '../lib/cx';
import { FieldDescription, FieldError, describedBy } from './field-parts';

interface CheckboxProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'className'> {
  label: ReactNode;
  /** A second, muted line under the label (e.g. an e-mail address). */
  hint?: ReactNode;
  className?: string;
  ref?: Ref<HTMLInputElement>;
}

/** A labelled native checkbox; the whole label is the target. */
export function Checkbox({ label, hint, className, id: givenId, ...rest }: CheckboxProps) {
  const autoId = useId();
  const id = givenId ?? autoId;
  return (
    <div className={cx('flex items-start gap-2.5', className)}>
      <input id={id} type="checkbox" {...rest} className="mt-0.5 size-4 shrink-0 accent-copper" />
      <label htmlFor={id} className="min-w-0 text-small text-ink">
        {label}
        {hint && <span className="block break-words text-muted">{hint}</span>}
      </label>
    </div>
  );
}

interface ChoiceGroupProps {
  legend: ReactNode;
  description?: ReactNode;
  error?: string;
  optional?: boolean;
  children: ReactNode;
  className?: string;
}

/** A fieldset of checkboxes with its legend, description and one error for the group. */
export function ChoiceGroup({ legend, description, error, optional, children, className }: ChoiceGroupProps) {
  const id = useId();
  const descriptionId = description ? `${id}-description` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <fieldset aria-describedby={describedBy(descriptionId, errorId)} aria-invalid={error ? true : undefined} className={cx('flex min-w-0 flex-col gap-1.5', className)}>
      <legend className="mb-1.5 text-small font-semibold text-ink">
        {legend}
        {optional && <span className="ml-1.5 font-normal text-muted">(optional)</span>}
      </legend>
      {description && descriptionId && <FieldDescription id={descriptionId}>{description}</FieldDescription>}
      <div className="flex flex-col gap-2">{children}</div>
      {error && errorId && <FieldError id={errorId}>{error}</FieldError>}
    </fieldset>
  );
}
