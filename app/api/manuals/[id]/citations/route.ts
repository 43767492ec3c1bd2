import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { manualCitations } from "@/lib/server/library/manuals";

export const GET = handle(api.library.manualCitations, async ({ params: { id } }) => manualCitations({ id }));
