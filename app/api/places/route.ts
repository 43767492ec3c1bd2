import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { createPlace, listPlaces } from "@/lib/server/fleet/bookings";

export const GET = handle(api.fleet.listPlaces, async () => ({ places: await listPlaces() }));

export const POST = handle(api.fleet.createPlace, async ({ actor, body }) => ({ place: await createPlace({ actor, input: body }) }));
