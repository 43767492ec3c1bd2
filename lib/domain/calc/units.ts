// Units a student types at the aircraft, grouped by what they measure. Pure: no framework imports.
// Factors are exact definitions (inch = 25.4 mm, pound = 0.45359237 kg, g = 9.80665 m/s²), so a
// round trip through N·m loses nothing a student could see.
import { AppError } from "@/lib/domain/errors";

/**
 * The one way a calculator refuses an input its source does not cover (a negative thickness, an
 * adapter that leaves no lever): AppError "invalid", whose message the screens show as it is.
 */
export function refuse(message: string): never {
  throw new AppError("invalid", message);
}

export type Dimension =
  | "length"
  | "torque"
  | "temperature"
  | "pressure"
  | "force"
  | "time"
  | "current"
  | "angle"
  | "intensity"
  | "illuminance"
  | "volume"
  | "speed";

interface LinearUnit {
  dimension: Dimension;
  /** How many of the dimension's base unit one of this unit is. */
  factor: number;
  label: string;
  aliases: string[];
}

const lbf = 0.45359237 * 9.80665; // newtons in one pound-force
const inch = 0.0254; // metres

const linear: Record<string, LinearUnit> = {
  in: { dimension: "length", factor: inch, label: "in", aliases: ["in.", "ins", "inch", "inches", '"', "″"] },
  mm: { dimension: "length", factor: 0.001, label: "mm", aliases: ["mm.", "millimetre", "millimeter", "millimetres", "millimeters"] },
  cm: { dimension: "length", factor: 0.01, label: "cm", aliases: [] },
  ft: { dimension: "length", factor: 12 * inch, label: "ft", aliases: ["ft.", "feet", "foot", "'", "′"] },
  thou: { dimension: "length", factor: inch / 1000, label: "thou", aliases: ["mil", "mils", "thousandths"] },
  "in-lb": {
    dimension: "torque",
    factor: lbf * inch,
    label: "in-lb",
    aliases: [
      "inlb",
      "in·lb",
      "in·lbf",
      "in-lbf",
      "in-lbs",
      "inlbs",
      "in.-lb",
      "in.-lbs",
      "in.lb",
      "in.lbs",
      "lb-in",
      "lbs-in",
      "lbin",
      "lbf·in",
      "lbf-in",
      "lbf.in",
      "lb·in",
      "lb.in",
      "inch-pounds",
      "inch-pound",
      "inch-lbs",
      "inch-lb",
      "pound-inches",
    ],
  },
  "ft-lb": {
    dimension: "torque",
    factor: lbf * 12 * inch,
    label: "ft-lb",
    aliases: [
      "ftlb",
      "ft·lb",
      "ft·lbf",
      "ft-lbf",
      "ft-lbs",
      "ftlbs",
      "ft.-lb",
      "ft.-lbs",
      "ft.lb",
      "ft.lbs",
      "lb-ft",
      "lbs-ft",
      "lbft",
      "lbf·ft",
      "lbf-ft",
      "lbf.ft",
      "lb·ft",
      "lb.ft",
      "foot-pounds",
      "foot-pound",
      "pound-feet",
      "pound-foot",
    ],
  },
  "N·m": {
    dimension: "torque",
    factor: 1,
    label: "N·m",
    aliases: ["nm", "n-m", "n.m", "n·m", "newton-metres", "newton-meters", "newton-metre", "newton-meter"],
  },
  psi: { dimension: "pressure", factor: lbf / (inch * inch), label: "psi", aliases: ["lb/in2", "lb/in²"] },
  kPa: { dimension: "pressure", factor: 1000, label: "kPa", aliases: [] },
  bar: { dimension: "pressure", factor: 100_000, label: "bar", aliases: [] },
  lb: { dimension: "force", factor: lbf, label: "lb", aliases: ["lbf", "lbs", "pounds", "pound"] },
  N: { dimension: "force", factor: 1, label: "N", aliases: ["newton", "newtons"] },
  s: { dimension: "time", factor: 1, label: "s", aliases: ["sec", "secs", "second", "seconds"] },
  min: { dimension: "time", factor: 60, label: "min", aliases: ["mins", "minute", "minutes"] },
  h: { dimension: "time", factor: 3600, label: "h", aliases: ["hr", "hrs", "hour", "hours"] },
  A: { dimension: "current", factor: 1, label: "A", aliases: ["amp", "amps", "ampere", "amperes"] },
  deg: { dimension: "angle", factor: 1, label: "°", aliases: ["°", "degree", "degrees"] },
  "µW/cm²": { dimension: "intensity", factor: 1, label: "µW/cm²", aliases: ["uw/cm2", "µw/cm2", "uw/cm²", "microwatts/cm2"] },
  fc: { dimension: "illuminance", factor: 10.763910416709722, label: "fc", aliases: ["foot-candles", "footcandles"] },
  lx: { dimension: "illuminance", factor: 1, label: "lx", aliases: ["lux"] },
  "US qt": { dimension: "volume", factor: 0.946352946, label: "US qt", aliases: ["qt", "quart", "quarts"] },
  "US gal": { dimension: "volume", factor: 3.785411784, label: "US gal", aliases: ["gal", "gallon", "gallons"] },
  L: { dimension: "volume", factor: 1, label: "L", aliases: ["l", "litre", "liter", "litres", "liters"] },
  rpm: { dimension: "speed", factor: 1, label: "rpm", aliases: [] },
};

/** Temperatures are not proportional: each has an offset. Base is kelvin. */
const temperature: Record<
  string,
  { label: string; toKelvin: (v: number) => number; fromKelvin: (k: number) => number; aliases: string[] }
> = {
  "°F": {
    label: "°F",
    toKelvin: (f) => ((f - 32) * 5) / 9 + 273.15,
    fromKelvin: (k) => ((k - 273.15) * 9) / 5 + 32,
    aliases: ["f", "degf", "deg f", "fahrenheit"],
  },
  "°C": { label: "°C", toKelvin: (c) => c + 273.15, fromKelvin: (k) => k - 273.15, aliases: ["c", "degc", "deg c", "celsius"] },
  K: { label: "K", toKelvin: (k) => k, fromKelvin: (k) => k, aliases: ["kelvin"] },
};

const lookup = new Map<string, string>();
for (const [code, unit] of Object.entries(linear)) {
  for (const name of [code, unit.label, ...unit.aliases]) lookup.set(normalise(name), code);
}
for (const [code, unit] of Object.entries(temperature)) {
  for (const name of [code, unit.label, ...unit.aliases]) lookup.set(normalise(name), code);
}

/**
 * Lower case, one space, and the marks people type for the same thing made one: the dot operator,
 * bullet and middle dot between unit names ("N⋅m", "lbf•ft"), and the dashes of a word processor
 * ("ft–lb").
 */
function normalise(name: string): string {
  return name
    .trim()
    .toLowerCase()
    .replace(/[\u22c5\u2022\u2219\u00b7]/g, "·")
    .replace(/[\u2010-\u2015\u2212]/g, "-")
    .replace(/\s+/g, " ");
}

/** The unit's code ("in-lb", "°F") for anything a student might type, or null. */
export function resolveUnit(name: string): string | null {
  const n = normalise(name);
  return lookup.get(n) ?? lookup.get(n.replace(/ /g, "")) ?? null;
}

export function dimensionOf(code: string): Dimension | null {
  if (code in temperature) return "temperature";
  return linear[code]?.dimension ?? null;
}

export function unitLabel(code: string): string {
  return linear[code]?.label ?? temperature[code]?.label ?? code;
}

/** Units of one dimension, for a picker. */
export function unitsOf(dimension: Dimension): string[] {
  if (dimension === "temperature") return Object.keys(temperature);
  return Object.entries(linear)
    .filter(([, u]) => u.dimension === dimension)
    .map(([code]) => code);
}

export const allUnits: string[] = [...Object.keys(linear), ...Object.keys(temperature)];

/** Converts between two units of the same dimension; throws for units that do not match. */
export function convert(value: number, from: string, to: string): number {
  const f = resolveUnit(from);
  const t = resolveUnit(to);
  if (!f) refuse(`Unknown unit "${from}".`);
  if (!t) refuse(`Unknown unit "${to}".`);
  if (dimensionOf(f) !== dimensionOf(t)) refuse(`${unitLabel(f)} and ${unitLabel(t)} do not measure the same thing.`);
  if (f === t) return value;
  const tf = temperature[f];
  const tt = temperature[t];
  if (tf && tt) return tt.fromKelvin(tf.toKelvin(value));
  return (value * linear[f]!.factor) / linear[t]!.factor;
}

type Rounding = "nearest" | "up" | "down";

/**
 * A number for people: no float noise, at most `digits` significant figures, never in exponent
 * notation and never "0" or "-0" for a value that is not zero (1e-7 in is "0.0000001", not "0").
 * `rounding` "up" is for a minimum (an edge distance, a bend radius: shown rounded down it would
 * allow less than the rule), "down" for a maximum.
 */
export function formatNumber(value: number, digits = 4, rounding: Rounding = "nearest"): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return "0";
  const exponent = Math.floor(Math.log10(Math.abs(value)));
  const decimals = digits - 1 - exponent;
  const scale = 10 ** decimals;
  let rounded = Number(value.toPrecision(digits));
  if (rounding !== "nearest" && Number.isFinite(scale) && scale > 0) {
    // Float noise (0.1 × 3 = 0.30000000000000004) is not a reason to step up a whole digit.
    const scaled = Number((value * scale).toPrecision(15));
    const stepped = rounding === "up" ? Math.ceil(scaled) : Math.floor(scaled);
    rounded = decimals >= 0 ? stepped / scale : stepped * 10 ** -decimals;
  }
  return plainDecimal(rounded, Math.max(decimals, 0));
}

/** A decimal without exponent notation; past what toFixed can write, "× 10^n". */
function plainDecimal(value: number, decimals: number): string {
  if (value === 0) return "0";
  const abs = Math.abs(value);
  if (abs >= 1e21 || decimals > 100) {
    const [mantissa, exp] = value.toExponential().split("e");
    return `${mantissa} × 10^${Number(exp)}`;
  }
  // toString writes exponents below 1e-6 only; toFixed with the significant decimals does not.
  const text = abs < 1e-6 ? value.toFixed(decimals) : value.toString();
  return text.includes(".") ? text.replace(/0+$/, "").replace(/\.$/, "") : text;
}

/**
 * The value with as many digits as it takes to show which side of `boundary` it lies on, from
 * `digits` up to 12: "0.2500001 in: OUT … at most 0.25 in" rather than "0.25 in: OUT".
 */
export function formatAgainst(value: number, boundary: number, digits = 5): string {
  for (let d = digits; d <= 12; d++) {
    const text = formatNumber(value, d);
    if (Math.sign(Number(text) - boundary) === Math.sign(value - boundary)) return text;
  }
  return formatNumber(value, 15);
}

/** Reads "12.5 mm", "300in-lb", "70 °F", "1/8 in", "3/16"; a bare number takes the default unit. */
export function parseQuantity(text: string, defaultUnit?: string): { value: number; unit: string } | null {
  const m = /^\s*([-+]?(?:\d+\s+\d+\/\d+|\d+\/\d+|\d*\.?\d+(?:e[-+]?\d+)?))\s*(.*?)\s*$/i.exec(text);
  if (!m) return null;
  const value = parseNumber(m[1]!);
  if (value === null) return null;
  const unitText = m[2] ?? "";
  const unit = unitText ? resolveUnit(unitText) : defaultUnit ? resolveUnit(defaultUnit) : null;
  if (!unit) return null;
  return { value, unit };
}

/** "0.040", "1/8", "1 1/4" → a number; anything else → null. */
export function parseNumber(text: string): number | null {
  const t = text.trim();
  const mixed = /^([-+]?\d+)\s+(\d+)\/(\d+)$/.exec(t);
  if (mixed) {
    const whole = Number(mixed[1]);
    const frac = Number(mixed[2]) / Number(mixed[3]);
    return Number(mixed[3]) === 0 ? null : whole < 0 ? whole - frac : whole + frac;
  }
  const fraction = /^([-+]?\d+)\/(\d+)$/.exec(t);
  if (fraction) return Number(fraction[2]) === 0 ? null : Number(fraction[1]) / Number(fraction[2]);
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}
