import { useNavigate, useParams } from "react-router";
import { can } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useStudio } from "@/features/settings/api/settings.ts";
import { useClients } from "@/features/clients/api/clients.ts";
import { useObject, useUpdateObject } from "@/features/objects/api/objects.ts";
import { ObjectForm, toFormValues } from "@/features/objects/components/object-form.tsx";
import { ErrorNotice, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";

export function Component() {
  const { id = "" } = useParams();
  const { data: user } = useMe();
  const { settings, unit } = useStudio();
  const object = useObject(id);
  const clients = useClients();
  const update = useUpdateObject(id);
  const navigate = useNavigate();

  if (object.isError) return <ErrorNotice title="Object not found" error={object.error} />;
  if (!settings || object.isPending || clients.isPending) return <SkeletonRows />;
  const o = object.data;
  if (!can(user, "object:update", { clientId: o.clientId }))
    return (
      <Notice tone="warn" title="Read only">
        Your role cannot edit this record.
      </Notice>
    );

  return (
    <div className="max-w-4xl space-y-5">
      <header>
        <p className="text-sm font-semibold text-graphite num">{o.objectNumber}</p>
        <h1 className="text-2xl font-bold tracking-tight">Edit catalogue record</h1>
      </header>
      <ObjectForm
        key={o.version}
        initial={o}
        defaultValues={toFormValues(o, unit, { currency: settings.currency })}
        studioUnit={unit}
        clients={clients.data ?? []}
        canEditOwner={can(user, "object:reassign")}
        statusLocked
        showValuation={o.valuationVisible && can(user, "valuation:update", { clientId: o.clientId })}
        submitLabel="Save changes"
        onSubmit={async (values) => {
          await update.mutateAsync({ ...values, version: o.version });
          navigate(`/objects/${o.id}`);
        }}
        onCancel={() => navigate(`/objects/${o.id}`)}
      />
    </div>
  );
}
