import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { createClass, listClasses } from "@/lib/server/classes";

export const GET = handle(api.classes.list, async ({ actor }) => ({ classes: await listClasses({ actor }) }));

export const POST = handle(api.classes.create, async ({ actor, body }) => ({ class: await createClass({ actor, input: body }) }));
