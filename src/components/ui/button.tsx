import type { ButtonHTMLAttributes } from "react";
import { Link, type LinkProps } from "react-router";

type Variant = "primary" | "secondary" | "quiet" | "danger";
const BASE = "inline-flex items-center justify-center gap-2 rounded-card px-4 py-2 text-sm font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-60";
const VARIANTS: Record<Variant, string> = {
  primary: "bg-accent text-paper-sheet hover:bg-accent-hover",
  secondary: "border border-stone bg-paper-sheet text-ink hover:border-graphite-light hover:bg-paper-deep",
  quiet: "text-accent hover:bg-accent-soft",
  danger: "bg-fail text-paper-sheet hover:opacity-90",
};

export function buttonClass(variant: Variant = "primary", extra = "") {
  return `${BASE} ${VARIANTS[variant]} ${extra}`;
}

export function Button({ variant = "primary", className = "", ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button type="button" className={buttonClass(variant, className)} {...props} />;
}

export function ButtonLink({ variant = "primary", className = "", ...props }: LinkProps & { variant?: Variant }) {
  return <Link className={buttonClass(variant, className)} {...props} />;
}

/** A form's last row: save (saying so while it saves) and cancel. */
export function FormActions({
  submitting,
  label,
  busyLabel = "Saving…",
  onCancel,
  className = "flex gap-3",
}: {
  submitting: boolean;
  label: string;
  busyLabel?: string;
  onCancel: () => void;
  className?: string;
}) {
  return (
    <div className={className}>
      <Button type="submit" disabled={submitting}>
        {submitting ? busyLabel : label}
      </Button>
      <Button variant="secondary" onClick={onCancel}>
        Cancel
      </Button>
    </div>
  );
}
