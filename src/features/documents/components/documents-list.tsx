import { Link } from "react-router";
import { DOCUMENT_KIND_LABELS, type IssuedDocument } from "@shared/schemas/documents.ts";
import { EmptyState } from "@/components/ui/feedback.tsx";
import { formatDateTime } from "@/lib/format.ts";

export function DocumentsList({ items, showObject = false }: { items: IssuedDocument[]; showObject?: boolean }) {
  if (items.length === 0)
    return <EmptyState title="No documents issued">Dossiers, condition reports, schedules and back labels issued here are listed with their verification codes.</EmptyState>;
  return (
    <table className="w-full text-sm" data-testid="documents">
      <thead className="border-b border-stone text-left text-ink-soft">
        <tr>
          <th scope="col" className="px-2 py-2 font-semibold">
            Issued
          </th>
          <th scope="col" className="px-2 py-2 font-semibold">
            Document
          </th>
          {showObject && (
            <th scope="col" className="px-2 py-2 font-semibold">
              For
            </th>
          )}
          <th scope="col" className="px-2 py-2 font-semibold">
            Verification code
          </th>
          <th scope="col" className="px-2 py-2 font-semibold">
            By
          </th>
        </tr>
      </thead>
      <tbody>
        {items.map((d) => (
          <tr key={d.id} className="border-b border-stone-light">
            <td className="whitespace-nowrap px-2 py-2 num">{formatDateTime(d.issuedAt)}</td>
            <td className="px-2 py-2">{DOCUMENT_KIND_LABELS[d.kind]}</td>
            {showObject && (
              <td className="px-2 py-2">
                {d.objectId ? (
                  <Link className="text-accent hover:underline" to={`/objects/${d.objectId}`}>
                    {d.title}
                  </Link>
                ) : (
                  d.title
                )}
              </td>
            )}
            <td className="px-2 py-2 font-mono text-xs">
              <Link className="text-accent hover:underline" to={`/verify/${d.code}`}>
                {d.code}
              </Link>
            </td>
            <td className="px-2 py-2 text-ink-soft">{d.issuedByName}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
