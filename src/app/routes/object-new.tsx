import { useNavigate, useSearchParams } from "react-router";
import { can } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useStudio } from "@/features/settings/api/settings.ts";
import { useClients } from "@/features/clients/api/clients.ts";
import { useCreateObject, useNextObjectNumber } from "@/features/objects/api/objects.ts";
import { ObjectForm, toFormValues } from "@/features/objects/components/object-form.tsx";
import { Notice, SkeletonRows } from "@/components/ui/feedback.tsx";

export function Component() {
  const { data: user } = useMe();
  const allowed = can(user, "object:create");
  const { settings, unit } = useStudio();
  const clients = useClients(allowed);
  const next = useNextObjectNumber(allowed);
  const create = useCreateObject();
  const navigate = useNavigate();
  const [params] = useSearchParams();

  if (!allowed)
    return (
      <Notice tone="warn" title="Not available">
        Only studio staff record new objects.
      </Notice>
    );
  if (!settings || clients.isPending || next.isPending) return <SkeletonRows />;

  const defaults = toFormValues({ objectNumber: next.data?.objectNumber, clientId: params.get("client") ?? undefined }, unit, { currency: settings.currency });
  return (
    <div className="max-w-4xl space-y-5">
      <header>
        <h1 className="text-2xl font-bold tracking-tight">New object</h1>
        <p className="text-sm text-graphite">Record what the work is, its size and who owns it. The mount plan and condition come next, on the object's page.</p>
      </header>
      <ObjectForm
        defaultValues={defaults}
        studioUnit={unit}
        clients={clients.data ?? []}
        canEditOwner
        showValuation
        submitLabel="Save object"
        onSubmit={async (values) => {
          const obj = await create.mutateAsync(values);
          navigate(`/objects/${obj.id}`);
        }}
        onCancel={() => navigate(-1)}
      />
    </div>
  );
}
