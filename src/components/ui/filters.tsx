import type { ReactNode } from "react";
import { FilterSelect } from "./field.tsx";
import { RecordOptions, byName } from "./options.tsx";

/** A filter over one of the shared lists: "any" first, then each value by its label. */
export function EnumFilter<T extends string>({
  label,
  any,
  values,
  labels,
  value,
  onChange,
}: {
  label: string;
  any: string;
  values: readonly T[];
  labels: Record<T, string> | ((v: T) => ReactNode);
  value: string | undefined;
  onChange: (value: T | undefined) => void;
}) {
  const name = typeof labels === "function" ? labels : (v: T) => labels[v];
  return (
    <FilterSelect aria-label={label} value={value ?? ""} onChange={(e) => onChange((e.target.value || undefined) as T | undefined)}>
      <option value="">{any}</option>
      {values.map((v) => (
        <option key={v} value={v}>
          {name(v)}
        </option>
      ))}
    </FilterSelect>
  );
}

/** A filter over records (an owner, a framer, an examiner): "any" first, then each by its name. */
export function RecordFilter({
  label,
  any,
  items,
  value,
  onChange,
}: {
  label: string;
  any: string;
  items: readonly { id: string; name: string }[] | undefined;
  value: string | undefined;
  onChange: (value: string | undefined) => void;
}) {
  return (
    <FilterSelect aria-label={label} value={value ?? ""} onChange={(e) => onChange(e.target.value || undefined)}>
      <option value="">{any}</option>
      <RecordOptions items={items ?? []} text={byName} />
    </FilterSelect>
  );
}

const DATE_CONTROL = "rounded-card border border-stone bg-paper-sheet text-sm text-ink num focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/30";

/** A labelled date filter; an emptied date is no filter. */
export function DateFilter({
  label,
  value,
  onChange,
  wrapClassName = "inline-flex items-center gap-2 text-sm text-ink-soft",
  inputClassName = `${DATE_CONTROL} px-2 py-1.5`,
  ariaLabel,
}: {
  label: string;
  value: string | undefined;
  onChange: (value: string | undefined) => void;
  wrapClassName?: string;
  inputClassName?: string;
  ariaLabel?: string;
}) {
  return (
    <label className={wrapClassName}>
      {label}
      <input type="date" aria-label={ariaLabel} className={inputClassName} value={value ?? ""} onChange={(e) => onChange(e.target.value || undefined)} />
    </label>
  );
}
DateFilter.roomy = `${DATE_CONTROL} px-3 py-2`;

/** "Clear filters", shown only while a filter is set. */
export function ClearFilters({ shown, onClear, className = "" }: { shown: boolean; onClear: () => void; className?: string }) {
  if (!shown) return null;
  return (
    <button type="button" className={`text-sm font-medium text-accent hover:underline ${className}`} onClick={onClear}>
      Clear filters
    </button>
  );
}
