import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { createSubject, listSubjects } from "@/lib/server/cards/subjects";

export const GET = handle(api.cards.listSubjects, async () => ({ subjects: await listSubjects() }));

export const POST = handle(api.cards.createSubject, async ({ actor, body: { name } }) => ({
  subject: await createSubject({ actor, name }),
}));
