import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { classRecord } from "@/lib/server/runs/records";

export const GET = handle(api.runs.classRecord, async ({ actor, params: { id } }) => classRecord({ actor, classId: id }));
