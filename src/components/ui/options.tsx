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
