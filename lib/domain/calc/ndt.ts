// Nondestructive testing rules a card step can carry: the penetrant dwell adjusted for the part's
// temperature with its development time, and the coil-shot current for magnetic-particle
// inspection. Values from USAF T.O. 33B-1-1, US Army TM 1-1500-204-23-7, NAVSEA
// T9074-AS-GIB-010/271 and ASTM E1417 / E1444; each rule names its source and how sure it is.
import { convert, formatAgainst, formatNumber, refuse } from "@/lib/domain/calc/units";

/**
 * The part temperatures at which a penetrant test is done at all, in °F: T.O. 33B-1-1 gives no test
 * below 40 °F and rules up to 120 °F, and nothing above. The calculator, the demo procedure and the
 * demo card all use this one window.
 */
export const penetrantWindowF = { min: 40, max: 120 } as const;

/**
 * The shortest penetrant dwell a procedure may specify: 10 minutes (ASTM E1417, from memory). The
 * 5-minute floor of T.O. 33B-1-1 applies only to a dwell halved on a warm part.
 */
export const minimumDwellMinutes = 10;

export type DeveloperForm = "nonaqueous" | "dry" | "aqueous";

/**
 * Development time by developer form. The floor is 10 minutes for every form (ASTM E1417, from
 * memory; NAVSEA T9074-AS-GIB-010/271's 7 minutes for nonaqueous developer is the lower, so the
 * 10 holds). The most: nonaqueous 30 minutes after it dries (NAVSEA, found); dry powder 4 hours and
 * aqueous 2 hours (ASTM E1417, from memory).
 */
export const developmentWindows: Record<DeveloperForm, { label: string; min: number; max: number; source: string }> = {
  nonaqueous: {
    label: "nonaqueous (solvent-suspended)",
    min: 10,
    max: 30,
    source: "ASTM E1417 floor (from memory); NAVSEA T9074-AS-GIB-010/271: 7 to 30 min after it dries",
  },
  dry: { label: "dry powder", min: 10, max: 240, source: "ASTM E1417 (from memory)" },
  aqueous: { label: "aqueous (soluble or suspendable)", min: 10, max: 120, source: "ASTM E1417 (from memory)" },
};

export interface DwellResult {
  allowed: boolean;
  /** The dwell to use, in minutes; null when the temperature does not allow the test. */
  dwellMinutes: number | null;
  /** The shortest dwell allowed (below the specified one only between 100 and 120 °F). */
  shortestMinutes: number | null;
  /**
   * About half the dwell (TM 1-1500-204-23-7), never under the developer form's floor and never
   * over its most.
   */
  developmentMinutes: number | null;
  /** The developer form's window [least, most] in minutes. */
  developmentWindow: [number, number];
  /** The specified dwell is under the standard's minimum. */
  dwellBelowMinimum: boolean;
  temperatureF: number;
  rule: string;
  warnings: string[];
}

/**
 * T.O. 33B-1-1: the specified dwell holds from 60 to 100 °F; from 40 up to 60 °F it doubles; above
 * 100 and up to 120 °F it may be halved but never below 5 minutes; below 40 °F there is no
 * penetrant test. Service-induced flaws (fatigue, stress corrosion) need at least 30 minutes.
 * Above 120 °F the order gives no rule here, so none is invented.
 */
export function penetrantDwell({
  specifiedMinutes,
  temperature,
  unit = "°F",
  serviceInduced = false,
  developer = "nonaqueous",
}: {
  specifiedMinutes: number;
  temperature: number;
  unit?: string;
  serviceInduced?: boolean;
  developer?: DeveloperForm;
}): DwellResult {
  if (!(specifiedMinutes > 0)) refuse("The specified dwell must be more than zero minutes.");
  if (!Number.isFinite(temperature)) refuse("Type the part temperature.");
  const window = developmentWindows[developer];
  if (!window) refuse("Choose the developer form.");
  const t = convert(temperature, unit, "°F");
  const warnings: string[] = [];
  const developmentWindow: [number, number] = [window.min, window.max];
  const dwellBelowMinimum = specifiedMinutes < minimumDwellMinutes;
  if (dwellBelowMinimum) {
    warnings.push(
      `A specified dwell of ${formatNumber(specifiedMinutes, 3)} min is under the ${minimumDwellMinutes}-minute minimum (ASTM E1417, from memory): check the procedure and the penetrant maker's data before you go on.`,
    );
  }
  const blocked = (rule: string): DwellResult => ({
    allowed: false,
    dwellMinutes: null,
    shortestMinutes: null,
    developmentMinutes: null,
    developmentWindow,
    dwellBelowMinimum,
    temperatureF: t,
    rule,
    warnings: [rule, ...warnings],
  });
  if (t < penetrantWindowF.min)
    return blocked(`No penetrant inspection below ${penetrantWindowF.min} °F (T.O. 33B-1-1). Warm the part or move it into the shop.`);
  if (t > penetrantWindowF.max)
    return blocked(
      `Above ${penetrantWindowF.max} °F the penetrant dries in the flaws and T.O. 33B-1-1 gives no rule: cool the part, or follow the penetrant maker's data.`,
    );
  let dwell = specifiedMinutes;
  let shortest = specifiedMinutes;
  let rule = "60 to 100 °F: the specified dwell (T.O. 33B-1-1).";
  if (t < 60) {
    dwell = shortest = 2 * specifiedMinutes;
    rule = "40 to 60 °F: twice the specified dwell (T.O. 33B-1-1).";
  } else if (t > 100) {
    shortest = Math.max(specifiedMinutes / 2, 5);
    rule = "100 to 120 °F: the dwell may be halved, never below 5 minutes (T.O. 33B-1-1).";
  }
  if (serviceInduced && shortest < 30) {
    shortest = Math.max(shortest, 30);
    dwell = Math.max(dwell, 30);
    warnings.push("Service-induced flaws need a dwell of at least 30 minutes (T.O. 33B-1-1).");
  }
  // Half the dwell (TM 1-1500-204-23-7), inside the developer's window: a short dwell never makes a
  // development time under the floor.
  const half = dwell / 2;
  const developmentMinutes = Math.min(Math.max(half, window.min), window.max);
  if (half > window.max)
    warnings.push(
      `Half the dwell is more than the ${window.max} min the ${window.label} developer allows: inspect within ${window.max} min.`,
    );
  return {
    allowed: true,
    dwellMinutes: dwell,
    shortestMinutes: shortest,
    developmentMinutes,
    developmentWindow,
    dwellBelowMinimum,
    temperatureF: t,
    rule,
    warnings,
  };
}

/**
 * How the part sits in the coil, each with its own formula (ASTM E1444; the first also T.O.
 * 33B-1-1). Fill factor = coil cross-section ÷ part cross-section.
 *  - "wall": low fill factor (10 or more), part against the coil wall: NI = 45,000 ÷ (L/D).
 *  - "centred": low fill factor, part on the coil's axis: NI = 43,000 R ÷ (6 (L/D) − 5), R the
 *    coil radius in inches (from memory).
 *  - "high-fill": high fill factor (2 or less) or a cable wrapped on the part: NI = 35,000 ÷ (L/D + 2)
 *    (from memory).
 */
export type CoilArrangement = "wall" | "centred" | "high-fill";

export const coilArrangements: Record<CoilArrangement, string> = {
  wall: "Low fill factor, part against the coil wall",
  centred: "Low fill factor, part centred in the coil",
  "high-fill": "High fill factor, or a cable wrapped on the part",
};

/**
 * The formulas hold for L/D from 3 (T.O. 33B-1-1: 3 or less needs pole pieces) to 15; above 15, 15
 * is used (ASTM E1444, from memory).
 */
export const coilRatioRange = { lowest: 3, cap: 15 } as const;

export interface CoilShot {
  /** The part's own L/D, with the effective diameter for a hollow part. */
  ratio: number;
  /** The L/D put into the formula: the cap above 15. */
  ratioUsed: number;
  /** Diameter used: D, or √(OD² − ID²) for a hollow part. */
  effectiveDiameter: number;
  /** Coil cross-section ÷ part cross-section, when the coil's inside diameter is given. */
  fillFactor: number | null;
  amperes: number;
  /** ±10 % of the current (ASTM E1444, from memory). */
  range: [number, number];
  formula: string;
  warnings: string[];
  notes: string[];
}

/**
 * The coil current for a longitudinal shot. Refuses what the formulas do not cover: L/D of 3 or
 * less (pole pieces lengthen the part: enter the length with them), an intermediate fill factor
 * between 2 and 10, a bore as big as the part.
 */
export function coilShotCurrent({
  length,
  diameter,
  turns,
  arrangement = "wall",
  insideDiameter = 0,
  coilDiameter = null,
  polePieces = false,
}: {
  length: number;
  diameter: number;
  turns: number;
  arrangement?: CoilArrangement;
  /** The bore of a hollow part, 0 for a solid one. */
  insideDiameter?: number;
  /** The coil's inside diameter, in inches: needed for a centred part (its radius is in the formula). */
  coilDiameter?: number | null;
  /** The length entered includes pole pieces of the part's diameter at its ends. */
  polePieces?: boolean;
}): CoilShot {
  if (!(length > 0) || !(diameter > 0)) refuse("Length and diameter must be more than zero.");
  if (!Number.isInteger(turns) || turns < 1) refuse("The coil has a whole number of turns, one or more.");
  if (!(insideDiameter >= 0)) refuse("The bore of a hollow part is zero or more.");
  if (insideDiameter >= diameter) refuse("The bore must be smaller than the outside diameter.");
  if (coilDiameter != null && !(coilDiameter > 0)) refuse("The coil's inside diameter must be more than zero.");
  if (arrangement === "centred" && coilDiameter == null)
    refuse("A part centred in the coil needs the coil's inside diameter: its radius is in the formula.");
  if (coilDiameter != null && coilDiameter <= diameter) refuse("The coil's inside diameter must be larger than the part.");

  // A hollow part carries flux only in its wall: the effective diameter is that of a solid bar of
  // the same metal cross-section, √(OD² − ID²) (ASTM E1444, from memory).
  const effectiveDiameter = insideDiameter > 0 ? Math.sqrt(diameter * diameter - insideDiameter * insideDiameter) : diameter;
  const ratio = length / effectiveDiameter;
  if (ratio <= coilRatioRange.lowest) {
    refuse(
      polePieces
        ? `L/D is ${formatAgainst(ratio, coilRatioRange.lowest, 4)} even with the pole pieces: add longer pole pieces until L/D is over ${coilRatioRange.lowest} (T.O. 33B-1-1).`
        : `L/D is ${formatAgainst(ratio, coilRatioRange.lowest, 4)}, ${coilRatioRange.lowest} or less: the formula gives no current. Add pole pieces (steel bars of the same diameter) to lengthen the part and enter the length with them (T.O. 33B-1-1).`,
    );
  }
  // Fill factor from the coil bore and the part's outside diameter (the area it fills).
  const fillFactor = coilDiameter != null ? (coilDiameter / diameter) ** 2 : null;
  if (fillFactor !== null && fillFactor > 2 && fillFactor < 10) {
    refuse(
      `The fill factor is ${formatAgainst(fillFactor, fillFactor < 6 ? 2 : 10, 3)}, between 2 and 10: neither the low nor the high fill-factor formula holds. Use the intermediate formula of your procedure, or a coil that suits the part.`,
    );
  }
  if (fillFactor !== null && arrangement !== "high-fill" && fillFactor <= 2) {
    refuse(
      `The fill factor is ${formatAgainst(fillFactor, 2, 3)}: 2 or less is a high fill factor. Choose "${coilArrangements["high-fill"]}".`,
    );
  }
  if (fillFactor !== null && arrangement === "high-fill" && fillFactor >= 10) {
    refuse(
      `The fill factor is ${formatAgainst(fillFactor, 10, 3)}: 10 or more is a low fill factor. Choose whether the part lies against the coil wall or is centred.`,
    );
  }
  const ratioUsed = Math.min(ratio, coilRatioRange.cap);
  const notes: string[] = [];
  if (ratio > coilRatioRange.cap)
    notes.push(
      `L/D is ${formatAgainst(ratio, coilRatioRange.cap, 4)}: the formula uses ${coilRatioRange.cap}, its cap (ASTM E1444, from memory). A long part may need more than one shot along its length.`,
    );
  if (insideDiameter > 0)
    notes.push(
      `Hollow part: effective diameter √(${formatNumber(diameter, 4)}² − ${formatNumber(insideDiameter, 4)}²) = ${formatNumber(effectiveDiameter, 4)} in.`,
    );

  let ampereTurns: number;
  let formula: string;
  if (arrangement === "wall") {
    ampereTurns = 45_000 / ratioUsed;
    formula = "I = 45,000 ÷ ((L/D) × N)";
  } else if (arrangement === "centred") {
    const r = coilDiameter! / 2;
    ampereTurns = (43_000 * r) / (6 * ratioUsed - 5);
    formula = "I = 43,000 × R ÷ ((6 × L/D − 5) × N)";
  } else {
    ampereTurns = 35_000 / (ratioUsed + 2);
    formula = "I = 35,000 ÷ ((L/D + 2) × N)";
  }
  const amperes = ampereTurns / turns;
  notes.push(
    "The current is a starting value, ±10 %: check the field on the part with a field indicator (a pie gauge or shim) before you trust the shot.",
  );
  return { ratio, ratioUsed, effectiveDiameter, fillFactor, amperes, range: [amperes * 0.9, amperes * 1.1], formula, warnings: [], notes };
}
