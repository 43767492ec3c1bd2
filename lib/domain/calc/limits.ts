// Is a measured value inside its limits? The student may type the value in any unit of the same
// kind as the limit (mm against an inch limit, N·m against in-lb, °C against °F); the judgement is
// made in the limit's unit and the conversion is shown, so nobody has to trust a hidden number.
import { convert, dimensionOf, formatAgainst, formatNumber, parseQuantity, resolveUnit, unitLabel } from "@/lib/domain/calc/units";

export interface Limit {
  unit: string;
  min?: number | null;
  max?: number | null;
  nominal?: number | null;
  tolerance?: number | null;
}

export type Judgement =
  | {
      status: "in" | "out";
      value: number;
      unit: string;
      converted: number;
      limitUnit: string;
      shown: string;
      limitText: string;
      message: string;
    }
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
  // A shown minimum is never rounded down, nor a maximum up: the text never allows more than the limit.
  const { low, high } = limitRange(limit);
  const lowText = low != null ? formatNumber(low, 6, "up") : "";
  const highText = high != null ? formatNumber(high, 6, "down") : "";
  if (low != null && high != null) return `${lowText} to ${highText} ${u}`;
  if (low != null) return `at least ${lowText} ${u}`;
  if (high != null) return `at most ${highText} ${u}`;
  return `any value in ${u}`;
}

// A reading typed from a gauge is never more exact than this; without it 0.1 + 0.2 would be "out"
// of a 0.3 maximum. One part in a billion of the limit is far below any gauge's resolution.
const relativeSlack = 1e-9;

export function judgeValue(input: string | { value: number; unit: string }, limit: Limit): Judgement {
  const limitUnit = resolveUnit(limit.unit);
  if (!limitUnit) return { status: "invalid", message: `The limit's unit "${limit.unit}" is not known.` };
  const quantity =
    typeof input === "string" ? parseQuantity(input, limit.unit) : { value: input.value, unit: resolveUnit(input.unit) ?? "" };
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
  // An "out" reading is shown with the digits that put it past the limit ("0.2500004 in", not
  // "0.25 in: OUT … at most 0.25 in").
  const crossed = tooLow ? low : tooHigh ? high : null;
  const convertedText = crossed != null ? formatAgainst(converted, crossed, 5) : formatNumber(converted, 5);
  const typedText =
    crossed != null && quantity.unit === limitUnit ? formatAgainst(quantity.value, crossed, 6) : formatNumber(quantity.value, 6);
  const shown =
    quantity.unit === limitUnit
      ? `${typedText} ${unitLabel(limitUnit)}`
      : `${typedText} ${unitLabel(quantity.unit)} = ${convertedText} ${unitLabel(limitUnit)}`;
  const status = tooLow || tooHigh ? "out" : "in";
  const message =
    status === "in"
      ? `${shown}: within limits (${limitText}).`
      : `${shown}: OUT OF LIMITS, ${tooLow ? "below" : "above"} ${limitText}. Stop and tell your instructor.`;
  return { status, value: quantity.value, unit: quantity.unit, converted, limitUnit, shown, limitText, message };
}
