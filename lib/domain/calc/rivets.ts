// Rivet selection and layout for a sheet-metal repair, from the rules the FAA and military
// handbooks teach. Inches throughout. A result is a training aid: the manufacturer's structural
// repair data comes first.

import { refuse } from "@/lib/domain/calc/units";

/** Solid-rivet diameters a school shop stocks, in inches (3/32 to 1/4; common practice). */
export const stockDiameters = [3 / 32, 1 / 8, 5 / 32, 3 / 16, 1 / 4] as const;

/** Protects rounding up from float noise: 4.9 × 10 is 49, not 49.000000000000004. */
const ceil = (x: number) => Math.ceil(x - 1e-9);

export interface DiameterOption {
  diameter: number;
  /** Why this size is offered, in the handbooks' words. */
  basis: string;
}

export interface DiameterChoice {
  /** About three times the thickest sheet (AC 43.13-1B par. 4-58g), the upper guide of NAVEDTRA 14018. */
  target: number;
  /** Never smaller than the thickest sheet (NAVEDTRA 14018 ch. 13). */
  minimum: number;
  /** Every stocked size the handbooks allow for this sheet, smallest first: the user chooses. */
  options: DiameterOption[];
  /** The first stocked diameter at or above 3 t: the size AC 43.13-1B's example picks. */
  suggested: number | null;
  /** One stocked size larger, "also satisfactory" in that example. */
  alternative: number | null;
  warnings: string[];
}

/**
 * The sizes a thickest sheet allows, not one answer. NAVEDTRA 14018 ch. 13: from the thickness of
 * the thickest sheet up to three times it. AC 43.13-1B par. 4-58g: about 3 t, taken to the next
 * stocked size up (0.032 in → 0.096 → 1/8 in), with the next size "also satisfactory".
 */
export function chooseRivetDiameter(thickestSheet: number): DiameterChoice {
  if (!(thickestSheet > 0)) refuse("The sheet thickness must be more than zero.");
  const target = 3 * thickestSheet;
  const index = stockDiameters.findIndex((d) => d >= target - 1e-9);
  const suggested = index >= 0 ? stockDiameters[index]! : null;
  const alternative = index >= 0 ? (stockDiameters[index + 1] ?? null) : null;
  const options: DiameterOption[] = [];
  for (const d of stockDiameters) {
    if (d < thickestSheet - 1e-9) continue; // smaller than the sheet: never (NAVEDTRA 14018)
    if (d === suggested) options.push({ diameter: d, basis: "the next size at or above 3 t (AC 43.13-1B par. 4-58g)" });
    else if (d === alternative) options.push({ diameter: d, basis: "one size larger, also satisfactory (AC 43.13-1B par. 4-58g)" });
    else if (d < target - 1e-9)
      options.push({ diameter: d, basis: "between t and 3 t (NAVEDTRA 14018 ch. 13), under the 3 t the AC aims at" });
  }
  const warnings: string[] = [];
  if (suggested === null) {
    warnings.push("Three times this sheet is larger than a 1/4 in rivet: this repair needs engineering data, not this calculator.");
  }
  if (!options.length) warnings.push("No stocked rivet is at least as thick as this sheet.");
  return { target, minimum: thickestSheet, options, suggested, alternative, warnings };
}

export interface RivetLength {
  /** L = grip + 1.5 D (NAVEDTRA 14018; FAA-H-8083-31 ch. 4). */
  length: number;
  /** The next standard length at or above L, in sixteenths (half steps), for the part number. */
  lengthSixteenths: number;
}

/**
 * L = grip + 1.5 D, then the next standard length up: TM 10-5410-229-13&P takes "the nearest
 * standard length greater" and FAA-H-8083-31 ch. 4 the same. A short rivet leaves a shop head too
 * small to hold; a long one is cut down. Standard lengths here step by 1/32 in (half a dash number,
 * as in AC 43.13-1B's MS20470AD4-3.5). Only float noise (a billionth of an inch) is forgiven.
 */
export function rivetLength({ grip, diameter }: { grip: number; diameter: number }): RivetLength {
  if (!(grip > 0) || !(diameter > 0)) refuse("Grip and diameter must be more than zero.");
  const length = grip + 1.5 * diameter;
  const lengthSixteenths = ceil(length * 32) / 2;
  return { length, lengthSixteenths };
}

export interface Layout {
  /** Edge distance at least 2 D (TM 10-5410-229-13&P); 2.5 D for countersunk heads (secondary sources). */
  minimumEdgeDistance: number;
  /** The edge distance range: the minimum to 4 D (FAA-H-8083-31 ch. 4, from memory). */
  edgeDistance: [number, number];
  /** Pitch never under 3 D (NAVEDTRA 14018; TM 10-5410-229-13&P). */
  minimumPitch: number;
  /** Pitch seldom under 4 D or over 8 D (NAVEDTRA 14018). */
  usualPitch: [number, number];
  /** Rows at least 2.5 D apart (TM 10-5410-229-13&P). */
  minimumRowSpacing: number;
  /**
   * Transverse (row) pitch about 75 % of the pitch, never under 2.5 D (secondary copies; the demo
   * handbook's 51-10-00 says the same): for the pitch given, or for the usual 4–8 D range.
   */
  transversePitch: [number, number];
  warnings: string[];
}

export function rivetLayout({
  diameter,
  countersunk = false,
  pitch,
}: {
  diameter: number;
  countersunk?: boolean;
  pitch?: number | null;
}): Layout {
  if (!(diameter > 0)) refuse("The diameter must be more than zero.");
  if (pitch != null && !(pitch > 0)) refuse("The pitch must be more than zero.");
  const minimumEdgeDistance = (countersunk ? 2.5 : 2) * diameter;
  const minimumRowSpacing = 2.5 * diameter;
  const usualPitch: [number, number] = [4 * diameter, 8 * diameter];
  const transverse = (p: number) => Math.max(0.75 * p, minimumRowSpacing);
  const warnings: string[] = [];
  if (pitch != null && pitch < 3 * diameter - 1e-9)
    warnings.push("That pitch is under the 3 D minimum (NAVEDTRA 14018; TM 10-5410-229-13&P): space the rivets farther apart.");
  else if (pitch != null && pitch > 8 * diameter + 1e-9)
    warnings.push("That pitch is over the 8 D the handbook says pitch seldom exceeds (NAVEDTRA 14018): check the repair drawing.");
  return {
    minimumEdgeDistance,
    edgeDistance: [minimumEdgeDistance, 4 * diameter],
    minimumPitch: 3 * diameter,
    usualPitch,
    minimumRowSpacing,
    transversePitch: pitch != null ? [transverse(pitch), transverse(pitch)] : [transverse(usualPitch[0]), transverse(usualPitch[1])],
    warnings,
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
export function rivetsForSplice({
  width,
  rivetsPerInch,
  factor = 1,
  rows = 1,
}: {
  width: number;
  rivetsPerInch: number;
  factor?: number;
  rows?: number;
}): SpliceCount {
  if (!(width > 0) || !(rivetsPerInch > 0)) refuse("Width and rivets per inch must be more than zero.");
  if (!(factor > 0 && factor <= 1)) refuse("The reduction factor is between 0 and 1.");
  if (!Number.isInteger(rows) || rows < 1) refuse("Use one or more rows.");
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
export function rivetPartNumber({
  head,
  material,
  diameter,
  lengthSixteenths,
}: {
  head: HeadStyle;
  material: RivetMaterial;
  diameter: number;
  lengthSixteenths: number;
}): string {
  const d32 = diameter * 32;
  if (!(diameter > 0) || !(lengthSixteenths > 0)) refuse("A rivet's diameter and length are more than zero.");
  if (Math.abs(d32 - Math.round(d32)) > 1e-6) refuse("A rivet diameter is a whole number of 32nds of an inch.");
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
export function substituteWith2117({ alloy, diameter }: { alloy: "2017" | "2024"; diameter: number }): {
  allowed: boolean;
  replacement: number | null;
  reason: string;
} {
  if (!(diameter > 0)) refuse("The diameter must be more than zero.");
  const limit = alloy === "2017" ? 3 / 16 : 5 / 32;
  if (diameter <= limit + 1e-9) {
    return {
      allowed: true,
      replacement: diameter + 1 / 32,
      reason: `${alloy} rivets up to ${alloy === "2017" ? "3/16" : "5/32"} in may be replaced by 2117 rivets 1/32 in larger.`,
    };
  }
  return {
    allowed: false,
    replacement: null,
    reason: `The handbook allows the swap only for ${alloy} rivets up to ${alloy === "2017" ? "3/16" : "5/32"} in.`,
  };
}

/** 0.125 → "1/8", 0.15625 → "5/32": how the shop names a diameter. */
export function fractionOfInch(value: number, denominators = [2, 4, 8, 16, 32, 64]): string | null {
  for (const d of denominators) {
    const n = value * d;
    if (Math.abs(n - Math.round(n)) < 1e-6) return Number.isInteger(value) ? String(value) : `${Math.round(n)}/${d}`;
  }
  return null;
}
