import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { fileResponse } from "@/lib/server/file-response";
import { toolLabelsPdf } from "@/lib/server/tools/labels";

export const GET = handle(api.tools.toolLabels, async ({ query }) =>
  fileResponse(await toolLabelsPdf({ kitId: query.kit }), { type: "application/pdf", filename: "tool-room-labels.pdf" }),
);
