import type { Metadata } from "next";
import { requirePageUser } from "@/app/_adapters/session";
import { listSubjects } from "@/lib/server/cards/subjects";
import { SubjectsManager } from "../_components/subjects-manager";

export const metadata: Metadata = { title: "Curriculum subjects" };

export default async function SubjectsPage() {
  await requirePageUser("subjects:manage", "/cards/subjects");
  return (
    <div className="flex max-w-3xl flex-col gap-5">
      <h1>Curriculum subjects</h1>
      <p className="text-ink-soft">Task cards are filed under these subjects, and student records count signed-off cards by them.</p>
      <SubjectsManager initialSubjects={await listSubjects()} />
    </div>
  );
}
