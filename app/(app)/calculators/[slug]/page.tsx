import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CalculatorPanel } from "@/components/calculators/calculator-panel";
import { requirePageUser } from "@/app/_adapters/session";
import { calculators, calculatorSlugs, type CalculatorSlug } from "@/lib/domain/calc";

const isSlug = (s: string): s is CalculatorSlug => (calculatorSlugs as readonly string[]).includes(s);

export async function generateMetadata({ params }: { params: Promise<{ slug: string }> }): Promise<Metadata> {
  const { slug } = await params;
  return { title: isSlug(slug) ? calculators[slug].title : "Calculator" };
}

export default async function CalculatorPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  await requirePageUser(undefined, `/calculators/${slug}`);
  if (!isSlug(slug)) notFound();
  return (
    <div className="flex max-w-4xl flex-col gap-5">
      <nav aria-label="Breadcrumb">
        <Link href="/calculators" className="inline-flex min-h-11 items-center">
          Calculators
        </Link>
      </nav>
      <h1>{calculators[slug].title}</h1>
      <p>{calculators[slug].summary}</p>
      <div className="panel">
        <CalculatorPanel slug={slug} />
      </div>
    </div>
  );
}
