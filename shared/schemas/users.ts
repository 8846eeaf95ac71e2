import { z } from "zod";
import { RoleSchema, type Role } from "./auth.ts";
import { optionalId, requiredText } from "./common.ts";

/** At least 12 characters: Reversa's rule, above the floor of 8 in NIST SP 800-63B (from memory). */
export const PASSWORD_MIN_LENGTH = 12;

/** A new account, made by the studio admin (there is no self sign-up). */
export const UserCreateSchema = z
  .object({
    name: requiredText(200, "Give the person's name."),
    email: z.email({ message: "Enter a valid e-mail address." }).transform((v) => v.toLowerCase()),
    role: RoleSchema,
    clientId: optionalId(),
    password: z
      .string({ message: "Give a first password." })
      .min(PASSWORD_MIN_LENGTH, { message: `Use at least ${PASSWORD_MIN_LENGTH} characters: a phrase of a few unrelated words is easiest to remember.` })
      .max(200),
  })
  .superRefine((u, ctx) => {
    const needsClient = u.role === "collector" || u.role === "registrar";
    if (needsClient && !u.clientId)
      ctx.addIssue({
        code: "custom",
        path: ["clientId"],
        message: u.role === "collector" ? "A collector belongs to one private owner: choose it." : "A registrar belongs to one institution: choose it.",
      });
    if (!needsClient && u.clientId) ctx.addIssue({ code: "custom", path: ["clientId"], message: "Studio staff do not belong to a client." });
  });
export type UserCreate = z.infer<typeof UserCreateSchema>;
export type UserRecord = { id: string; name: string; email: string; role: Role; clientId: string | null; clientName: string | null; createdAt: string };
