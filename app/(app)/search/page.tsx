import type { Metadata } from "next";
import { requirePageUser } from "@/app/_adapters/session";
import { listManuals } from "@/lib/server/library/manuals";
import { SearchScreen } from "./_components/search-screen";

export const metadata: Metadata = { title: "Search" };

export default async function SearchPage() {
  await requirePageUser("library:view", "/search");
  const manuals = (await listManuals()).filter((m) => m.currentRevisionId).map((m) => ({ id: m.id, title: m.title }));
  return (
    <div className="flex flex-col gap-5">
      <h1>Search the library</h1>
      <SearchScreen manuals={manuals} />
    </div>
  );
}
