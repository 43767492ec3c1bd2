import { createHash, randomBytes } from "node:crypto";

/** A link token: 32 random bytes for the mail, its SHA-256 for the database. */
export function createLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export const tokenLifetimeSeconds = {
  invitation: 7 * 24 * 3600,
  password_reset: 3600,
} as const;
