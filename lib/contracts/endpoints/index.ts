// Every endpoint, by feature, in the order the README's API table lists them.
import type { Endpoint } from "@/lib/contracts/endpoint";
import { accountsApi } from "@/lib/contracts/endpoints/accounts";
import { auditApi } from "@/lib/contracts/endpoints/audit";
import { cardsApi } from "@/lib/contracts/endpoints/cards";
import { classesApi } from "@/lib/contracts/endpoints/classes";
import { libraryApi } from "@/lib/contracts/endpoints/library";
import { runsApi } from "@/lib/contracts/endpoints/runs";
import { sessionApi } from "@/lib/contracts/endpoints/session";
import { settingsApi } from "@/lib/contracts/endpoints/settings";
import { toolsApi } from "@/lib/contracts/endpoints/tools";
import { standardApi } from "@/lib/contracts/endpoints/standard";
import { attendanceApi } from "@/lib/contracts/endpoints/attendance";
import { fleetApi } from "@/lib/contracts/endpoints/fleet";

export const api = {
  session: sessionApi,
  accounts: accountsApi,
  classes: classesApi,
  audit: auditApi,
  settings: settingsApi,
  library: libraryApi,
  cards: cardsApi,
  runs: runsApi,
  tools: toolsApi,
  standard: standardApi,
  attendance: attendanceApi,
  fleet: fleetApi,
};

export const allEndpoints: Endpoint[] = Object.values(api).flatMap((group) => Object.values(group) as Endpoint[]);
