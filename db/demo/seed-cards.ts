// Demo curriculum subjects and published task cards built on the invented manuals. Invented content
// only. The cards are written straight to the tables: at seed time the manuals are still queued for
// ingest, so the library's "cite only ready revisions" check of lib/server/cards/draft.ts cannot pass yet.
import { demoElementMap } from "./standard-excerpt";
import { randomUUID } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db";
import { cardCitations, curriculumSubjects, manuals, revisions, taskCards, taskCardVersions, users } from "@/db/schema";
import { penetrantDwell, penetrantWindowF } from "@/lib/domain/calc/ndt";
import { parseWith } from "@/lib/server/http";
import { cardContentSchema, type CardContentInput } from "@/lib/domain/validation/cards";
import { demoManuals, demoRevisions } from "./manual-content";
import { sectionPage } from "./manual-pdf";

export const demoSubjects = [
  "Sheet metal structures",
  "Nondestructive testing",
  "Ignition systems",
  "Engine removal and installation",
  "Flight controls and rigging",
  "Landing gear and brakes",
  "Propellers",
  "Servicing and ground handling",
];

const manualByPrefix = (prefix: string) => {
  const m = demoManuals.find((d) => d.title.startsWith(prefix));
  if (!m) throw new Error(`no demo manual ${prefix}`);
  return m;
};

type Ref = { manual: string; label: string; code: string; part?: Parameters<typeof sectionPage>[2]; quote?: string };
interface DemoStep {
  text: string;
  notices?: { kind: "warning" | "caution" | "note"; text: string }[];
  refs?: Ref[];
  measurement?: { label: string; unit: string; min?: number; max?: number; nominal?: number; tolerance?: number };
  calculator?: "rivets" | "bend" | "torque" | "penetrant" | "coil-shot" | "units";
  inspectionPoint?: boolean;
  calibratedTool?: boolean;
  timerMinutes?: number;
}
interface DemoCard {
  title: string;
  owner: string;
  subject: string;
  ataChapter: string;
  applicability: string[];
  estimatedMinutes: number;
  tools: string[];
  consumables: string[];
  protectiveEquipment: string[];
  steps: DemoStep[];
}

const sheetMetal = "Fernhollow Sheet-Metal";
const penetrant = "Penetrant Inspection";
const trainer = "HT-20";
const turbine = "TF-400";
const rev1 = demoRevisions.others.label;
const rev3 = demoRevisions.trainerFirst.label;

// Every value on these cards comes from the invented demo manuals (manual-content.ts), for training
// the software only: the torques, tensions, timings, weights and head sizes are invented. Each card's
// first step says so with a NOTE. The trade's rules the cards follow (head height measured, timing
// approached in the direction of rotation, no backing off a torqued nut, weight taken up first) are
// common practice; the penetrant timers are what the penetrant calculator gives for the procedure.
const inventedNote = (what: string) => ({
  kind: "note" as const,
  text: `Demo card: ${what} come from an invented demo manual, not from any aircraft's data. The manufacturer's data, your instructor, local rules and licensed sign-off come first.`,
});

/** The penetrant procedure's dwell (51-61-02, invented: 10 minutes minimum) at room temperature. */
const penetrantTimes = penetrantDwell({ specifiedMinutes: 10, temperature: 70, developer: "nonaqueous" });

export const demoCards: DemoCard[] = [
  {
    title: "Riveted splice patch on a practice skin panel",
    owner: "instructor@hangarleaf.test",
    subject: "Sheet metal structures",
    ataChapter: "51",
    applicability: ["Shop practice panel"],
    estimatedMinutes: 240,
    tools: [
      "Micrometer, 0-1 in",
      "Rivet gun and bucking bar",
      "No. 30 drill and reamer",
      "Cleco fasteners",
      "Rivet gauge, diameter and height",
      "Deburring tool",
    ],
    // 51-50-00: the doubler is one gauge thicker than the 0.032 in skin, so 0.040 in is the thickest sheet;
    // 3 × 0.040 = 0.120 in → 1/8 in (AD4) rivets, No. 30 drill (51-20-00).
    consumables: [
      "MS20470AD4 rivets, length from the rivet calculator",
      "2024-T3 sheet, 0.032 in (skin) and 0.040 in (doubler)",
      "Layout fluid",
    ],
    protectiveEquipment: ["Safety glasses", "Hearing protection"],
    steps: [
      {
        text: "Measure the thickness of the **thickest sheet** of the joint, the 0.040 in doubler, with the micrometer. Record the reading.",
        notices: [inventedNote("the sheet thicknesses and the head-size limits on this card")],
        refs: [
          { manual: sheetMetal, label: rev1, code: "51-10-00" },
          { manual: sheetMetal, label: rev1, code: "51-50-00" },
        ],
        // ± 0.002 in: an invented shop tolerance.
        measurement: { label: "Thickest sheet (doubler)", unit: "in", nominal: 0.04, tolerance: 0.002 },
      },
      {
        text: "Choose the rivet diameter from the range the calculator offers, then its length (grip plus 1.5 D, next standard length up) and part number. Have the choice checked against the repair drawing.",
        refs: [{ manual: sheetMetal, label: rev1, code: "51-10-00", part: "limits", quote: "Minimum edge distance" }],
        calculator: "rivets",
      },
      {
        text: "Lay out two rows of rivets on the doubler, rows about 75 % of the pitch apart. Measure the edge distance of the first rivet.",
        // 1/8 in rivet: 2 D = 0.25 in to 4 D = 0.5 in (51-10-00).
        measurement: { label: "Edge distance, first rivet (1/8 in rivet)", unit: "in", min: 0.25, max: 0.5 },
        refs: [
          { manual: sheetMetal, label: rev1, code: "51-50-00" },
          { manual: sheetMetal, label: rev1, code: "51-10-00", part: "limits", quote: "Maximum edge distance" },
        ],
      },
      {
        text: "Drill pilot holes, ream to size and deburr both sides.",
        notices: [{ kind: "caution", text: "Hold the drill square to the work. An oval hole weakens the joint." }],
        refs: [{ manual: sheetMetal, label: rev1, code: "51-20-00" }],
      },
      {
        text: "Clamp with clecos every fourth hole and drive the rivets in short bursts.",
        notices: [{ kind: "warning", text: "Wear hearing and eye protection when you use a rivet gun. Keep fingers clear of the set." }],
        refs: [{ manual: sheetMetal, label: rev1, code: "51-30-00" }],
      },
      {
        text: "Check the diameter of each shop head with the rivet gauge and mark any rivet to be drilled out.",
        // 1.5 D = 0.1875 in for a 1/8 in rivet; 0.180 to 0.200 in is the invented handbook's range (51-30-00).
        measurement: { label: "Shop head diameter", unit: "in", min: 0.18, max: 0.2 },
        refs: [{ manual: sheetMetal, label: rev1, code: "51-30-00", part: "limits", quote: "Shop head diameter" }],
        inspectionPoint: true,
      },
      {
        text: "Check the height of each shop head with the rivet gauge and mark any rivet to be drilled out.",
        // 0.5 D = 0.0625 in for a 1/8 in rivet; 0.055 to 0.070 in is the invented handbook's range (51-30-00).
        measurement: { label: "Shop head height", unit: "in", min: 0.055, max: 0.07 },
        refs: [{ manual: sheetMetal, label: rev1, code: "51-30-00", part: "limits", quote: "Shop head height" }],
        inspectionPoint: true,
      },
    ],
  },
  {
    title: "Fluorescent penetrant inspection of a landing gear fitting",
    owner: "instructor@hangarleaf.test",
    subject: "Nondestructive testing",
    ataChapter: "51",
    applicability: ["HT-20"],
    estimatedMinutes: 90,
    tools: ["UV-A lamp, 365 nm", "UV-A meter", "Thermometer", "Lint-free cloths"],
    consumables: ["Chemical paint stripper", "Fluorescent penetrant", "Solvent remover", "Nonaqueous developer"],
    protectiveEquipment: ["Nitrile gloves", "UV-blocking safety glasses", "Respirator where the procedure asks for it"],
    steps: [
      {
        text: "Remove paint from the area with chemical stripper, clean with solvent and let the part dry. Measure the part temperature.",
        notices: [
          {
            kind: "warning",
            text: "Solvents, strippers and penetrants are flammable and harm skin and eyes. Work in the ventilated booth with gloves and glasses on.",
          },
          { kind: "caution", text: "Never sand, blast or scrape the paint off: smeared metal closes the cracks the test must find." },
          inventedNote("the dwell and development times and the temperature window"),
        ],
        refs: [{ manual: penetrant, label: rev1, code: "51-61-01" }],
        measurement: { label: "Part temperature", unit: "°F", min: penetrantWindowF.min, max: penetrantWindowF.max },
      },
      {
        text: "Apply penetrant to cover the area and start the dwell timer. Keep the surface wet. Below 60 °F or above 100 °F, use the calculator for the dwell instead of the timer's value.",
        refs: [{ manual: penetrant, label: rev1, code: "51-61-02" }],
        calculator: "penetrant",
        timerMinutes: penetrantTimes.dwellMinutes!,
        notices: [{ kind: "note", text: "Dwell times are those of the school procedure; the penetrant maker's data comes first." }],
      },
      {
        text: "Wipe off the excess penetrant, then wipe with a cloth dampened with remover. Apply a thin coat of developer and start the development timer. Inspect within 30 minutes after the developer dries.",
        notices: [{ kind: "caution", text: "Do not spray remover straight onto the part: it washes penetrant out of the flaws." }],
        refs: [{ manual: penetrant, label: rev1, code: "51-61-03" }],
        timerMinutes: penetrantTimes.developmentMinutes!,
      },
      {
        text: "In the dark booth, check the lamp with the meter at the part surface, then inspect and mark every indication.",
        notices: [{ kind: "warning", text: "UV-A light burns eyes and skin. Never look into the lamp; wear UV-blocking glasses." }],
        refs: [{ manual: penetrant, label: rev1, code: "51-61-04" }],
        measurement: { label: "UV-A intensity at the surface", unit: "µW/cm²", min: 1000 },
        inspectionPoint: true,
      },
      {
        text: "Fill in the process record and hand it to the instructor.",
        refs: [{ manual: penetrant, label: rev1, code: "05-61-00" }],
      },
    ],
  },
  {
    title: "Magneto-to-engine timing check",
    owner: "instructor2@hangarleaf.test",
    subject: "Ignition systems",
    ataChapter: "74",
    applicability: ["HT-20"],
    estimatedMinutes: 60,
    tools: ["Timing light", "Top dead centre indicator", "Timing disc and pointer"],
    consumables: [],
    protectiveEquipment: ["Safety glasses"],
    steps: [
      {
        text: "Make sure the magnetos are grounded and the ignition switch is off. Remove one spark plug from each cylinder.",
        notices: [
          {
            kind: "warning",
            text: "Treat every propeller as live. A magneto with a broken ground lead fires when the propeller turns. Stand clear of the arc.",
          },
          inventedNote("the timing and its tolerance"),
        ],
        refs: [{ manual: trainer, label: rev3, code: "74-10-00" }],
      },
      {
        text: "Turn the crankshaft in its normal direction of rotation to the number one compression stroke, then on to the firing position on the timing marks.",
        refs: [{ manual: trainer, label: rev3, code: "74-10-00" }],
      },
      {
        text: "With the timing light on the left magneto, turn the crankshaft opposite to its rotation well back from the mark, then forward **in the direction of rotation only** until the points open. Read the timing.",
        notices: [
          {
            kind: "note",
            text: "If you pass the mark, go back well past it and come forward again. A reading taken while turning backward is wrong: gear backlash moves it.",
          },
        ],
        refs: [{ manual: trainer, label: rev3, code: "74-10-00", part: "limits", quote: "Ignition timing" }],
        measurement: { label: "Ignition timing, left magneto", unit: "deg", nominal: 25, tolerance: 1 },
        inspectionPoint: true,
      },
      {
        text: "Move the timing light to the right magneto and repeat: back well past the mark, then forward in the direction of rotation only until the points open. Read the timing.",
        refs: [{ manual: trainer, label: rev3, code: "74-10-00", part: "limits", quote: "Ignition timing" }],
        measurement: { label: "Ignition timing, right magneto", unit: "deg", nominal: 25, tolerance: 1 },
        inspectionPoint: true,
      },
    ],
  },
  {
    title: "Aileron control cable tension check",
    owner: "instructor@hangarleaf.test",
    subject: "Flight controls and rigging",
    ataChapter: "27",
    applicability: ["HT-20"],
    estimatedMinutes: 45,
    tools: ["Cable tensiometer with riser chart", "Rigging pin", "Thermometer"],
    consumables: ["Turnbuckle safety clips"],
    protectiveEquipment: ["Safety glasses"],
    steps: [
      {
        text: "Put the control wheel in neutral and install the rigging pin.",
        notices: [inventedNote("the cable tension")],
        refs: [{ manual: trainer, label: rev3, code: "27-10-00" }],
      },
      {
        text: "Measure the cable tension at the marked station. Correct the reading for the hangar temperature with the chart.",
        refs: [{ manual: trainer, label: rev3, code: "27-10-00", part: "limits", quote: "Aileron cable tension" }],
        measurement: { label: "Aileron cable tension", unit: "lb", min: 30, max: 40 },
      },
      {
        text: "Adjust the turnbuckles equally, safety them with new clips and remove the rigging pin.",
        notices: [{ kind: "caution", text: "Never reuse a turnbuckle safety clip." }],
        refs: [{ manual: trainer, label: rev3, code: "27-10-00" }],
        inspectionPoint: true,
      },
    ],
  },
  {
    title: "Main landing gear inspection on jacks",
    owner: "instructor@hangarleaf.test",
    subject: "Landing gear and brakes",
    ataChapter: "32",
    applicability: ["HT-20"],
    estimatedMinutes: 120,
    // Lines starting with a tool-room number are checked against what the student has out (seed-tools.ts).
    tools: ["K-02 Landing gear kit (jack pads, 10x glass, cotter pin puller)", "Wing jacks", "TW-1 Torque wrench, 0-250 in-lb, calibrated"],
    consumables: ["New cotter pins"],
    protectiveEquipment: ["Safety glasses", "Safety shoes"],
    steps: [
      {
        text: "Jack the aircraft at the marked jack points until both main wheels are clear of the floor. Install the jack locks.",
        notices: [
          {
            kind: "warning",
            text: "An aircraft that slips off a jack can crush you. Use the marked jack points, raise evenly, lock the jacks, and never put any part of your body under the aircraft while it is being raised.",
          },
          inventedNote("the axle nut torque"),
        ],
        refs: [{ manual: trainer, label: rev3, code: "32-10-00" }],
        inspectionPoint: true,
      },
      {
        text: "Check each gear leg for cracks at the attach fittings with the glass.",
        refs: [{ manual: trainer, label: rev3, code: "32-10-00" }],
      },
      {
        text: "Torque the axle nut inside the range and line up the next slot with the cotter-pin hole without leaving the range. Install a new cotter pin.",
        notices: [
          {
            kind: "caution",
            text: "Never back a torqued nut off, or go past the maximum, to line up the hole. If no slot lines up inside the range, tell the instructor: a different washer or nut is needed.",
          },
          { kind: "caution", text: "Never reuse a cotter pin." },
        ],
        refs: [{ manual: trainer, label: rev3, code: "32-10-00", part: "limits", quote: "Axle nut torque" }],
        measurement: { label: "Axle nut torque", unit: "in-lb", min: 150, max: 180 },
        calibratedTool: true,
      },
    ],
  },
  {
    title: "Propeller track check",
    owner: "instructor2@hangarleaf.test",
    subject: "Propellers",
    ataChapter: "61",
    applicability: ["HT-20"],
    estimatedMinutes: 30,
    tools: ["Fixed pointer on a stand", "Steel rule"],
    consumables: [],
    protectiveEquipment: ["Safety glasses"],
    steps: [
      {
        text: "Make sure the magnetos are off and grounded, then block the aircraft so that it cannot move.",
        notices: [
          {
            kind: "warning",
            text: "Treat every propeller as live: a magneto with a broken ground lead fires when the propeller turns. Stand clear of the arc.",
          },
          inventedNote("the track limit"),
        ],
        refs: [{ manual: trainer, label: rev3, code: "61-20-00" }],
      },
      {
        text: "Place the pointer within 1/4 in of a blade tip, turn the propeller by hand in the direction of rotation and measure each tip against it.",
        refs: [{ manual: trainer, label: rev3, code: "61-20-00", part: "limits", quote: "Track difference" }],
        measurement: { label: "Track difference between blades", unit: "in", max: 0.0625 },
        inspectionPoint: true,
      },
    ],
  },
  {
    title: "Turbine engine removal and installation on the stand",
    owner: "instructor2@hangarleaf.test",
    subject: "Engine removal and installation",
    ataChapter: "71",
    applicability: ["TF-400"],
    estimatedMinutes: 480,
    tools: [
      "Engine hoist and sling rated for the engine weight",
      "Transport stand",
      "Tail stand",
      "Torque wrench, 20-100 ft-lb, calibrated",
      "Line caps and plugs",
      "Connector caps",
    ],
    consumables: ["Approved fuel drain container", "Tags", "Circuit breaker collars", "New cotter pins"],
    protectiveEquipment: ["Safety shoes", "Gloves", "Safety glasses"],
    steps: [
      {
        text: "Install the tail stand. Disconnect the battery, open the circuit breakers and tag them, and open the ignition exciter breaker.",
        notices: [
          {
            kind: "warning",
            text: "The ignition exciter stores a lethal charge. Open its circuit breaker and wait 5 minutes before you touch an igniter lead.",
          },
          {
            kind: "warning",
            text: "Without the engine's weight the centre of gravity moves aft and the aircraft can sit on its tail: the tail stand goes in before the engine comes off.",
          },
          inventedNote("the engine weight, the waiting time and the mount bolt torque"),
        ],
        refs: [{ manual: turbine, label: rev1, code: "71-00-10" }],
        inspectionPoint: true,
      },
      {
        text: "Close the fuel shutoff valve and drain the lines. Tag, disconnect and cap every electrical connector, line and fitting.",
        notices: [
          { kind: "warning", text: "Fuel vapour ignites. Drain into an approved container and keep extinguishers at the work area." },
          {
            kind: "caution",
            text: "Cap each connector as it comes apart: water and dirt in an open connector make faults that are hard to find.",
          },
        ],
        refs: [{ manual: turbine, label: rev1, code: "71-00-10" }],
      },
      {
        text: "Attach the sling and take up the weight of the engine (310 lb) with the hoist, then remove the mount bolts in the order shown. Lower the engine onto the stand and secure it.",
        notices: [
          { kind: "warning", text: "Never stand under a raised engine." },
          { kind: "caution", text: "Take up the weight before the first mount bolt comes out, or the mounts bend." },
        ],
        refs: [{ manual: turbine, label: rev1, code: "71-00-20" }],
        inspectionPoint: true,
      },
      {
        text: "Hoist the engine back onto the mounts and torque the bolts in sequence with a calibrated wrench. Use the torque calculator if an adapter is on the wrench.",
        notices: [{ kind: "caution", text: "Never back a torqued nut off, or go past the maximum, to line up a cotter-pin hole." }],
        refs: [{ manual: turbine, label: rev1, code: "71-00-30", part: "limits", quote: "Mount bolt torque" }],
        measurement: { label: "Mount bolt torque", unit: "ft-lb", min: 40, max: 45 },
        calculator: "torque",
      },
      {
        text: "Connect the lines and connectors, removing each cap as you go. Close the circuit breakers only when every connector is on, then do the leak check with the instructor.",
        refs: [{ manual: turbine, label: rev1, code: "71-00-30" }],
        inspectionPoint: true,
      },
    ],
  },
];

export async function seedCards(db: Db): Promise<number> {
  await db
    .insert(curriculumSubjects)
    .values(demoSubjects.map((name) => ({ name })))
    .onConflictDoNothing();
  const subjects = new Map((await db.select().from(curriculumSubjects)).map((s) => [s.name, s.id]));
  const people = new Map(
    (
      await db
        .select({ id: users.id, email: users.email })
        .from(users)
        .where(inArray(users.email, [...new Set(demoCards.map((c) => c.owner))]))
    ).map((u) => [u.email, u.id]),
  );
  const revisionRows = await db
    .select({ id: revisions.id, manualId: revisions.manualId, label: revisions.label, title: manuals.title })
    .from(revisions)
    .innerJoin(manuals, eq(manuals.id, revisions.manualId));
  const revisionOf = (ref: Ref) => {
    const row = revisionRows.find((r) => r.title.startsWith(ref.manual) && r.label === ref.label);
    if (!row) throw new Error(`demo revision ${ref.manual} ${ref.label} is missing`);
    return row;
  };

  let added = 0;
  for (const card of demoCards) {
    const [exists] = await db
      .select({ id: taskCardVersions.id })
      .from(taskCardVersions)
      .where(and(eq(taskCardVersions.title, card.title), eq(taskCardVersions.number, 1)));
    if (exists) continue;
    const steps = card.steps.map((s, i) => ({
      id: randomUUID(),
      text: s.text,
      notices: s.notices ?? [],
      references: (s.refs ?? []).map((r) => ({
        revisionId: revisionOf(r).id,
        page: sectionPage(manualByPrefix(r.manual), r.code, r.part),
        quote: r.quote ?? "",
      })),
      measurement: s.measurement ?? null,
      calculator: s.calculator ?? null,
      inspectionPoint: s.inspectionPoint ?? false,
      calibratedTool: s.calibratedTool ?? false,
      elements: demoElementMap[card.title]?.[i + 1] ?? [],
      timerMinutes: s.timerMinutes ?? null,
    }));
    const input: CardContentInput = {
      title: card.title,
      applicability: card.applicability,
      ataChapter: card.ataChapter,
      subjectId: subjects.get(card.subject) ?? null,
      estimatedMinutes: card.estimatedMinutes,
      tools: card.tools,
      consumables: card.consumables,
      protectiveEquipment: card.protectiveEquipment,
      steps,
    };
    const content = parseWith(cardContentSchema, input); // the demo obeys the same rules as the editor
    const ownerId = people.get(card.owner) ?? null;
    await db.transaction(async (tx) => {
      const [row] = await tx.insert(taskCards).values({ ownerId }).returning({ id: taskCards.id });
      const [version] = await tx
        .insert(taskCardVersions)
        .values({ ...content, cardId: row!.id, number: 1, createdBy: ownerId, editCount: 1 })
        .returning({ id: taskCardVersions.id });
      const citations = content.steps.flatMap((step, i) =>
        step.references.map((r) => ({
          versionId: version!.id,
          stepId: step.id,
          stepNumber: i + 1,
          manualId: revisionRows.find((x) => x.id === r.revisionId)!.manualId,
          revisionId: r.revisionId,
          pageNumber: r.page,
          quote: r.quote,
        })),
      );
      if (citations.length) await tx.insert(cardCitations).values(citations);
      // Citations go in while the version is a draft: once published, the database freezes both.
      await tx
        .update(taskCardVersions)
        .set({ status: "published", publishedAt: new Date(), publishedBy: ownerId })
        .where(eq(taskCardVersions.id, version!.id));
    });
    added++;
  }
  return added;
}
