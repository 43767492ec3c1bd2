// Rivet selection and layout for a sheet-metal repair, from the rules the FAA and military
// handbooks teach. Inches throughout. A result is a training aid: the manufacturer's structural
// repair data comes first.

/** Solid-rivet diameters a school shop stocks, in inches (3/32 to 1/4; common practice). */
export const stockDiameters = [3 / 32, 1 / 8, 5 / 32, 3 / 16, 1 / 4] as const;

/** Protects rounding up from float noise: 4.9 × 10 is 49, not 49.000000000000004. */
const ceil = (x: number) => Math.ceil(x - 1e-9);

export interface DiameterChoice {
  /** About three times the thickest sheet (AC 43.13-1B par. 4-58g). */
  target: number;
  /** Never smaller than the thickest sheet (NAVEDTRA 14018 ch. 13). */
  minimum: number;
  /** The first stocked diameter at or above the target. */
  suggested: number | null;
  /** One stocked size larger, also satisfactory in the handbook's example. */
  alternative: number | null;
  warnings: string[];
}

export function chooseRivetDiameter(thickestSheet: number): DiameterChoice {
  if (!(thickestSheet > 0)) throw new RangeError("The sheet thickness must be more than zero.");
  const target = 3 * thickestSheet;
  const index = stockDiameters.findIndex((d) => d >= target - 1e-9);
  const suggested = index >= 0 ? stockDiameters[index]! : null;
  const alternative = index >= 0 ? (stockDiameters[index + 1] ?? null) : null;
  const warnings: string[] = [];
  if (suggested === null) {
    warnings.push("Three times this sheet is larger than a 1/4 in rivet: this repair needs engineering data, not this calculator.");
  }
  return { target, minimum: thickestSheet, suggested, alternative, warnings };
}

export interface RivetLength {
  /** L = grip + 1.5 D (NAVEDTRA 14018; FAA-H-8083-31 ch. 4). */
  length: number;
  /** Length in sixteenths, in half steps, for the part number. */
  lengthSixteenths: number;
}

// A rivet is sold in steps of 1/32 in; a computed length a hair over a step (0.2515 for 0.25) takes
// that step, since 0.002 in is inside what anyone can measure a grip to (common practice).
const measuringSlack = 0.002;

export function rivetLength({ grip, diameter }: { grip: number; diameter: number }): RivetLength {
  if (!(grip > 0) || !(diameter > 0)) throw new RangeError("Grip and diameter must be more than zero.");
  const length = grip + 1.5 * diameter;
  const lengthSixteenths = ceil((length - measuringSlack) * 32) / 2;
  return { length, lengthSixteenths };
}

export interface Layout {
  /** Edge distance at least 2 D (TM 10-5410-229-13&P); 2.5 D for countersunk heads (secondary sources). */
  minimumEdgeDistance: number;
  /** Pitch never under 3 D (NAVEDTRA 14018; TM 10-5410-229-13&P). */
  minimumPitch: number;
  /** Pitch seldom under 4 D or over 8 D (NAVEDTRA 14018). */
  usualPitch: [number, number];
  /** Rows at least 2.5 D apart (TM 10-5410-229-13&P). */
  minimumRowSpacing: number;
}

export function rivetLayout({ diameter, countersunk = false }: { diameter: number; countersunk?: boolean }): Layout {
  if (!(diameter > 0)) throw new RangeError("The diameter must be more than zero.");
  return {
    minimumEdgeDistance: (countersunk ? 2.5 : 2) * diameter,
    minimumPitch: 3 * diameter,
    usualPitch: [4 * diameter, 8 * diameter],
    minimumRowSpacing: 2.5 * diameter,
  };
}

export interface SpliceCount {
  /** Width × rivets per inch from AC 43.13-1B Table 4-10, rounded up. */
  fromTable: number;
  /** After the reduction the table's notes allow for the kind of joint, rounded up. */
  required: number;
  perRow: number;
  warnings: string[];
}

/**
 * Rivets for a splice: the table value per inch of width times the width, reduced by the factor
 * its notes give (0.75 for the single-lap sheet splice of par. 4-58g, 0.6 in the Fig. 4-20 example).
 */
export function rivetsForSplice({ width, rivetsPerInch, factor = 1, rows = 1 }: { width: number; rivetsPerInch: number; factor?: number; rows?: number }): SpliceCount {
  if (!(width > 0) || !(rivetsPerInch > 0)) throw new RangeError("Width and rivets per inch must be more than zero.");
  if (!(factor > 0 && factor <= 1)) throw new RangeError("The reduction factor is between 0 and 1.");
  if (!Number.isInteger(rows) || rows < 1) throw new RangeError("Use one or more rows.");
  const fromTable = ceil(width * rivetsPerInch);
  const required = ceil(fromTable * factor);
  const perRow = ceil(required / rows);
  const warnings: string[] = [];
  if (rows === 1 && required > 1) warnings.push("Repairs of this kind are usually laid out in two or more rows; check the repair drawing.");
  return { fromTable, required, perRow, warnings };
}

export type HeadStyle = "MS20470" | "MS20426";
export type RivetMaterial = "AD" | "D" | "DD";

/** Head styles and material letters a trainee meets first (from memory; the AC names MS20470 and AD). */
export const rivetMaterials: Record<RivetMaterial, string> = { AD: "2117-T4", D: "2017-T4", DD: "2024-T4" };
export const headStyles: Record<HeadStyle, string> = { MS20470: "universal head", MS20426: "100° countersunk head" };

function trim(n: number): string {
  return Number.isInteger(n) ? String(n) : String(n).replace(/0+$/, "");
}

/** Diameter in 32nds, length in 16ths (AC 43.13-1B par. 4-57a(4)): MS20470AD4-3.5. */
export function rivetPartNumber({ head, material, diameter, lengthSixteenths }: { head: HeadStyle; material: RivetMaterial; diameter: number; lengthSixteenths: number }): string {
  const d32 = diameter * 32;
  if (Math.abs(d32 - Math.round(d32)) > 1e-6) throw new RangeError("A rivet diameter is a whole number of 32nds of an inch.");
  return `${head}${material}${Math.round(d32)}-${trim(lengthSixteenths)}`;
}

export function parseRivetPartNumber(code: string): { head: string; material: string; diameter: number; length: number } | null {
  const m = /^(MS\d{5}|AN\d{3})([A-Z]{0,2})(\d+)-(\d+(?:\.\d+)?)$/.exec(code.trim().toUpperCase());
  if (!m) return null;
  return { head: m[1]!, material: m[2]!, diameter: Number(m[3]) / 32, length: Number(m[4]) / 16 };
}

/**
 * 2017 rivets of 3/16 in and under and 2024 rivets of 5/32 in and under may be replaced by 2117
 * rivets 1/32 in larger (AC 43.13-1B par. 4-57b).
 */
export function substituteWith2117({ alloy, diameter }: { alloy: "2017" | "2024"; diameter: number }): { allowed: boolean; replacement: number | null; reason: string } {
  const limit = alloy === "2017" ? 3 / 16 : 5 / 32;
  if (diameter <= limit + 1e-9) {
    return { allowed: true, replacement: diameter + 1 / 32, reason: `${alloy} rivets up to ${alloy === "2017" ? "3/16" : "5/32"} in may be replaced by 2117 rivets 1/32 in larger.` };
  }
  return { allowed: false, replacement: null, reason: `The handbook allows the swap only for ${alloy} rivets up to ${alloy === "2017" ? "3/16" : "5/32"} in.` };
}

/** 0.125 → "1/8", 0.15625 → "5/32": how the shop names a diameter. */
export function fractionOfInch(value: number, denominators = [2, 4, 8, 16, 32, 64]): string | null {
  for (const d of denominators) {
    const n = value * d;
    if (Math.abs(n - Math.round(n)) < 1e-6) return Number.isInteger(value) ? String(value) : `${Math.round(n)}/${d}`;
  }
  return null;
}
