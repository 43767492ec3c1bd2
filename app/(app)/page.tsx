import Link from "next/link";
import { navigationFor, roleLabels, type Role } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { can } from "@/lib/domain/access/permissions";
import { listClassesOfUser } from "@/lib/server/classes";
import { listMyWork, listReviewQueue } from "@/lib/server/runs/queries";
import { countBuyOffCalls } from "@/lib/server/runs/buy-offs";
import { ToolHolds } from "@/components/tool-holds";
import { dateTimeIn } from "@/lib/domain/time";
import { schoolTimeZone } from "@/lib/server/settings";
import { listHolds } from "@/lib/server/tools/lending";
import { listFindings } from "@/lib/server/fleet/findings";
import { FindingsPanel } from "./fleet/_components/findings-panel";

const roleIntro: Record<Role, string> = {
  student: "The task cards your instructors assign are under My work; it also opens on the cart without a network.",
  instructor:
    "Runs waiting for your inspection and inspection points waiting for buy-off are under Review; assign cards from a card's page.",
  librarian: "You keep the school's manuals current and run the tool room: lending, counting back in, calibrations.",
  admin: "You manage accounts, roles and classes, and can read the audit log.",
};

export default async function HomePage() {
  const user = await requirePageUser();
  const myClasses = await listClassesOfUser({ userId: user.id });
  const shortcuts = navigationFor(user).filter((n) => n.href !== "/");
  // What is waiting, at a glance: a student's open work, an instructor's queue.
  const work = can(user, "runs:do") ? await listMyWork({ actor: user }) : null;
  const waiting = can(user, "runs:review") ? (await listReviewQueue({ actor: user })).length : null;
  const buyOffs = can(user, "runs:review") ? await countBuyOffCalls({ actor: user }) : null;
  // Missing tools hold hand-ins: instructors clear them here, students see their own.
  const holds = can(user, "tools:clear-holds") || can(user, "runs:do") ? await listHolds({ actor: user }) : [];
  // Findings written up on the fleet wait for an instructor's decision.
  const findings = can(user, "findings:decide") ? await listFindings({ actor: user, open: true, mine: true }) : [];
  const zone = await schoolTimeZone();
  const open = work?.filter((w) => w.status !== "signed_off" && w.status !== "submitted") ?? [];
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1>Hello, {user.name}</h1>
        <p className="text-ink-soft">
          Signed in as {roleLabels[user.role].toLowerCase()}. {roleIntro[user.role]}
        </p>
      </div>
      {work ? (
        <section aria-labelledby="my-work" className="panel flex flex-wrap items-center gap-4">
          <h2 id="my-work" className="mr-auto">
            My work: {open.length} open
            {open.some((w) => w.workStatus === "overdue") ? (
              <span className="text-danger"> · {open.filter((w) => w.workStatus === "overdue").length} past due</span>
            ) : null}
            {open.some((w) => w.status === "returned")
              ? ` · ${open.filter((w) => w.status === "returned").length} sent back for rework`
              : null}
          </h2>
          <Link href="/cart" className="btn btn-primary text-lg">
            Open my work
          </Link>
        </section>
      ) : null}
      {waiting !== null ? (
        <section aria-labelledby="review-waiting" className="panel flex flex-wrap items-center gap-4">
          <h2 id="review-waiting" className="mr-auto">
            {waiting === 0
              ? "No run waits for inspection"
              : `${waiting} ${waiting === 1 ? "run waits" : "runs wait"} for inspection and sign-off`}
          </h2>
          <Link href="/review" className="btn btn-primary text-lg">
            Review
          </Link>
        </section>
      ) : null}
      {buyOffs ? (
        <section
          aria-labelledby="buy-offs-waiting"
          className={`panel flex flex-wrap items-center gap-4 ${buyOffs.called ? "border-4 border-deck" : ""}`}
        >
          <h2 id="buy-offs-waiting" className="mr-auto">
            {buyOffs.waiting === 0
              ? "No inspection point waits for buy-off"
              : `${buyOffs.waiting} inspection ${buyOffs.waiting === 1 ? "point waits" : "points wait"} for buy-off`}
            {buyOffs.called ? <span className="text-danger"> · {buyOffs.called} called you to the aircraft</span> : null}
          </h2>
          <Link href="/review?tab=buy-offs" className="btn btn-primary text-lg">
            Buy-off queue
          </Link>
        </section>
      ) : null}
      {holds.length ? (
        <section aria-labelledby="tool-holds" className="panel flex flex-col gap-3">
          <h2 id="tool-holds">{holds.length === 1 ? "A tool is missing" : `${holds.length} tools are missing`}</h2>
          <ToolHolds
            holds={holds}
            canClear={can(user, "tools:clear-holds")}
            openedAt={Object.fromEntries(holds.map((h) => [h.id, dateTimeIn(zone, h.openedAt)]))}
          />
        </section>
      ) : null}
      {findings.length ? (
        <section aria-labelledby="open-findings" className="panel flex flex-col gap-3">
          <h2 id="open-findings">
            {findings.length === 1
              ? "A finding on the fleet waits for your decision"
              : `${findings.length} findings on the fleet wait for your decision`}
          </h2>
          <FindingsPanel
            findings={findings}
            decide
            zoneTimes={Object.fromEntries(findings.map((f) => [f.id, dateTimeIn(zone, f.foundAt)]))}
          />
        </section>
      ) : null}
      {shortcuts.length ? (
        <section aria-labelledby="shortcuts" className="flex flex-col gap-2">
          <h2 id="shortcuts">Go to</h2>
          <div className="flex flex-wrap gap-3">
            {shortcuts.map((s) => (
              <Link key={s.href} href={s.href} className="btn btn-secondary">
                {s.label}
              </Link>
            ))}
          </div>
        </section>
      ) : null}
      <section aria-labelledby="my-classes" className="panel flex flex-col gap-3">
        <h2 id="my-classes">My classes</h2>
        {myClasses.length ? (
          <ul className="flex flex-col gap-2">
            {myClasses.map((c) => (
              <li key={c.id} className="text-lg">
                <strong>{c.name}</strong>
                {c.startsOn && c.endsOn ? (
                  <span className="text-ink-soft">
                    {" "}
                    · {c.startsOn} to {c.endsOn}
                  </span>
                ) : null}
              </li>
            ))}
          </ul>
        ) : (
          <p>You are not in any class yet. An admin adds you to one.</p>
        )}
      </section>
    </div>
  );
}
