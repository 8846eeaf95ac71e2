import { z } from "zod";
import { optionalText, requiredText } from "./common.ts";

export const CLIENT_KINDS = ["private", "institution"] as const;
export const CLIENT_KIND_LABELS: Record<(typeof CLIENT_KINDS)[number], string> = {
  private: "Private owner",
  institution: "Institution",
};

export const ClientCreateSchema = z.object({
  kind: z.enum(CLIENT_KINDS, { message: "Choose private owner or institution." }),
  name: requiredText(200, "Give the client's name."),
  contactName: optionalText(200),
  email: z
    .string()
    .trim()
    .refine((v) => v === "" || z.email().safeParse(v).success, { message: "Enter a valid e-mail address, or leave it empty." })
    .transform((v) => (v === "" ? null : v))
    .nullable()
    .optional()
    .transform((v) => v ?? null),
  phone: optionalText(60),
  address: optionalText(500),
  notes: optionalText(2000),
});
export type ClientCreate = z.infer<typeof ClientCreateSchema>;
export type ClientCreateInput = z.input<typeof ClientCreateSchema>;
export const ClientUpdateSchema = ClientCreateSchema;

export type ClientRecord = ClientCreate & { id: string; objectCount: number; createdAt: string; updatedAt: string };
