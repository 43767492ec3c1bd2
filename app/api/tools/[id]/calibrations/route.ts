import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { recordCalibration } from "@/lib/server/tools/catalogue";

export const POST = handle(api.tools.recordCalibration, async ({ actor, params: { id }, body }) => ({
  calibration: await recordCalibration({ actor, toolId: id, input: body }),
}));
