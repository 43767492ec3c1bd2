// Is a measured value inside its limits? The student may type the value in any unit of the same
// kind as the limit (mm against an inch limit, N·m against in-lb, °C against °F); the judgement is
// made in the limit's unit and the conversion is shown, so nobody has to trust a hidden number.
import { convert, dimensionOf, formatNumber, parseQuantity, resolveUnit, unitLabel } from "./units";

export interface Limit {
  unit: string;
  min?: number | null;
  max?: number | null;
  nominal?: number | null;
  tolerance?: number | null;
}

export type Judgement =
  | { status: "in" | "out"; value: number; unit: string; converted: number; limitUnit: string; shown: string; limitText: string; message: string }
  | { status: "invalid"; message: string };

/** The limit as [low, high] in its unit; nominal ± tolerance wins over min/max when both are set. */
export function limitRange(limit: Limit): { low: number | null; high: number | null } {
  if (limit.nominal != null && limit.tolerance != null) {
    return { low: limit.nominal - Math.abs(limit.tolerance), high: limit.nominal + Math.abs(limit.tolerance) };
  }
  return { low: limit.min ?? null, high: limit.max ?? null };
}

export function describeLimit(limit: Limit): string {
  const u = unitLabel(resolveUnit(limit.unit) ?? limit.unit);
  if (limit.nominal != null && limit.tolerance != null) {
    return `${formatNumber(limit.nominal, 6)} ± ${formatNumber(Math.abs(limit.tolerance), 6)} ${u}`;
  }
  const { low, high } = limitRange(limit);
  if (low != null && high != null) return `${formatNumber(low, 6)} to ${formatNumber(high, 6)} ${u}`;
  if (low != null) return `at least ${formatNumber(low, 6)} ${u}`;
  if (high != null) return `at most ${formatNumber(high, 6)} ${u}`;
  return `any value in ${u}`;
}

// A reading typed from a gauge is never more exact than this; without it 0.1 + 0.2 would be "out"
// of a 0.3 maximum. One part in a billion of the limit is far below any gauge's resolution.
const relativeSlack = 1e-9;

export function judgeValue(input: string | { value: number; unit: string }, limit: Limit): Judgement {
  const limitUnit = resolveUnit(limit.unit);
  if (!limitUnit) return { status: "invalid", message: `The limit's unit "${limit.unit}" is not known.` };
  const quantity = typeof input === "string" ? parseQuantity(input, limit.unit) : { value: input.value, unit: resolveUnit(input.unit) ?? "" };
  if (!quantity || !quantity.unit) {
    return { status: "invalid", message: `Type a number, with a unit if it is not ${unitLabel(limitUnit)} (for example "12.5 mm").` };
  }
  if (!Number.isFinite(quantity.value)) return { status: "invalid", message: "Type a number." };
  if (dimensionOf(quantity.unit) !== dimensionOf(limitUnit)) {
    return { status: "invalid", message: `${unitLabel(quantity.unit)} does not measure the same thing as ${unitLabel(limitUnit)}.` };
  }
  const converted = convert(quantity.value, quantity.unit, limitUnit);
  const { low, high } = limitRange(limit);
  const slack = Math.max(Math.abs(low ?? 0), Math.abs(high ?? 0), 1) * relativeSlack;
  const tooLow = low != null && converted < low - slack;
  const tooHigh = high != null && converted > high + slack;
  const limitText = describeLimit(limit);
  const shown =
    quantity.unit === limitUnit
      ? `${formatNumber(quantity.value, 6)} ${unitLabel(limitUnit)}`
      : `${formatNumber(quantity.value, 6)} ${unitLabel(quantity.unit)} = ${formatNumber(converted, 5)} ${unitLabel(limitUnit)}`;
  const status = tooLow || tooHigh ? "out" : "in";
  const message =
    status === "in"
      ? `${shown}: within limits (${limitText}).`
      : `${shown}: OUT OF LIMITS, ${tooLow ? "below" : "above"} ${limitText}. Stop and tell your instructor.`;
  return { status, value: quantity.value, unit: quantity.unit, converted, limitUnit, shown, limitText, message };
}
