import { Link } from "react-router";
import { CLIENT_KIND_LABELS } from "@shared/schemas/clients.ts";
import { can } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useClients } from "@/features/clients/api/clients.ts";
import { ButtonLink } from "@/components/ui/button.tsx";
import { EmptyState, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";

export function Component() {
  const { data: user } = useMe();
  const clients = useClients();
  return (
    <div className="space-y-5">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">Clients</h1>
          <p className="text-sm text-graphite">Private owners and institutions whose works the studio looks after.</p>
        </div>
        {can(user, "client:write") && <ButtonLink to="/clients/new">New client</ButtonLink>}
      </header>
      <section className="rounded-card bg-paper-sheet shadow-card" aria-label="Clients">
        {clients.isPending ? (
          <SkeletonRows />
        ) : clients.isError ? (
          <div className="p-4"><Notice tone="fail">{clients.error.message}</Notice></div>
        ) : clients.data.length === 0 ? (
          <div className="p-4">
            <EmptyState title="No clients yet" action={can(user, "client:write") ? <ButtonLink to="/clients/new">Add the first client</ButtonLink> : undefined}>
              Each object belongs to a client: a private owner or an institution.
            </EmptyState>
          </div>
        ) : (
          <table className="w-full text-sm">
            <thead className="border-b border-stone text-left text-ink-soft">
              <tr>
                <th scope="col" className="px-4 py-2.5 font-semibold">Name</th>
                <th scope="col" className="px-4 py-2.5 font-semibold">Kind</th>
                <th scope="col" className="px-4 py-2.5 font-semibold">Contact</th>
                <th scope="col" className="px-4 py-2.5 text-right font-semibold">Objects</th>
              </tr>
            </thead>
            <tbody>
              {clients.data.map((c) => (
                <tr key={c.id} className="border-b border-stone-light last:border-0">
                  <td className="px-4 py-3 font-semibold">
                    <Link to={`/clients/${c.id}`} className="text-accent hover:underline">{c.name}</Link>
                  </td>
                  <td className="px-4 py-3 text-ink-soft">{CLIENT_KIND_LABELS[c.kind]}</td>
                  <td className="px-4 py-3 text-ink-soft">{[c.contactName, c.email].filter(Boolean).join(" · ") || "—"}</td>
                  <td className="px-4 py-3 text-right num">{c.objectCount}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </div>
  );
}
