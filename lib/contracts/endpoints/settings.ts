// The school's settings (lib/contracts/endpoint.ts says how one is declared).
import { endpoint, json } from "@/lib/contracts/endpoint";
import { schoolSettingsSchema } from "@/lib/domain/validation/settings";

export interface SchoolSettingsDto {
  timeZone: string;
}

export const settingsApi = {
  get: endpoint({
    method: "GET",
    path: "/api/settings",
    access: "signed-in",
    answer: json<{ settings: SchoolSettingsDto }>(),
    who: "anyone signed in",
    doc: `200 \`{ "settings": { "timeZone" } }\`: the IANA time zone the school's days and times are told in (UTC until an admin sets it)`,
  }),
  update: endpoint({
    method: "PUT",
    path: "/api/settings",
    access: "settings:manage",
    body: { kind: "json", schema: schoolSettingsSchema },
    answer: json<{ settings: SchoolSettingsDto }>(),
    who: "admin",
    doc: `\`{ "timeZone" }\` → 200: screens, mails and due dates follow it from the next request; audited. 422 for a zone the server does not know`,
  }),
};
