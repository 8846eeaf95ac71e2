import { z } from "zod";

export const ROLES = ["admin", "framer", "registrar", "collector"] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Studio admin",
  framer: "Framer",
  registrar: "Registrar",
  collector: "Collector",
};

/** The signed-in user as the API and the UI see it. */
export const SessionUserSchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  role: RoleSchema,
  clientId: z.string().nullable(),
});
export type SessionUser = z.infer<typeof SessionUserSchema>;

export const SignInSchema = z.object({
  email: z.email({ message: "Enter the e-mail address you sign in with." }),
  password: z.string().min(1, { message: "Enter your password." }),
});
export type SignIn = z.infer<typeof SignInSchema>;
