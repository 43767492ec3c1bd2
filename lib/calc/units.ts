// Units a student types at the aircraft, grouped by what they measure. Pure: no framework imports.
// Factors are exact definitions (inch = 25.4 mm, pound = 0.45359237 kg, g = 9.80665 m/s²), so a
// round trip through N·m loses nothing a student could see.

export type Dimension = "length" | "torque" | "temperature" | "pressure" | "force" | "time" | "current" | "angle" | "intensity" | "illuminance" | "volume" | "speed";

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
  in: { dimension: "length", factor: inch, label: "in", aliases: ["inch", "inches", '"', "″"] },
  mm: { dimension: "length", factor: 0.001, label: "mm", aliases: ["millimetre", "millimeter", "millimetres", "millimeters"] },
  cm: { dimension: "length", factor: 0.01, label: "cm", aliases: [] },
  ft: { dimension: "length", factor: 12 * inch, label: "ft", aliases: ["feet", "foot", "'", "′"] },
  thou: { dimension: "length", factor: inch / 1000, label: "thou", aliases: ["mil", "mils", "thousandths"] },
  "in-lb": { dimension: "torque", factor: lbf * inch, label: "in-lb", aliases: ["inlb", "in·lb", "lb-in", "lbin", "lbf·in", "lbf-in", "in.-lb", "inch-pounds", "inch-pound"] },
  "ft-lb": { dimension: "torque", factor: lbf * 12 * inch, label: "ft-lb", aliases: ["ftlb", "ft·lb", "lb-ft", "lbft", "lbf·ft", "lbf-ft", "foot-pounds", "foot-pound"] },
  "N·m": { dimension: "torque", factor: 1, label: "N·m", aliases: ["nm", "n-m", "n.m", "newton-metres", "newton-meters"] },
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
const temperature: Record<string, { label: string; toKelvin: (v: number) => number; fromKelvin: (k: number) => number; aliases: string[] }> = {
  "°F": { label: "°F", toKelvin: (f) => ((f - 32) * 5) / 9 + 273.15, fromKelvin: (k) => ((k - 273.15) * 9) / 5 + 32, aliases: ["f", "degf", "deg f", "fahrenheit"] },
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

function normalise(name: string): string {
  return name.trim().toLowerCase().replace(/\s+/g, " ").replace(/^deg /, "deg ");
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
  if (!f) throw new RangeError(`Unknown unit "${from}".`);
  if (!t) throw new RangeError(`Unknown unit "${to}".`);
  if (dimensionOf(f) !== dimensionOf(t)) {
    throw new RangeError(`${unitLabel(f)} and ${unitLabel(t)} do not measure the same thing.`);
  }
  if (f === t) return value;
  const tf = temperature[f];
  const tt = temperature[t];
  if (tf && tt) return tt.fromKelvin(tf.toKelvin(value));
  return (value * linear[f]!.factor) / linear[t]!.factor;
}

/** A number for people: no float noise, at most `digits` significant figures. */
export function formatNumber(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return "0";
  const rounded = Number(value.toPrecision(digits));
  return rounded.toString().includes("e") ? rounded.toFixed(6).replace(/\.?0+$/, "") : rounded.toString();
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
