import type { Metadata } from "next";
import { requirePageUser } from "@/app/_adapters/session";
import { listSubjects } from "@/lib/server/cards/subjects";
import { NewCardForm } from "../_components/new-card-form";

export const metadata: Metadata = { title: "New task card" };

export default async function NewCardPage() {
  await requirePageUser("cards:author", "/cards/new");
  return (
    <div className="flex flex-col gap-5">
      <h1>New task card</h1>
      <NewCardForm subjects={await listSubjects()} />
    </div>
  );
}
