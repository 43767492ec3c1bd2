import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { createBooking, listBookings } from "@/lib/server/fleet/bookings";

export const GET = handle(api.fleet.listBookings, async ({ query }) => ({ bookings: await listBookings(query) }));

export const POST = handle(api.fleet.createBooking, async ({ actor, body }) => ({ booking: await createBooking({ actor, input: body }) }));
