// The school's settings (lib/contracts/endpoint.ts says how one is declared).
import { endpoint, json } from "@/lib/contracts/endpoint";
import { schoolSettingsSchema } from "@/lib/domain/validation/settings";

export interface SchoolSettingsDto {
  timeZone: string;
  /** Planned hours per section of the standard ("General", "Airframe", "Powerplant"); a section without a plan is absent. */
  plannedHours: Partial<Record<string, number>>;
}

export const settingsApi = {
  get: endpoint({
    method: "GET",
    path: "/api/settings",
    access: "signed-in",
    answer: json<{ settings: SchoolSettingsDto }>(),
    who: "anyone signed in",
    doc: `200 \`{ "settings": { "timeZone", "plannedHours": { "General"?, "Airframe"?, "Powerplant"? } } }\`: the IANA time zone the school's days and times are told in (UTC until an admin sets it), and the hours the school plans per section of the standard (attendance is shown against them)`,
  }),
  update: endpoint({
    method: "PUT",
    path: "/api/settings",
    access: "settings:manage",
    body: { kind: "json", schema: schoolSettingsSchema },
    answer: json<{ settings: SchoolSettingsDto }>(),
    who: "admin",
    doc: `\`{ "timeZone"?, "plannedHours"?: { "<section>": hours \\| null } }\` (at least one) → 200: screens, mails and due dates follow the zone from the next request; planned hours are whole numbers 0–10,000, \`null\` removes a section's plan, sections not sent keep theirs; audited. 422 for a zone the server does not know, an unknown section or bad hours`,
  }),
};
