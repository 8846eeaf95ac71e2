/** A row of buttons choosing one of a few values: radios (a unit) or tabs (a list). */
export function Segmented<T extends string>({
  kind = "radio",
  label,
  options,
  value,
  onChange,
  optionLabel,
  padding = "px-3 py-1",
  hover = true,
}: {
  kind?: "radio" | "tab";
  label: string;
  options: readonly T[];
  value: T;
  onChange: (value: T) => void;
  optionLabel: (value: T) => string;
  padding?: string;
  hover?: boolean;
}) {
  const group = { "aria-label": label, className: "inline-flex rounded-card border border-stone text-sm" };
  const buttons = options.map((o) => (
    <button
      key={o}
      type="button"
      role={kind}
      {...(kind === "radio" ? { "aria-checked": value === o } : { "aria-selected": value === o })}
      onClick={() => onChange(o)}
      className={`${padding} ${value === o ? "bg-accent text-paper-sheet" : hover ? "text-ink-soft hover:bg-paper-deep" : "text-ink-soft"}`}
    >
      {optionLabel(o)}
    </button>
  ));
  return kind === "radio" ? (
    <div role="radiogroup" {...group}>
      {buttons}
    </div>
  ) : (
    <div role="tablist" {...group}>
      {buttons}
    </div>
  );
}
