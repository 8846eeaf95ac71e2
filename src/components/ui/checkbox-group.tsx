import type { UseFormRegisterReturn } from "react-hook-form";

const LOOKS = {
  roomy: { row: "flex flex-wrap gap-4", label: "inline-flex items-center gap-2 text-sm", box: "h-4 w-4 accent-[var(--color-accent)]" },
  compact: { row: "flex flex-wrap gap-3", label: "inline-flex items-center gap-1.5 text-sm", box: "h-4 w-4" },
} as const;

/** A fieldset of checkboxes over one of the shared lists, each by its label, all bound to one form field (an array of the checked values). */
export function CheckboxGroup<T extends string>({
  legend,
  values,
  labels,
  field,
  look = "roomy",
  className,
}: {
  legend: string;
  values: readonly T[];
  labels: Record<T, string>;
  field: UseFormRegisterReturn;
  look?: keyof typeof LOOKS;
  className?: string;
}) {
  const l = LOOKS[look];
  return (
    <fieldset className={className}>
      <legend className="mb-1 text-sm font-medium text-ink-soft">{legend}</legend>
      <div className={l.row}>
        {values.map((v) => (
          <label key={v} className={l.label}>
            <input type="checkbox" value={v} className={l.box} {...field} />
            {labels[v]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
