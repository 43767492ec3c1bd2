import type { Metadata } from "next";
import { listAuditEvents } from "@/lib/audit";
import { requirePageUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Audit log" };

export default async function AuditPage() {
  await requirePageUser("audit:view", "/audit");
  const events = await listAuditEvents({ limit: 200 });
  return (
    <div className="flex flex-col gap-6">
      <h1>Audit log</h1>
      <p className="text-ink-soft">The latest 200 changes to accounts and classes, newest first. Entries cannot be edited.</p>
      <div className="panel overflow-x-auto">
        <table className="data-table">
          <thead>
            <tr>
              <th scope="col">When</th>
              <th scope="col">Who</th>
              <th scope="col">What</th>
              <th scope="col">Details</th>
            </tr>
          </thead>
          <tbody>
            {events.map((e) => (
              <tr key={e.id}>
                <td className="whitespace-nowrap">{e.createdAt.toISOString().replace("T", " ").slice(0, 19)} UTC</td>
                <td>{e.actorName ?? "—"}</td>
                <td><code>{e.action}</code></td>
                <td className="text-sm"><code>{JSON.stringify(e.details)}</code></td>
              </tr>
            ))}
            {events.length === 0 ? (
              <tr><td colSpan={4}>Nothing recorded yet.</td></tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
