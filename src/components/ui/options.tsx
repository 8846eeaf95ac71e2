import type { ReactNode } from "react";

/** A select's options from one of the shared lists, each by its label; `blank` first when the field may be left empty. */
export function EnumOptions<T extends string>({ values, labels, blank }: { values: readonly T[]; labels: Record<T, string>; blank?: string }) {
  return (
    <>
      {blank !== undefined && <option value="">{blank}</option>}
      {values.map((v) => (
        <option key={v} value={v}>
          {labels[v]}
        </option>
      ))}
    </>
  );
}

/** A select's options from records (clients, people, presets…): each one's id as the value, `text` as what is shown. */
export function RecordOptions<T extends { id: string }>({ items, text }: { items: readonly T[]; text: (item: T) => ReactNode }) {
  return (
    <>
      {items.map((item) => (
        <option key={item.id} value={item.id}>
          {text(item)}
        </option>
      ))}
    </>
  );
}

/** What most records are shown by in a select. */
export const byName = (item: { name: string }) => item.name;
