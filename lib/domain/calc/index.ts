// The calculators a task-card step can carry, and that have pages of their own under /calculators:
// their titles, formulas, sources and the trade's cautions shown with each.
export const calculatorSlugs = ["rivets", "bend", "torque", "penetrant", "coil-shot", "units"] as const;
export type CalculatorSlug = (typeof calculatorSlugs)[number];

/** WARNING = injury or death, CAUTION = damage to equipment, NOTE = information (MIL-DTL-23618H). */
export interface CalculatorNotice {
  kind: "warning" | "caution" | "note";
  text: string;
}

export interface CalculatorInfo {
  slug: CalculatorSlug;
  title: string;
  summary: string;
  formula: string[];
  sources: string[];
  /** Shown above the calculator wherever it appears, warnings first. */
  notices: CalculatorNotice[];
}

export const calculators: Record<CalculatorSlug, CalculatorInfo> = {
  rivets: {
    slug: "rivets",
    title: "Rivet selection and layout",
    summary:
      "The rivet diameters the thickest sheet allows, length from the grip, edge distance, pitch, row spacing, the count for a splice, and the part number.",
    formula: [
      "t ≤ D ≤ 3 t (thickest sheet); about 3 t, taken to the next stocked size up",
      "L = grip + 1.5 × D, then the next standard length up",
      "edge 2 D to 4 D (2.5 D countersunk) · pitch ≥ 3 D (usually 4–8 D) · rows ≥ 2.5 D, about 75 % of pitch",
      "rivets = ⌈width × rivets per inch⌉ × joint factor",
    ],
    sources: [
      "FAA AC 43.13-1B par. 4-57, 4-58g, Fig. 4-20, Table 4-10",
      "NAVEDTRA 14018 ch. 13",
      "US Army TM 10-5410-229-13&P",
      "FAA-H-8083-31 ch. 4",
    ],
    notices: [
      {
        kind: "caution",
        text: "Heat-treated (icebox) rivets, 2017-T (D) and 2024-T (DD), harden again once they leave the refrigerator: drive them within the time the approved data gives (commonly about an hour for D and 10 to 20 minutes for DD, from memory) or heat-treat them again. A rivet driven too late cracks.",
      },
      {
        kind: "note",
        text: "The approved repair data comes first: the manufacturer's structural repair data or the approved repair drawing names the rivet, the layout and the count. This calculator only checks the handbook's general rules.",
      },
    ],
  },
  bend: {
    slug: "bend",
    title: "Sheet-metal bend",
    summary: "Setback with K factors, bend allowance, flat-pattern length, and the minimum bend radius of 2024-T3 and 2024-O.",
    formula: [
      "K = tan(angle ÷ 2)",
      "SB = K × (R + T)",
      "BA = (0.01743 × R + 0.0078 × T) × angle",
      "flat = Σ(dimension − setbacks) + Σ BA",
      "minimum R per gauge and temper; between gauges, the thicker (safer) row",
    ],
    sources: ["FAA-H-8083-31 ch. 4", "FAA AC 43.13-1B Tables 4-6 and 4-7"],
    notices: [
      {
        kind: "caution",
        text: "A radius tighter than the minimum for the alloy and temper cracks the sheet, sometimes where it cannot be seen.",
      },
      {
        kind: "note",
        text: "The radius table covers 2024-T3 and 2024-O only. For another alloy or temper, use the drawing or the manufacturer's data.",
      },
    ],
  },
  torque: {
    slug: "torque",
    title: "Torque wrench with an extension",
    summary:
      "The wrench setting that gives the torque the manual asks for when an adapter lengthens or shortens the lever, and unit conversions.",
    formula: [
      "TW = TA × L ÷ (L + A)",
      "L − A when the adapter points back toward the handle (A at most half of L)",
      "1 ft-lb = 12 in-lb = 1.3558 N·m",
    ],
    sources: ["US Army TM 1-1500-204-23-9", "NAVEDTRA 14315 Fig. 3-44/45", "FAA AC 43.13-1B par. 7-37"],
    notices: [
      {
        kind: "caution",
        text: "Use the manufacturer's torque value for that fastener, and note whether it is for dry or lubricated threads: a lubricated thread torqued to a dry value is overtightened.",
      },
      {
        kind: "caution",
        text: "With a self-locking nut, measure its drag (running torque) before it seats and add it to the value, unless the manual says otherwise.",
      },
      {
        kind: "caution",
        text: "Use a calibrated wrench inside its calibration date, with the adapter in line with the handle, held at the grip mark.",
      },
      {
        kind: "caution",
        text: "Never back a torqued nut off, or go past the maximum, to line up a cotter-pin hole. If the hole does not line up inside the range, change the washer or the nut and start again.",
      },
    ],
  },
  penetrant: {
    slug: "penetrant",
    title: "Penetrant dwell and part temperature",
    summary: "The penetrant dwell adjusted for the temperature of the part, and the development time for the developer used.",
    formula: [
      "40–120 °F only; below 40 °F no penetrant test",
      "60–100 °F: specified dwell",
      "40–60 °F: 2 × dwell",
      "100–120 °F: may be ½ × dwell, never under 5 min",
      "dwell under 10 min is flagged",
      "development ≈ ½ × dwell, never under 10 min (nonaqueous: at most 30 min)",
    ],
    sources: ["USAF T.O. 33B-1-1", "US Army TM 1-1500-204-23-7", "NAVSEA T9074-AS-GIB-010/271", "ASTM E1417 (from memory)"],
    notices: [
      {
        kind: "warning",
        text: "Penetrants, removers and developers are flammable and irritate skin and eyes: gloves, goggles and ventilation. UV-A lamps burn eyes and skin: never look into the lamp.",
      },
      {
        kind: "caution",
        text: "Do not sand, blast or scrape paint off before the test: smeared metal closes the cracks the test must find. Strip paint chemically, as the procedure says.",
      },
      {
        kind: "note",
        text: "The inspection procedure and the penetrant maker's data come first; this calculator adjusts their dwell for temperature.",
      },
    ],
  },
  "coil-shot": {
    slug: "coil-shot",
    title: "Magnetic-particle coil current",
    summary:
      "The coil-shot current for a part of a given length and diameter, solid or hollow, in a coil of N turns, for how the part sits in the coil.",
    formula: [
      "against the coil wall, low fill: I = 45,000 ÷ ((L/D) × N)",
      "centred, low fill: I = 43,000 × R ÷ ((6 × L/D − 5) × N)",
      "high fill or cable wrap: I = 35,000 ÷ ((L/D + 2) × N)",
      "hollow part: D = √(OD² − ID²)",
      "L/D over 3 (pole pieces below), 15 used above 15; result ±10 %",
    ],
    sources: ["USAF T.O. 33B-1-1", "FAA AC 43.13-1B par. 5-40, 5-41a", "ASTM E1444 (from memory)"],
    notices: [
      {
        kind: "caution",
        text: "Magnetic-particle inspection works on ferromagnetic parts only, and finds a flaw only where the flux crosses it. High currents heat contacts and can burn the part.",
      },
      {
        kind: "caution",
        text: "Demagnetise the part after the inspection and check with a field indicator that it is done: a magnetised part holds chips and upsets compasses and instruments.",
      },
      {
        kind: "note",
        text: "The current is a starting value, ±10 %. Verify the field on the part with a field indicator before you trust the shot.",
      },
    ],
  },
  units: {
    slug: "units",
    title: "Unit conversions",
    summary: "Lengths, torques, temperatures and pressures between the units manuals use.",
    formula: ["1 in = 25.4 mm", "1 in-lb = 0.11298 N·m", "°C = (°F − 32) × 5 ÷ 9"],
    sources: ["Exact definitions: lb = 0.45359237 kg, g = 9.80665 m/s², in = 25.4 mm"],
    notices: [
      {
        kind: "note",
        text: "Work to the value and unit the manual gives. Conversions here are rounded to six figures: judge a reading against a limit in the limit's own unit, as the card's measurement fields do.",
      },
    ],
  },
};

/** Shown with every calculator, on its page and in a step. */
export const trainingAidNotice =
  "Training aid only. The manufacturer's current data, your instructor, the school's and local rules, and the sign-off of a licensed technician come first: check every result against them before it is used on an aircraft.";
