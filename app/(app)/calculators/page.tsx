import type { Metadata } from "next";
import Link from "next/link";
import { requirePageUser } from "@/app/_adapters/session";
import { calculators, calculatorSlugs, trainingAidNotice } from "@/lib/domain/calc";

export const metadata: Metadata = { title: "Calculators" };

export default async function CalculatorsPage() {
  await requirePageUser(undefined, "/calculators");
  return (
    <div className="flex flex-col gap-6">
      <h1>Calculators</h1>
      <p className="border-l-[6px] border-amber bg-amber-pale px-3 py-2 font-semibold">{trainingAidNotice}</p>
      <ul className="grid gap-4 sm:grid-cols-2">
        {calculatorSlugs.map((slug) => (
          <li key={slug} className="panel flex flex-col gap-2">
            <Link href={`/calculators/${slug}`} className="inline-flex min-h-11 items-center text-lg font-bold">
              {calculators[slug].title}
            </Link>
            <p>{calculators[slug].summary}</p>
          </li>
        ))}
      </ul>
    </div>
  );
}
