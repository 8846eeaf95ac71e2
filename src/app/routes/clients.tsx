import { Link } from "react-router";
import { CLIENT_KIND_LABELS, type ClientRecord } from "@shared/schemas/clients.ts";
import { can } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useClients } from "@/features/clients/api/clients.ts";
import { ButtonLink } from "@/components/ui/button.tsx";
import { DataTable, type Column } from "@/components/ui/data-table.tsx";
import { ListSection, PageHeader } from "@/components/ui/list-page.tsx";
import { EmptyState } from "@/components/ui/feedback.tsx";

const COLUMNS: Column<ClientRecord>[] = [
  {
    key: "name",
    header: "Name",
    td: "font-semibold",
    cell: (c) => (
      <Link to={`/clients/${c.id}`} className="text-accent hover:underline">
        {c.name}
      </Link>
    ),
  },
  { key: "kind", header: "Kind", td: "text-ink-soft", cell: (c) => CLIENT_KIND_LABELS[c.kind] },
  { key: "contact", header: "Contact", td: "text-ink-soft", cell: (c) => [c.contactName, c.email].filter(Boolean).join(" · ") || "—" },
  { key: "objects", header: "Objects", align: "right", td: "num", cell: (c) => c.objectCount },
];

export function Component() {
  const { data: user } = useMe();
  const clients = useClients();
  return (
    <div className="space-y-5">
      <PageHeader
        title="Clients"
        intro="Private owners and institutions whose works the studio looks after."
        actions={can(user, "client:write") && <ButtonLink to="/clients/new">New client</ButtonLink>}
      />
      <ListSection
        label="Clients"
        query={clients}
        isEmpty={(d) => d.length === 0}
        empty={
          <EmptyState title="No clients yet" action={can(user, "client:write") ? <ButtonLink to="/clients/new">Add the first client</ButtonLink> : undefined}>
            Each object belongs to a client: a private owner or an institution.
          </EmptyState>
        }
      >
        {(data) => (
          <DataTable
            columns={COLUMNS}
            rows={data}
            rowKey={(c) => c.id}
            head="plain"
            padX="px-4"
            tableClassName="w-full text-sm"
            rowClassName="border-b border-stone-light last:border-0"
          />
        )}
      </ListSection>
    </div>
  );
}
