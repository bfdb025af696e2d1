import { useCallback, useMemo, useRef, useState, type ChangeEvent, type FocusEvent, type FormEvent, type PointerEvent } from 'react';
import type { z } from 'zod';
import { ApiError, errorMessage } from './api-client';
import { useFocusAfterRender } from './focus-after-render';

/**
 * A small form hook around a zod schema (usually one from @shared/api).
 *
 * - Values are the raw strings of the inputs; `prepare` turns them into the request
 *   (e.g. empty optional fields become undefined) before the schema parses them.
 * - Validation runs on every change. A field's message appears once the field has
 *   been left (blur) or a submit was tried, and then follows what the person types.
 * - Leaving a field by pressing the submit button does not show its message first:
 *   the message would push the button down mid-click and the click would be lost.
 *   The submit then checks every field anyway.
 * - On a failed submit, focus moves to the first field with a problem; if the server
 *   refuses, its message is shown in the form's notice (which takes focus) and its
 *   field messages beside the fields.
 */

export type FieldErrors<K extends string> = Partial<Record<K, string>>;

interface Options<K extends string, S extends z.ZodType> {
  initial: Record<K, string>;
  schema: S;
  /** Turn input strings into what the schema expects. Defaults to the values themselves. */
  prepare?: (values: Record<K, string>) => unknown;
  /** Extra client-side rules beyond the schema (e.g. "passwords match"). */
  check?: (values: Record<K, string>) => FieldErrors<K>;
}

export interface FieldProps {
  name: string;
  value: string;
  error?: string;
  onChange: (event: ChangeEvent<HTMLInputElement | HTMLTextAreaElement | HTMLSelectElement>) => void;
  onBlur: (event: FocusEvent<HTMLElement>) => void;
  ref: (element: HTMLElement | null) => void;
}

function issuesToErrors<K extends string>(issues: readonly z.core.$ZodIssue[], fields: readonly K[]): { fieldErrors: FieldErrors<K>; formError?: string } {
  const fieldErrors: FieldErrors<K> = {};
  let formError: string | undefined;
  for (const issue of issues) {
    const key = issue.path[0];
    if (typeof key === 'string' && (fields as readonly string[]).includes(key)) {
      fieldErrors[key as K] ??= issue.message;
    } else {
      formError ??= issue.message;
    }
  }
  return { fieldErrors, formError };
}

function isSubmitButton(target: EventTarget | null): boolean {
  return target instanceof Element && target.closest('button[type="submit"], input[type="submit"]') !== null;
}

export function useZodForm<K extends string, S extends z.ZodType>({ initial, schema, prepare, check }: Options<K, S>) {
  const fields = useMemo(() => Object.keys(initial) as K[], [initial]);
  const [values, setValues] = useState<Record<K, string>>(initial);
  const [touched, setTouched] = useState<Partial<Record<K, boolean>>>({});
  const [submitted, setSubmitted] = useState(false);
  const [serverFieldErrors, setServerFieldErrors] = useState<FieldErrors<K>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const elements = useRef(new Map<K, HTMLElement>());
  const { ref: noticeRef, requestFocus: focusNotice } = useFocusAfterRender<HTMLDivElement>();
  const pressingSubmit = useRef(false);

  const validate = useCallback(
    (v: Record<K, string>) => {
      const parsed = schema.safeParse(prepare ? prepare(v) : v);
      const extra = check ? check(v) : {};
      const { fieldErrors, formError: schemaFormError } = parsed.success
        ? { fieldErrors: {} as FieldErrors<K>, formError: undefined }
        : issuesToErrors<K>(parsed.error.issues, fields);
      const errors: FieldErrors<K> = { ...extra, ...fieldErrors };
      const ok = parsed.success && Object.keys(extra).length === 0;
      return { ok, data: parsed.success ? (parsed.data as z.infer<S>) : undefined, errors, schemaFormError };
    },
    [schema, prepare, check, fields],
  );

  const result = useMemo(() => validate(values), [validate, values]);

  const visibleError = (name: K): string | undefined =>
    serverFieldErrors[name] ?? (submitted || touched[name] ? result.errors[name] : undefined);

  const setValue = (name: K, value: string) => {
    setValues((prev) => ({ ...prev, [name]: value }));
    setServerFieldErrors((prev) => {
      if (!(name in prev)) return prev;
      const next = { ...prev };
      delete next[name];
      return next;
    });
  };

  const field = (name: K): FieldProps => ({
    name,
    value: values[name],
    error: visibleError(name),
    onChange: (event) => setValue(name, event.target.value),
    onBlur: (event) => {
      if (pressingSubmit.current || isSubmitButton(event.relatedTarget)) return;
      setTouched((prev) => (prev[name] ? prev : { ...prev, [name]: true }));
    },
    ref: (element) => {
      if (element) elements.current.set(name, element);
      else elements.current.delete(name);
    },
  });

  const focusFirst = (names: K[]) => {
    const first = fields.find((f) => names.includes(f));
    if (first) elements.current.get(first)?.focus();
  };

  /** Show a server refusal: its message in the notice, its field messages beside fields. */
  const showServerError = (error: unknown) => {
    const byField: FieldErrors<K> = {};
    if (error instanceof ApiError) {
      for (const [path, message] of Object.entries(error.fields)) {
        const key = path.split('.')[0];
        if ((fields as string[]).includes(key)) byField[key as K] = message;
      }
    }
    setServerFieldErrors(byField);
    setFormError(errorMessage(error));
    focusNotice();
  };

  const handleSubmit =
    (onValid: (data: z.infer<S>) => void | Promise<unknown>) =>
    (event: FormEvent<HTMLFormElement>) => {
      event.preventDefault();
      setSubmitted(true);
      setFormError(null);
      setServerFieldErrors({});
      const now = validate(values);
      if (!now.ok) {
        const bad = Object.keys(now.errors) as K[];
        if (bad.length > 0) focusFirst(bad);
        else if (now.schemaFormError) {
          setFormError(now.schemaFormError);
          focusNotice();
        }
        return;
      }
      void Promise.resolve(onValid(now.data as z.infer<S>)).catch(showServerError);
    };

  /** Props for the <form>: submit handling, no browser bubbles (we show our own), and the submit-press guard. */
  const formProps = (onValid: (data: z.infer<S>) => void | Promise<unknown>) => ({
    onSubmit: handleSubmit(onValid),
    noValidate: true,
    onPointerDownCapture: (event: PointerEvent<HTMLFormElement>) => {
      if (!isSubmitButton(event.target)) return;
      pressingSubmit.current = true;
      const release = () => setTimeout(() => (pressingSubmit.current = false), 0);
      window.addEventListener('pointerup', release, { once: true });
      window.addEventListener('pointercancel', release, { once: true });
    },
  });

  const reset = (next: Record<K, string> = initial) => {
    setValues(next);
    setTouched({});
    setSubmitted(false);
    setServerFieldErrors({});
    setFormError(null);
  };

  return {
    values,
    setValue,
    field,
    handleSubmit,
    formProps,
    reset,
    formError,
    /** Attach to the form's Notice so it can take focus when the server refuses. */
    noticeRef,
    showServerError,
    isValid: result.ok,
  };
}
