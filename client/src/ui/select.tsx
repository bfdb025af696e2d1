import { useId, type ReactNode, type Ref, type SelectHTMLAttributes } from 'react';
import { cx } from '../lib/cx';
import { FieldDescription, FieldError, FieldLabel, controlClass, describedBy } from './field-parts';

export interface SelectOption {
  value: string;
  label: string;
  disabled?: boolean;
}

interface SelectProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'className'> {
  label: ReactNode;
  options: readonly SelectOption[];
  description?: ReactNode;
  error?: string;
  optional?: boolean;
  /** Hide the label visually (it stays for screen readers), e.g. inside a table row. */
  hideLabel?: boolean;
  /** Smaller control for use inside table rows. */
  compact?: boolean;
  className?: string;
  ref?: Ref<HTMLSelectElement>;
}

/** A labelled native select: keyboard and screen-reader behaviour come from the browser. */
export function Select({ label, options, description, error, optional, hideLabel, compact, className, id: givenId, ...rest }: SelectProps) {
  const autoId = useId();
  const id = givenId ?? autoId;
  const descriptionId = description ? `${id}-description` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <div className={cx('flex flex-col gap-1.5', className)}>
      <div className={hideLabel ? 'sr-only' : undefined}>
        <FieldLabel htmlFor={id} optional={optional}>
          {label}
        </FieldLabel>
      </div>
      {description && descriptionId && <FieldDescription id={descriptionId}>{description}</FieldDescription>}
      <select
        id={id}
        {...rest}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(descriptionId, errorId)}
        className={cx(controlClass, 'appearance-auto border-edge', compact ? 'min-h-8 py-1 pr-6 pl-2 text-small' : 'min-h-10 py-1.5 pr-8')}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value} disabled={o.disabled}>
            {o.label}
          </option>
        ))}
      </select>
      {error && errorId && <FieldError id={errorId}>{error}</FieldError>}
    </div>
  );
}
