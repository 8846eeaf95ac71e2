import { forwardRef, useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from "react";

const CONTROL =
  "block rounded-card border bg-paper-sheet px-3 py-2 text-sm text-ink placeholder:text-graphite focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/30";
const controlClass = (error?: string, width = "w-full") => `${CONTROL} ${width} ${error ? "border-fail" : "border-stone"}`;

type FieldProps = { label: string; error?: string; hint?: ReactNode; className?: string; children: (ids: { id: string; describedBy?: string }) => ReactNode };

/** A labelled control with its hint and its error message, wired for screen readers. */
export function Field({ label, error, hint, className = "", children }: FieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="mb-1 block text-sm font-medium text-ink-soft">
        {label}
      </label>
      {children({ id, describedBy })}
      {hint && (
        <p id={hintId} className="mt-1 text-xs text-graphite">
          {hint}
        </p>
      )}
      {error && (
        <p id={errorId} role="alert" className="mt-1 flex items-start gap-1 text-sm text-fail">
          <span aria-hidden="true">▲</span>
          {error}
        </p>
      )}
    </div>
  );
}

type InputProps = InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; hint?: ReactNode; wrapClassName?: string };
export const TextField = forwardRef<HTMLInputElement, InputProps>(function TextField({ label, error, hint, wrapClassName, className = "", ...props }, ref) {
  return (
    <Field label={label} error={error} hint={hint} className={wrapClassName}>
      {({ id, describedBy }) => <input ref={ref} id={id} aria-invalid={!!error} aria-describedby={describedBy} {...props} className={`${controlClass(error)} ${className}`} />}
    </Field>
  );
});

type SelectProps = SelectHTMLAttributes<HTMLSelectElement> & { label: string; error?: string; hint?: ReactNode; wrapClassName?: string };
export const SelectField = forwardRef<HTMLSelectElement, SelectProps>(function SelectField({ label, error, hint, wrapClassName, className = "", children, ...props }, ref) {
  return (
    <Field label={label} error={error} hint={hint} className={wrapClassName}>
      {({ id, describedBy }) => (
        <select
          ref={ref}
          id={id}
          aria-invalid={!!error}
          aria-describedby={describedBy}
          {...props}
          className={`${controlClass(error)} disabled:bg-paper-deep disabled:text-graphite ${className}`}
        >
          {children}
        </select>
      )}
    </Field>
  );
});

type AreaProps = TextareaHTMLAttributes<HTMLTextAreaElement> & { label: string; error?: string; hint?: ReactNode; wrapClassName?: string };
export const TextAreaField = forwardRef<HTMLTextAreaElement, AreaProps>(function TextAreaField({ label, error, hint, wrapClassName, className = "", ...props }, ref) {
  return (
    <Field label={label} error={error} hint={hint} className={wrapClassName}>
      {({ id, describedBy }) => (
        <textarea ref={ref} id={id} rows={3} aria-invalid={!!error} aria-describedby={describedBy} {...props} className={`${controlClass(error)} ${className}`} />
      )}
    </Field>
  );
});

/** Plain select without label, for filter bars (label it with aria-label). */
export function FilterSelect(props: SelectHTMLAttributes<HTMLSelectElement>) {
  return <select {...props} className={`${controlClass(undefined, "w-auto")} py-2 ${props.className ?? ""}`} />;
}
export function SearchInput(props: InputHTMLAttributes<HTMLInputElement>) {
  return <input type="search" {...props} className={`${controlClass()} ${props.className ?? ""}`} />;
}
