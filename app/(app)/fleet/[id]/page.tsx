import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageUser } from "@/app/_adapters/session";
import { notFoundOnMissing } from "@/app/_adapters/not-found";
import { Table } from "@/components/table";
import { can } from "@/lib/domain/access/permissions";
import { assetKindWords, bookingPurposeWords, findingDecisionWords } from "@/lib/domain/fleet/fleet";
import { dateTimeIn } from "@/lib/domain/time";
import { runStatusLabels } from "@/lib/domain/vocabulary";
import { getAsset } from "@/lib/server/fleet/assets";
import { isUuid } from "@/lib/server/http";
import { schoolTimeZone } from "@/lib/server/settings";
import { AssetStatusBadge } from "../_components/asset-status";
import { FileFindingForm } from "../_components/fleet-forms";
import { FindingsPanel } from "../_components/findings-panel";

export const metadata: Metadata = { title: "Asset" };

export default async function AssetPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser("fleet:view", `/fleet/${id}`);
  if (!isUuid(id)) notFound();
  const asset = await getAsset({ actor: user, id }).catch(notFoundOnMissing);
  const zone = await schoolTimeZone();
  const when = (iso: string) => dateTimeIn(zone, iso);
  return (
    <div className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb">
        <Link href="/fleet" className="inline-flex min-h-11 items-center">
          Fleet
        </Link>
      </nav>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="font-mono">{asset.identifier}</h1>
        <AssetStatusBadge status={asset.status} />
      </div>
      <p className="text-lg">
        {assetKindWords[asset.kind]} {asset.model}
        {asset.serial ? `, serial ${asset.serial}` : ""}
        {asset.installedOn ? (
          <>
            {" "}
            · installed on{" "}
            <Link href={`/fleet/${asset.installedOn.id}`} className="font-mono font-bold">
              {asset.installedOn.identifier}
            </Link>
            {asset.installedOn.position ? ` (${asset.installedOn.position})` : ""}
          </>
        ) : asset.location ? (
          ` · ${asset.location}`
        ) : (
          ""
        )}
      </p>
      {asset.status === "out_of_service" ? (
        <p className="notice-error" role="alert">
          WARNING: {asset.identifier} is out of service: {asset.statusReason}. Do not start work on it unless your instructor says so.
        </p>
      ) : null}

      <section aria-labelledby="open-findings" className="panel flex flex-col gap-3">
        <h2 id="open-findings">Open findings ({asset.openFindings.length})</h2>
        <FindingsPanel
          findings={asset.openFindings}
          decide={can(user, "findings:decide")}
          zoneTimes={Object.fromEntries(asset.openFindings.map((f) => [f.id, when(f.foundAt)]))}
        />
        {can(user, "findings:file") ? (
          <details>
            <summary className="inline-flex min-h-11 cursor-pointer items-center font-bold">Write up a finding…</summary>
            <FileFindingForm assetId={asset.id} identifier={asset.identifier} />
          </details>
        ) : null}
      </section>

      {asset.installed.length ? (
        <section aria-labelledby="installed" className="panel">
          <h2 id="installed">Installed on it</h2>
          <ul className="flex flex-col gap-1">
            {asset.installed.map((i) => (
              <li key={i.id}>
                <Link href={`/fleet/${i.id}`} className="inline-flex min-h-11 items-center font-mono font-bold">
                  {i.identifier}
                </Link>{" "}
                {assetKindWords[i.kind]} {i.model}
                {i.position ? ` · ${i.position}` : ""}
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <section aria-labelledby="applies" className="panel flex flex-col gap-3">
        <h2 id="applies">What applies to {asset.identifier}</h2>
        <p className="hint">
          Matched on the model {asset.model}
          {asset.serial ? ` and serial ${asset.serial}` : ""}; general documents name no model.
        </p>
        <div className="grid gap-4 md:grid-cols-2">
          <div>
            <h3 className="font-bold">Manuals</h3>
            <ul>
              {asset.applies.manuals.map((m) => (
                <li key={m.id}>
                  <Link href={`/library/${m.id}`} className="inline-flex min-h-11 items-center">
                    {m.title}
                  </Link>
                  {m.general ? <span className="hint"> (general)</span> : null}
                </li>
              ))}
              {!asset.applies.manuals.length ? <li className="hint">None in the library.</li> : null}
            </ul>
          </div>
          <div>
            <h3 className="font-bold">Task cards</h3>
            <ul>
              {asset.applies.cards.map((c) => (
                <li key={c.id}>
                  <Link href={`/cards/${c.id}`} className="inline-flex min-h-11 items-center">
                    {c.title}
                  </Link>
                  {c.general ? <span className="hint"> (general)</span> : null}
                </li>
              ))}
              {!asset.applies.cards.length ? <li className="hint">No published card.</li> : null}
            </ul>
          </div>
        </div>
      </section>

      <section aria-labelledby="work" className="panel overflow-x-auto">
        <h2 id="work">Student work on it</h2>
        <Table
          rows={asset.work}
          rowKey={(w) => w.runId}
          empty="No run has named it yet."
          columns={[
            { header: "Task card", cell: (w) => (can(user, "runs:review") ? <Link href={`/review/${w.runId}`}>{w.title}</Link> : w.title) },
            { header: "Version", cell: (w) => w.versionNumber },
            { header: "Student", cell: (w) => w.studentName },
            { header: "State", cell: (w) => runStatusLabels[w.status as keyof typeof runStatusLabels] ?? w.status },
            { header: "Last work", cell: (w) => when(w.date) },
          ]}
        />
      </section>

      <section aria-labelledby="history" className="panel overflow-x-auto">
        <h2 id="history">Installation history</h2>
        <Table
          rows={asset.history}
          rowKey={(h) => h.id}
          empty="Nothing installed on it or it on anything yet."
          columns={[
            { header: "What", cell: (h) => `${h.asset.identifier} on ${h.parent.identifier}${h.position ? ` (${h.position})` : ""}` },
            {
              header: "Installed",
              cell: (h) =>
                `${when(h.installedAt)}${h.installedByName ? `, ${h.installedByName}` : ""}${h.installedRun ? ` · run: ${h.installedRun.title}` : ""}`,
            },
            {
              header: "Removed",
              cell: (h) =>
                h.removedAt
                  ? `${when(h.removedAt)}${h.removedByName ? `, ${h.removedByName}` : ""}${h.removedRun ? ` · run: ${h.removedRun.title}` : ""}`
                  : "Still installed",
            },
          ]}
        />
      </section>

      <section aria-labelledby="bookings" className="panel overflow-x-auto">
        <h2 id="bookings">Bookings</h2>
        <Table
          rows={asset.bookings}
          rowKey={(b) => b.id}
          empty="Not booked in the coming week."
          columns={[
            { header: "When", cell: (b) => `${when(b.startsAt)} to ${when(b.endsAt)}` },
            { header: "Where", cell: (b) => b.placeName },
            { header: "For", cell: (b) => `${bookingPurposeWords[b.purpose]}${b.className ? `, ${b.className}` : ""}` },
          ]}
        />
      </section>

      {asset.closedFindings.length ? (
        <section aria-labelledby="closed-findings" className="panel overflow-x-auto">
          <h2 id="closed-findings">Closed findings</h2>
          <Table
            rows={asset.closedFindings}
            rowKey={(f) => f.id}
            columns={[
              { header: "Found", cell: (f) => `${f.text} (${f.reportedByName}, ${when(f.foundAt)})` },
              {
                header: "Decision",
                cell: (f) => `${f.decision ? findingDecisionWords[f.decision] : ""}${f.decisionNote ? `: ${f.decisionNote}` : ""}`,
              },
              { header: "Closed", cell: (f) => `${f.closedAt ? when(f.closedAt) : ""}, ${f.closedByName ?? ""}` },
            ]}
          />
        </section>
      ) : null}
    </div>
  );
}
