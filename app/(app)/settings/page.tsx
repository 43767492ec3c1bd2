import type { Metadata } from "next";
import { requirePageUser } from "@/app/_adapters/session";
import { dateTimeIn, zoneLabel } from "@/lib/domain/time";
import { getSchoolSettings } from "@/lib/server/settings";
import { PlannedHoursForm } from "./_components/planned-hours-form";
import { SettingsForm } from "./_components/settings-form";

export const metadata: Metadata = { title: "School settings" };

export default async function SettingsPage() {
  await requirePageUser("settings:manage", "/settings");
  const { timeZone, plannedHours } = await getSchoolSettings();
  return (
    <div className="flex max-w-3xl flex-col gap-5">
      <h1>School settings</h1>
      <section className="panel flex flex-col gap-3" aria-labelledby="zone-heading">
        <h2 id="zone-heading">Time zone</h2>
        <p>
          Every time on the screens, in mails and in records is told in this zone, and a card is past due once its due day has ended here.
          Times are stored in UTC, so changing the zone changes how they are shown, never what was recorded.
        </p>
        <p className="font-semibold">
          Now: {dateTimeIn(timeZone, new Date())} {zoneLabel(timeZone)} ({timeZone})
        </p>
        <SettingsForm timeZone={timeZone} />
      </section>
      <section className="panel flex flex-col gap-3" aria-labelledby="hours-heading">
        <h2 id="hours-heading">Planned hours per section</h2>
        <p>
          The hours of instruction the school plans for each section of the certification standard. Each student&apos;s record shows the
          hours attended against them, and the readiness report counts a section as done once they are attended. The school&apos;s approved
          curriculum and the current rule set these figures; leave a box empty for a section the school does not plan.
        </p>
        <PlannedHoursForm plannedHours={plannedHours} />
      </section>
    </div>
  );
}
