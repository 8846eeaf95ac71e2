import { Navigate } from "react-router";
import { isStudio } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useStudio } from "@/features/settings/api/settings.ts";
import { useObjects } from "@/features/objects/api/objects.ts";
import { ObjectsTable } from "@/features/objects/components/objects-table.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { Card, EmptyState, Notice } from "@/components/ui/feedback.tsx";
import { noItems, PageHeader, QueryView } from "@/components/ui/list-page.tsx";

/** Bench: today's work — what is in the studio now. */
export function Component() {
  const { data: user } = useMe();
  const { unit, settings } = useStudio();
  const studio = !!user && isStudio(user);
  const inStudio = useObjects({ status: "in-studio", sort: "updatedAt", dir: "desc", pageSize: 25 });
  if (user && !studio) return <Navigate to="/objects" replace />;

  return (
    <div className="space-y-6">
      <PageHeader
        title="Bench"
        intro={`${settings?.studioName ?? "Your studio"} — the work in hand today.`}
        actions={
          <div className="flex gap-2">
            <ButtonLink to="/objects/new">Receive an object</ButtonLink>
            <ButtonLink to="/objects" variant="secondary">
              Open the register
            </ButtonLink>
          </div>
        }
      />
      <Notice tone="warn" title="At the bench">
        Glass and mount-cutter blades cut: wear gloves and eye protection, and put used blades in a sharps container. Lift heavy frames with two people, never by the top rail.
      </Notice>
      <Card title={`In the studio now${inStudio.data ? ` · ${inStudio.data.total}` : ""}`}>
        <QueryView
          query={inStudio}
          rows={5}
          isEmpty={noItems}
          empty={
            <EmptyState title="Nothing in the studio" action={<ButtonLink to="/objects/new">Receive an object</ButtonLink>}>
              Objects you receive show here until they go back to their owner.
            </EmptyState>
          }
        >
          {(data) => (
            <div className="-mx-5 -my-4">
              <ObjectsTable items={data.items} unit={unit} />
            </div>
          )}
        </QueryView>
      </Card>
    </div>
  );
}
