// A torque wrench with an extension or adapter on its square drive: what to set the wrench to so
// that the fastener gets the torque the manual asks for. The formula assumes the adapter lies in
// line with the wrench handle (TM 1-1500-204-23-9).

export type AdapterDirection = "lengthens" | "shortens";

function check(lever: number, adapter: number, direction: AdapterDirection) {
  if (!(lever > 0)) throw new RangeError("The wrench length must be more than zero.");
  if (!(adapter >= 0)) throw new RangeError("The adapter length is zero or more.");
  if (direction === "shortens" && adapter >= lever) throw new RangeError("An adapter that shortens the lever must be shorter than the wrench.");
}

/** TW = TA × L / (L + A); with an adapter pointing back toward the handle, L − A (TM 1-1500-204-23-9). */
export function wrenchSetting({ desired, lever, adapter, direction = "lengthens" }: { desired: number; lever: number; adapter: number; direction?: AdapterDirection }): number {
  check(lever, adapter, direction);
  return (desired * lever) / (direction === "lengthens" ? lever + adapter : lever - adapter);
}

/** The torque the fastener gets for a given wrench setting (TM 9-254's reverse example). */
export function appliedTorque({ setting, lever, adapter, direction = "lengthens" }: { setting: number; lever: number; adapter: number; direction?: AdapterDirection }): number {
  check(lever, adapter, direction);
  return (setting * (direction === "lengthens" ? lever + adapter : lever - adapter)) / lever;
}
