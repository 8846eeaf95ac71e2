import { Link, useParams } from "react-router";
import { CLIENT_KIND_LABELS } from "@shared/schemas/clients.ts";
import { can, isStudio } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useStudio } from "@/features/settings/api/settings.ts";
import { useClient } from "@/features/clients/api/clients.ts";
import { useObjects } from "@/features/objects/api/objects.ts";
import { ObjectsTable } from "@/features/objects/components/objects-table.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { Card, EmptyState, ErrorNotice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { DocumentButton } from "@/features/documents/components/document-button.tsx";
import { ExportsPanel } from "@/features/documents/components/exports-panel.tsx";

export function Component() {
  const { id = "" } = useParams();
  const { data: user } = useMe();
  const { unit } = useStudio();
  const client = useClient(id);
  const objects = useObjects({ clientId: id, pageSize: 100 });
  if (client.isPending) return <SkeletonRows />;
  if (client.isError) return <ErrorNotice title="Client not found" error={client.error} />;
  const c = client.data;
  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-sm text-graphite">{CLIENT_KIND_LABELS[c.kind]}</p>
          <h1 className="text-2xl font-bold tracking-tight">{c.name}</h1>
        </div>
        {can(user, "client:write") && (
          <div className="flex gap-2">
            <ButtonLink to={`/objects/new?client=${c.id}`}>New object for this client</ButtonLink>
            <ButtonLink to={`/clients/${c.id}/edit`} variant="secondary">
              Edit client
            </ButtonLink>
          </div>
        )}
      </header>
      <Card title="Contact">
        <dl className="grid gap-x-8 gap-y-2 text-sm md:grid-cols-2">
          {(
            [
              ["Contact", c.contactName],
              ["E-mail", c.email],
              ["Phone", c.phone],
              ["Address", c.address],
              ["Notes", c.notes],
            ] as const
          ).map(([k, v]) => (
            <div key={k} className="grid grid-cols-[6rem_1fr] gap-2">
              <dt className="text-graphite">{k}</dt>
              <dd className="whitespace-pre-line">{v ?? "—"}</dd>
            </div>
          ))}
        </dl>
      </Card>
      <Card title="Documents and exports">
        <div className="space-y-4">
          {can(user, "valuation:read", { clientId: c.id }) && (
            <DocumentButton url={`/api/clients/${c.id}/documents/schedule`} label="Schedule of values (PDF)" fallbackName={`schedule-${c.name}.pdf`} variant="primary" />
          )}
          <ExportsPanel clientId={c.id} showValuations={can(user, "valuation:read", { clientId: c.id })} mayTakeOriginals={!!user && isStudio(user)} />
        </div>
      </Card>
      <Card title={`Objects${objects.data ? ` · ${objects.data.total}` : ""}`}>
        {objects.isPending ? (
          <SkeletonRows rows={4} />
        ) : !objects.data?.items.length ? (
          <EmptyState title="No objects for this client yet" />
        ) : (
          <div className="-mx-5 -my-4">
            <ObjectsTable items={objects.data.items} unit={unit} showOwner={false} />
            {objects.data.total > objects.data.items.length && (
              <p className="px-5 py-3 text-sm">
                <Link className="text-accent underline" to={`/objects?client=${c.id}`}>
                  See all {objects.data.total} in the register
                </Link>
              </p>
            )}
          </div>
        )}
      </Card>
    </div>
  );
}
