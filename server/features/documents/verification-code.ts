import { randomBytes } from "node:crypto";

/** A verification code people can read out: 12 hex digits in three groups, from a CSPRNG. */
export function newVerificationCode(): string {
  const hex = randomBytes(6).toString("hex").toUpperCase();
  return `${hex.slice(0, 4)}-${hex.slice(4, 8)}-${hex.slice(8, 12)}`;
}
