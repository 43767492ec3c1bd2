import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getSchoolSettings, updateSchoolSettings } from "@/lib/server/settings";

export const GET = handle(api.settings.get, async () => ({ settings: await getSchoolSettings() }));

export const PUT = handle(api.settings.update, async ({ actor, body: { timeZone, plannedHours } }) => ({
  settings: await updateSchoolSettings({ actor, timeZone, plannedHours }),
}));
