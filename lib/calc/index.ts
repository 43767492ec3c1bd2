// The calculators a task-card step can carry, and that have pages of their own under /calculators.
export const calculatorSlugs = ["rivets", "bend", "torque", "penetrant", "coil-shot", "units"] as const;
export type CalculatorSlug = (typeof calculatorSlugs)[number];

export interface CalculatorInfo {
  slug: CalculatorSlug;
  title: string;
  summary: string;
  formula: string[];
  sources: string[];
  /** Shown as a CAUTION block above the calculator wherever it appears. */
  caution?: string;
}

export const calculators: Record<CalculatorSlug, CalculatorInfo> = {
  rivets: {
    slug: "rivets",
    title: "Rivet selection and layout",
    summary: "Diameter from the thickest sheet, length from the grip, edge distance, pitch, row spacing, the count for a splice, and the part number.",
    formula: ["D ≈ 3 × t (thickest sheet), never less than t", "L = grip + 1.5 × D", "edge ≥ 2 D · pitch ≥ 3 D (usually 4–8 D) · rows ≥ 2.5 D", "rivets = ⌈width × rivets per inch⌉ × joint factor"],
    sources: ["FAA AC 43.13-1B par. 4-57, 4-58g, Fig. 4-20, Table 4-10", "NAVEDTRA 14018 ch. 13", "US Army TM 10-5410-229-13&P"],
  },
  bend: {
    slug: "bend",
    title: "Sheet-metal bend",
    summary: "Setback with K factors, bend allowance, flat-pattern length, and the minimum bend radius of 2024-T3.",
    formula: ["K = tan(angle ÷ 2)", "SB = K × (R + T)", "BA = (0.01743 × R + 0.0078 × T) × angle", "flat = Σ(dimension − setbacks) + Σ BA"],
    sources: ["FAA-H-8083-31 ch. 4", "FAA AC 43.13-1B Tables 4-6 and 4-7"],
    caution: "A radius tighter than the minimum for the alloy and temper cracks the sheet, sometimes where it cannot be seen.",
  },
  torque: {
    slug: "torque",
    title: "Torque wrench with an extension",
    summary: "The wrench setting that gives the torque the manual asks for when an adapter lengthens or shortens the lever, and unit conversions.",
    formula: ["TW = TA × L ÷ (L + A)", "L − A when the adapter points back toward the handle", "1 ft-lb = 12 in-lb = 1.3558 N·m"],
    sources: ["US Army TM 1-1500-204-23-9", "NAVEDTRA 14315 Fig. 3-44/45"],
    caution: "The formula holds only with the adapter in line with the wrench. Hold the wrench at its grip mark.",
  },
  penetrant: {
    slug: "penetrant",
    title: "Penetrant dwell and part temperature",
    summary: "The penetrant dwell adjusted for the temperature of the part, and the development time.",
    formula: ["60–100 °F: specified dwell", "40–60 °F: 2 × dwell", "100–120 °F: may be ½ × dwell, never under 5 min", "below 40 °F: no penetrant test", "development ≈ ½ × dwell"],
    sources: ["USAF T.O. 33B-1-1", "US Army TM 1-1500-204-23-7", "NAVSEA T9074-AS-GIB-010/271"],
    caution: "Penetrants, removers and developers are flammable and irritate skin and eyes: gloves, goggles and ventilation. UV-A lamps burn eyes and skin: never look into the lamp.",
  },
  "coil-shot": {
    slug: "coil-shot",
    title: "Magnetic-particle coil current",
    summary: "The coil-shot current for a part of a given length and diameter in a coil of N turns.",
    formula: ["I = 45,000 ÷ ((L ÷ D) × N)", "L/D ≤ 3 needs pole pieces"],
    sources: ["USAF T.O. 33B-1-1", "FAA AC 43.13-1B par. 5-40, 5-41a"],
    caution: "Magnetic-particle inspection works on ferromagnetic parts only, and finds a flaw only where the flux crosses it. High currents heat contacts and can burn the part.",
  },
  units: {
    slug: "units",
    title: "Unit conversions",
    summary: "Lengths, torques, temperatures and pressures between the units manuals use.",
    formula: ["1 in = 25.4 mm", "1 in-lb = 0.11298 N·m", "°C = (°F − 32) × 5 ÷ 9"],
    sources: ["Exact definitions: lb = 0.45359237 kg, g = 9.80665 m/s², in = 25.4 mm"],
  },
};

export const trainingAidNotice =
  "Training aid: check every result against the current manufacturer's data and your instructor before you use it on an aircraft.";
