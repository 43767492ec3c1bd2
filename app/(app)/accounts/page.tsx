import type { Metadata } from "next";
import { listUsers } from "@/lib/server/accounts";
import { requirePageUser } from "@/app/_adapters/session";
import { toAccountDto } from "@/lib/contracts/accounts";
import { AccountsManager } from "./_components/accounts-manager";

export const metadata: Metadata = { title: "Accounts" };

export default async function AccountsPage() {
  const user = await requirePageUser("accounts:manage", "/accounts");
  const accounts = (await listUsers()).map(toAccountDto);
  return (
    <div className="flex flex-col gap-6">
      <h1>Accounts</h1>
      <AccountsManager initialAccounts={accounts} currentUserId={user.id} />
    </div>
  );
}
