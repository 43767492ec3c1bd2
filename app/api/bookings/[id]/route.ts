import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { updateBooking } from "@/lib/server/fleet/bookings";

export const PATCH = handle(api.fleet.updateBooking, async ({ actor, params: { id }, body }) => ({
  booking: await updateBooking({ actor, id, input: body }),
}));
