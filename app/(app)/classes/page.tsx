import type { Metadata } from "next";
import Link from "next/link";
import { Table } from "@/components/table";
import { can } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { listClasses } from "@/lib/server/classes";
import { CreateClassForm } from "./_components/create-class-form";

export const metadata: Metadata = { title: "Classes" };

export default async function ClassesPage() {
  const user = await requirePageUser("classes:view", "/classes");
  const rows = await listClasses({ actor: user });
  const manages = can(user, "classes:manage");
  return (
    <div className="flex flex-col gap-6">
      <h1>Classes</h1>
      <section aria-labelledby="class-list" className="panel flex flex-col gap-3">
        <h2 id="class-list">{manages ? "All classes" : "Your classes"}</h2>
        {rows.length ? (
          <Table
            rows={rows}
            rowKey={(c) => c.id}
            columns={[
              {
                header: "Class",
                cell: (c) => (
                  <Link href={`/classes/${c.id}`} className="inline-flex min-h-11 items-center font-semibold">
                    {c.name}
                  </Link>
                ),
              },
              { header: "Dates", cell: (c) => (c.startsOn && c.endsOn ? `${c.startsOn} to ${c.endsOn}` : "—") },
              { header: "Students", cell: (c) => c.students },
              { header: "Staff", cell: (c) => c.staff },
            ]}
          />
        ) : (
          <p>{manages ? "No class yet. Add the first one below." : "You are not in any class yet. An admin adds you."}</p>
        )}
      </section>
      {manages ? <CreateClassForm /> : null}
    </div>
  );
}
