import { Navigate } from "react-router";
import { isStudio } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useStudio } from "@/features/settings/api/settings.ts";
import { useObjects } from "@/features/objects/api/objects.ts";
import { ObjectsTable } from "@/features/objects/components/objects-table.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { Card, EmptyState, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";

/** Bench: today's work — what is in the studio now. */
export function Component() {
  const { data: user } = useMe();
  const { unit, settings } = useStudio();
  const studio = !!user && isStudio(user);
  const inStudio = useObjects({ status: "in-studio", sort: "updatedAt", dir: "desc", pageSize: 25 });
  if (user && !studio) return <Navigate to="/objects" replace />;

  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">Bench</h1>
          <p className="text-sm text-graphite">{settings?.studioName ?? "Your studio"} — the work in hand today.</p>
        </div>
        <div className="flex gap-2">
          <ButtonLink to="/objects/new">Receive an object</ButtonLink>
          <ButtonLink to="/objects" variant="secondary">
            Open the register
          </ButtonLink>
        </div>
      </header>
      <Notice tone="warn" title="At the bench">
        Glass and mount-cutter blades cut: wear gloves and eye protection, and put used blades in a sharps container. Lift heavy frames with two people,
        never by the top rail.
      </Notice>
      <Card title={`In the studio now${inStudio.data ? ` · ${inStudio.data.total}` : ""}`}>
        {inStudio.isPending ? (
          <SkeletonRows rows={5} />
        ) : inStudio.isError ? (
          <Notice tone="fail">{inStudio.error.message}</Notice>
        ) : inStudio.data.items.length === 0 ? (
          <EmptyState title="Nothing in the studio" action={<ButtonLink to="/objects/new">Receive an object</ButtonLink>}>
            Objects you receive show here until they go back to their owner.
          </EmptyState>
        ) : (
          <div className="-mx-5 -my-4">
            <ObjectsTable items={inStudio.data.items} unit={unit} />
          </div>
        )}
      </Card>
    </div>
  );
}
