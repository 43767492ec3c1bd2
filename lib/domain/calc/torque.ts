// A torque wrench with an extension or adapter on its square drive: what to set the wrench to so
// that the fastener gets the torque the manual asks for. The formula assumes the adapter lies in
// line with the wrench handle (TM 1-1500-204-23-9).
import { formatNumber, refuse } from "@/lib/domain/calc/units";

export type AdapterDirection = "lengthens" | "shortens";

/**
 * The shortest lever left by an adapter that points back toward the handle, as a share of the
 * wrench: below half, the setting is more than twice the torque wanted, and a small error in
 * where the hand or the adapter sits becomes a large error at the fastener (an adapter of 9.9 in
 * on a 10 in wrench asks for 100 times the torque). The calculator's own rule (common practice:
 * turn the adapter to point away, or use a longer wrench), not a handbook value.
 */
export const shortestLeverShare = 0.5;

function check(lever: number, adapter: number, direction: AdapterDirection) {
  if (!(lever > 0)) refuse("The wrench length must be more than zero.");
  if (!(adapter >= 0)) refuse("The adapter length is zero or more.");
  if (direction === "shortens" && lever - adapter < shortestLeverShare * lever - 1e-9) {
    refuse(
      `An adapter that points back toward the handle may take off at most half the wrench length (${formatNumber(lever / 2, 4, "down")} in of ${formatNumber(lever, 4)} in): ` +
        "beyond that the setting grows without bound. Turn the adapter to point away from the handle, or use a longer wrench.",
    );
  }
}

function positive(torque: number, what: string) {
  if (!(torque > 0)) refuse(`The ${what} must be more than zero.`);
}

/** TW = TA × L / (L + A); with an adapter pointing back toward the handle, L − A (TM 1-1500-204-23-9). */
export function wrenchSetting({
  desired,
  lever,
  adapter,
  direction = "lengthens",
}: {
  desired: number;
  lever: number;
  adapter: number;
  direction?: AdapterDirection;
}): number {
  positive(desired, "torque the manual asks for");
  check(lever, adapter, direction);
  return (desired * lever) / (direction === "lengthens" ? lever + adapter : lever - adapter);
}

/** The torque the fastener gets for a given wrench setting (TM 9-254's reverse example). */
export function appliedTorque({
  setting,
  lever,
  adapter,
  direction = "lengthens",
}: {
  setting: number;
  lever: number;
  adapter: number;
  direction?: AdapterDirection;
}): number {
  positive(setting, "wrench setting");
  check(lever, adapter, direction);
  return (setting * (direction === "lengthens" ? lever + adapter : lever - adapter)) / lever;
}

/** What to say beside a setting whose geometry the formula accepts but a shop would question. */
export function adapterWarnings({
  lever,
  adapter,
  direction = "lengthens",
}: {
  lever: number;
  adapter: number;
  direction?: AdapterDirection;
}): string[] {
  const warnings: string[] = [];
  if (direction === "lengthens" && adapter > lever) {
    warnings.push(
      "The adapter is longer than the wrench: the setting is under half the torque wanted, low in the wrench's range where it is least accurate. Use a larger wrench or a shorter adapter if you can (common practice).",
    );
  }
  return warnings;
}
