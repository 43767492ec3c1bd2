"use client";

import { calculators, trainingAidNotice, type CalculatorSlug } from "@/lib/domain/calc";
import { CardNotice } from "../card-notice";
import { BendCalculator } from "./bend-calculator";
import { CoilShotCalculator } from "./coil-shot-calculator";
import { PenetrantCalculator } from "./penetrant-calculator";
import { RivetCalculator } from "./rivet-calculator";
import { TorqueCalculator } from "./torque-calculator";
import { UnitConverter } from "./unit-converter";

const bodies: Record<CalculatorSlug, () => React.ReactNode> = {
  rivets: RivetCalculator,
  bend: BendCalculator,
  torque: TorqueCalculator,
  penetrant: PenetrantCalculator,
  "coil-shot": CoilShotCalculator,
  units: UnitConverter,
};

const order = { warning: 0, caution: 1, note: 2 } as const;

/**
 * One calculator with the notice that the manufacturer's data, the instructor, local rules and a
 * licensed sign-off come first, its warnings, cautions and notes (in that order, before the
 * calculator they apply to), its formula and sources, on its page or in a step.
 */
export function CalculatorPanel({ slug, headingLevel = 2 }: { slug: CalculatorSlug; headingLevel?: 2 | 4 }) {
  const info = calculators[slug];
  const Body = bodies[slug];
  const Heading = headingLevel === 2 ? "h2" : "h4";
  return (
    <section className="flex flex-col gap-4" aria-label={info.title}>
      <p className="border-l-[6px] border-amber bg-amber-pale px-3 py-2 font-semibold">{trainingAidNotice}</p>
      {[...info.notices]
        .sort((a, b) => order[a.kind] - order[b.kind])
        .map((n) => (
          <CardNotice key={n.text} kind={n.kind} text={n.text} />
        ))}
      <Body />
      <div>
        <Heading className="font-bold">Formula</Heading>
        <ul className="ml-5 list-disc font-mono text-[0.95rem]">
          {info.formula.map((f) => (
            <li key={f}>{f}</li>
          ))}
        </ul>
        <p className="hint mt-1">Sources: {info.sources.join("; ")}.</p>
      </div>
    </section>
  );
}
