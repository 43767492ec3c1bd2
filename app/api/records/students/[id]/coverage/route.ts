import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { studentCoverage } from "@/lib/server/standard";

export const GET = handle(api.standard.coverage, async ({ actor, params: { id } }) => studentCoverage({ actor, studentId: id }));
