import { useId, type InputHTMLAttributes, type ReactNode, type Ref, type TextareaHTMLAttributes } from 'react';
import { cx } from '../lib/cx';
import { FieldDescription, FieldError, FieldLabel, controlClass, describedBy } from './field-parts';

interface CommonProps {
  label: ReactNode;
  description?: ReactNode;
  error?: string;
  /** Marks the field "(optional)" next to its label. Required fields carry no mark. */
  optional?: boolean;
  className?: string;
}

type InputProps = CommonProps &
  Omit<InputHTMLAttributes<HTMLInputElement>, 'className'> & {
    multiline?: false;
    ref?: Ref<HTMLInputElement>;
  };

type AreaProps = CommonProps &
  Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'className'> & {
    multiline: true;
    ref?: Ref<HTMLTextAreaElement>;
  };

/** A labelled text input (or textarea) with description and error wired for screen readers. */
export function TextField(props: InputProps | AreaProps) {
  const autoId = useId();
  const { label, description, error, optional, className, id: givenId, ...rest } = props;
  const id = givenId ?? autoId;
  const descriptionId = description ? `${id}-description` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const aria = {
    id,
    'aria-invalid': error ? true : undefined,
    'aria-describedby': describedBy(descriptionId, errorId),
  };

  let control: ReactNode;
  if (rest.multiline) {
    const { multiline: _m, ...area } = rest;
    control = <textarea rows={4} {...area} {...aria} className={cx(controlClass, 'border-edge py-2')} />;
  } else {
    const { multiline: _m, ...input } = rest;
    control = <input type="text" {...input} {...aria} className={cx(controlClass, 'min-h-10 border-edge py-1.5')} />;
  }

  return (
    <div className={cx('flex flex-col gap-1.5', className)}>
      <FieldLabel htmlFor={id} optional={optional}>
        {label}
      </FieldLabel>
      {description && descriptionId && <FieldDescription id={descriptionId}>{description}</FieldDescription>}
      {control}
      {error && errorId && <FieldError id={errorId}>{error}</FieldError>}
    </div>
  );
}
