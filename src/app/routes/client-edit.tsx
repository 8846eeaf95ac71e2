import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useNavigate, useParams } from "react-router";
import { CLIENT_KINDS, CLIENT_KIND_LABELS, ClientCreateSchema, type ClientCreate, type ClientCreateInput, type ClientRecord } from "@shared/schemas/clients.ts";
import { can } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useClient, useSaveClient } from "@/features/clients/api/clients.ts";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field.tsx";
import { Button } from "@/components/ui/button.tsx";
import { ErrorNotice, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { useServerErrors } from "@/lib/form-errors.ts";
import { EnumOptions } from "@/components/ui/options.tsx";

function ClientForm({ initial }: { initial?: ClientRecord }) {
  const navigate = useNavigate();
  const save = useSaveClient(initial?.id);
  const form = useForm<ClientCreateInput, unknown, ClientCreate>({
    resolver: zodResolver(ClientCreateSchema),
    defaultValues: {
      kind: initial?.kind ?? "private",
      name: initial?.name ?? "",
      contactName: initial?.contactName ?? "",
      email: initial?.email ?? "",
      phone: initial?.phone ?? "",
      address: initial?.address ?? "",
      notes: initial?.notes ?? "",
    },
  });
  const e = form.formState.errors;
  const server = useServerErrors(form);
  const submit = form.handleSubmit(async (values) => {
    const c = await server.run(() => save.mutateAsync(values));
    if (c) navigate(`/clients/${c.id}`);
  });
  return (
    <form onSubmit={submit} noValidate className="grid max-w-3xl gap-4 rounded-card bg-paper-sheet p-5 shadow-card md:grid-cols-2">
      {server.error && (
        <div className="col-span-full">
          <ErrorNotice title="Not saved" error={server.error} />
        </div>
      )}
      <SelectField label="Kind" error={e.kind?.message} {...form.register("kind")}>
        <EnumOptions values={CLIENT_KINDS} labels={CLIENT_KIND_LABELS} />
      </SelectField>
      <TextField label="Name" error={e.name?.message} {...form.register("name")} />
      <TextField label="Contact person" error={e.contactName?.message} {...form.register("contactName")} />
      <TextField label="E-mail" type="email" error={e.email?.message} {...form.register("email")} />
      <TextField label="Phone" error={e.phone?.message} {...form.register("phone")} />
      <TextAreaField label="Address" error={e.address?.message} {...form.register("address")} />
      <TextAreaField label="Notes" wrapClassName="col-span-full" error={e.notes?.message} {...form.register("notes")} />
      <div className="col-span-full flex gap-3">
        <Button type="submit" disabled={form.formState.isSubmitting}>
          {initial ? "Save changes" : "Save client"}
        </Button>
        <Button variant="secondary" onClick={() => navigate(-1)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export function Component() {
  const { id } = useParams();
  const { data: user } = useMe();
  const client = useClient(id ?? "");
  if (!can(user, "client:write"))
    return (
      <Notice tone="warn" title="Not available">
        Only studio staff edit clients.
      </Notice>
    );
  if (id && client.isPending) return <SkeletonRows />;
  if (id && client.isError) return <ErrorNotice error={client.error} />;
  return (
    <div className="space-y-5">
      <h1 className="text-2xl font-bold tracking-tight">{id ? "Edit client" : "New client"}</h1>
      <ClientForm initial={id ? client.data : undefined} />
    </div>
  );
}
