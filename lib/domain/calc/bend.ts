// Sheet-metal bending: setback, bend allowance and the flat pattern, with the minimum bend radius of
// 2024-T3 and 2024-O from AC 43.13-1B Table 4-6. Inches and degrees throughout. No negative
// thickness, radius or dimension gets a number: each function refuses them itself.
import { formatAgainst, formatNumber, refuse } from "@/lib/domain/calc/units";

/** K = tan(angle / 2): 1 at 90°, 0.41421 at 45°, 2.414 at 135° (AC 43.13-1B Table 4-7). */
export function kFactor(degrees: number): number {
  if (!(degrees > 0 && degrees < 180)) refuse("A bend angle is more than 0° and less than 180°.");
  return Math.tan((degrees * Math.PI) / 360);
}

function checkSheet(thickness: number, radius: number) {
  if (!(thickness > 0)) refuse("The sheet thickness must be more than zero.");
  if (!(radius >= 0)) refuse("The bend radius is zero or more.");
}

/** SB = K (R + T) (FAA-H-8083-31 ch. 4). */
export function setback({ radius, thickness, degrees = 90 }: { radius: number; thickness: number; degrees?: number }): number {
  checkSheet(thickness, radius);
  return kFactor(degrees) * (radius + thickness);
}

/** BA = (0.01743 R + 0.0078 T) × degrees (sheet-metal handbooks). */
export function bendAllowance({ radius, thickness, degrees = 90 }: { radius: number; thickness: number; degrees?: number }): number {
  checkSheet(thickness, radius);
  kFactor(degrees); // same angle check
  return (0.01743 * radius + 0.0078 * thickness) * degrees;
}

export interface FlatPattern {
  setbacks: number[];
  allowances: number[];
  flats: number[];
  developedLength: number;
  warnings: string[];
}

/**
 * The flat length of a part from its outside (mold-line) dimensions: each flat is its dimension
 * less the setback of every bend at its ends; the developed length is the flats plus the allowances.
 */
export function flatPattern({
  thickness,
  radius,
  dimensions,
  bends,
}: {
  thickness: number;
  radius: number;
  dimensions: number[];
  bends: number[];
}): FlatPattern {
  checkSheet(thickness, radius);
  if (dimensions.length !== bends.length + 1) refuse("A part with n bends has n + 1 outside dimensions.");
  if (!dimensions.every((d) => d > 0)) refuse("Every outside dimension must be more than zero.");
  const setbacks = bends.map((degrees) => setback({ radius, thickness, degrees }));
  const allowances = bends.map((degrees) => bendAllowance({ radius, thickness, degrees }));
  const flats = dimensions.map((d, i) => d - (setbacks[i - 1] ?? 0) - (setbacks[i] ?? 0));
  const warnings: string[] = [];
  flats.forEach((f, i) => {
    if (f <= 0) warnings.push(`Flat ${i + 1} is shorter than its setbacks: the part cannot be bent to these dimensions.`);
  });
  const developedLength = flats.reduce((a, b) => a + b, 0) + allowances.reduce((a, b) => a + b, 0);
  return { setbacks, allowances, flats, developedLength, warnings };
}

/** AC 43.13-1B Table 4-6, 2024-T3, row by row: listed thickness → radius range in multiples of t. */
const table2024T3: [number, number, number][] = [
  [0.016, 1.5, 3],
  [0.032, 2, 4],
  [0.064, 3, 5],
  [0.128, 4, 6],
  [0.182, 4, 6],
  [0.258, 5, 7],
];

export type Temper = "2024-T3" | "2024-O";

export interface RadiusCheck {
  status: "ok" | "tight" | "too-small" | "no-data";
  /** The table row used: the listed thickness at or above the sheet's (the safer side). */
  tableThickness: number | null;
  /** The least radius the table allows for this sheet: never bend tighter. */
  low: number | null;
  /** The top of the table's range: the radius to use unless the drawing calls for a smaller one. */
  high: number | null;
  message: string;
}

export function checkBendRadius({
  thickness,
  radius,
  temper = "2024-T3",
}: {
  thickness: number;
  radius: number;
  temper?: Temper;
}): RadiusCheck {
  checkSheet(thickness, radius);
  if (temper === "2024-O") {
    // 2024-O bends around 0 to 1 t (AC 43.13-1B Table 4-6).
    const high = thickness;
    return radius >= high
      ? { status: "ok", tableThickness: null, low: 0, high, message: "At or above 1 t, the largest radius the table gives for 2024-O." }
      : {
          status: "tight",
          tableThickness: null,
          low: 0,
          high,
          message: "Inside the 0 to 1 t range of AC 43.13-1B Table 4-6 for 2024-O: check the drawing.",
        };
  }
  // Between two listed gauges, the thicker row is used: its multiples of t are the larger, so the
  // safer ones (0.040 in takes the 0.064 row, 3 t to 5 t, not 2 t to 4 t). Only float noise, a
  // billionth of an inch, counts as "on" a listed gauge.
  const row = table2024T3.find(([t]) => t >= thickness - 1e-9);
  if (!row) {
    return {
      status: "no-data",
      tableThickness: null,
      low: null,
      high: null,
      message: "Thicker than AC 43.13-1B Table 4-6 lists for 2024-T3: use the manufacturer's data.",
    };
  }
  const [t, lowT, highT] = row;
  const low = lowT * thickness;
  const high = highT * thickness;
  // The radii are shown rounded up, so a shown minimum never allows a tighter bend than the table.
  const range = `${lowT} t to ${highT} t, ${formatNumber(low, 4, "up")} to ${formatNumber(high, 4, "up")} in (row ${t} in)`;
  if (radius < low - 1e-9) {
    return {
      status: "too-small",
      tableThickness: t,
      low,
      high,
      message: `Too tight: ${formatAgainst(radius, low, 4)} in is smaller than the ${lowT} t minimum of AC 43.13-1B Table 4-6 for 2024-T3 (${range}). The bend is likely to crack.`,
    };
  }
  if (radius < high - 1e-9) {
    return {
      status: "tight",
      tableThickness: t,
      low,
      high,
      message: `Inside the table's range of ${range}: use the larger radius unless the drawing calls for this one.`,
    };
  }
  return {
    status: "ok",
    tableThickness: t,
    low,
    high,
    message: `At or above ${highT} t, the largest radius the table gives for this gauge (${range}).`,
  };
}
