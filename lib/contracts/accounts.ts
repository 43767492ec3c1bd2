// The shapes the JSON API and the client components share. Dates travel as ISO strings.
import type { Role } from "@/lib/domain/access/permissions";

export interface AccountDto {
  id: string;
  email: string;
  name: string;
  role: Role;
  status: "invited" | "active" | "deactivated";
  lastSignInAt: string | null;
  createdAt: string;
  classNames: string[];
}

export function toAccountDto(row: {
  id: string;
  email: string;
  name: string;
  role: Role;
  status: AccountDto["status"];
  lastSignInAt: Date | string | null;
  createdAt: Date | string;
  classNames?: string[];
}): AccountDto {
  const iso = (d: Date | string) => (typeof d === "string" ? d : d.toISOString());
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    status: row.status,
    lastSignInAt: row.lastSignInAt ? iso(row.lastSignInAt) : null,
    createdAt: iso(row.createdAt),
    classNames: row.classNames ?? [],
  };
}
