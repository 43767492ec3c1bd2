import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { can } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { listClasses } from "@/lib/server/classes";

export const metadata: Metadata = { title: "Records" };

export default async function RecordsPage() {
  const user = await requirePageUser("records:view", "/records");
  if (!can(user, "records:view-all")) redirect(`/records/students/${user.id}`);
  const classes = await listClasses({ actor: user });
  return (
    <div className="flex flex-col gap-5">
      <h1>Records</h1>
      <p className="text-ink-soft">Progress by class and curriculum subject; open a student for their signed-off cards and hours.</p>
      <ul className="grid gap-3 sm:grid-cols-2">
        {classes.map((c) => (
          <li key={c.id}>
            <Link href={`/records/classes/${c.id}`} className="panel flex flex-col no-underline hover:bg-teal-pale">
              <span className="text-xl font-bold text-ink">{c.name}</span>
              <span className="text-ink-soft">{c.students} students</span>
            </Link>
          </li>
        ))}
        {classes.length === 0 ? <li className="hint">You are not in any class yet.</li> : null}
      </ul>
    </div>
  );
}
