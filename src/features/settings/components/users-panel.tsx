import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { ROLES, ROLE_LABELS } from "@shared/schemas/auth.ts";
import { UserCreateSchema, type UserCreate } from "@shared/schemas/users.ts";
import type { ClientRecord } from "@shared/schemas/clients.ts";
import type { z } from "zod";
import { SelectField, TextField } from "@/components/ui/field.tsx";
import { Button } from "@/components/ui/button.tsx";
import { ErrorNotice, Notice } from "@/components/ui/feedback.tsx";
import { ApiError } from "@/lib/api-client.ts";
import { useServerErrors } from "@/lib/form-errors.ts";
import { useCreateUser, useUsers } from "../api/users.ts";
import { EnumOptions, RecordOptions, byName } from "@/components/ui/options.tsx";
import { SettingsSection } from "./settings-section.tsx";

type Input = z.input<typeof UserCreateSchema>;

/** The studio's accounts; the admin adds people here (there is no self sign-up). */
export function UsersPanel({ clients }: { clients: ClientRecord[] }) {
  const users = useUsers();
  const create = useCreateUser();
  const [done, setDone] = useState<string | null>(null);
  const form = useForm<Input, unknown, UserCreate>({
    resolver: zodResolver(UserCreateSchema),
    defaultValues: { name: "", email: "", role: "framer", clientId: null, password: "" },
  });
  const role = form.watch("role");
  const e = form.formState.errors;
  const server = useServerErrors(form);
  const submit = form.handleSubmit(async (v) => {
    setDone(null);
    const u = await server.run(() => create.mutateAsync(v));
    if (!u) return;
    setDone(`${u.name} can now sign in as ${u.email}.`);
    form.reset({ name: "", email: "", role: v.role, clientId: null, password: "" });
  });
  const choices = clients.filter((c) => (role === "collector" ? c.kind === "private" : c.kind === "institution"));
  return (
    <SettingsSection title="People and roles">
      <ul className="divide-y divide-stone-light text-sm" data-testid="users">
        {(users.data ?? []).map((u) => (
          <li key={u.id} className="flex flex-wrap justify-between gap-2 py-1.5">
            <span>
              <span className="font-medium">{u.name}</span> <span className="text-graphite">· {u.email}</span>
            </span>
            <span className="text-ink-soft">
              {ROLE_LABELS[u.role]}
              {u.clientName ? ` · ${u.clientName}` : ""}
            </span>
          </li>
        ))}
      </ul>
      {done && (
        <Notice tone="pass" title="Account made">
          {done}
        </Notice>
      )}
      {create.isError && !(create.error instanceof ApiError && Object.keys(create.error.fields).length) && <ErrorNotice title="Not made" error={create.error} />}
      <form onSubmit={submit} noValidate className="grid gap-3 md:grid-cols-2">
        <TextField label="Name" error={e.name?.message} {...form.register("name")} />
        <TextField label="E-mail address" type="email" error={e.email?.message} {...form.register("email")} />
        <SelectField label="Role" error={e.role?.message} {...form.register("role")}>
          <EnumOptions values={ROLES} labels={ROLE_LABELS} />
        </SelectField>
        <SelectField
          label="Client"
          disabled={role !== "collector" && role !== "registrar"}
          error={e.clientId?.message}
          {...form.register("clientId", { setValueAs: (v) => (v === "" ? null : v) })}
        >
          <option value="">{role === "collector" || role === "registrar" ? "Choose…" : "— (studio staff)"}</option>
          <RecordOptions items={choices} text={byName} />
        </SelectField>
        <TextField
          label="First password"
          type="password"
          autoComplete="new-password"
          error={e.password?.message}
          hint="At least 12 characters: a phrase of unrelated words, not built from the name, the e-mail address or the studio's name. Tell the person privately."
          {...form.register("password")}
        />
        <div className="flex items-end">
          <Button type="submit" disabled={form.formState.isSubmitting}>
            Add the account
          </Button>
        </div>
      </form>
    </SettingsSection>
  );
}
