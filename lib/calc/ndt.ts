// Nondestructive testing rules a card step can carry: the penetrant dwell adjusted for the part's
// temperature, and the coil-shot current for magnetic-particle inspection. Values from USAF
// T.O. 33B-1-1, US Army TM 1-1500-204-23-7 and NAVSEA T9074-AS-GIB-010/271.
import { convert } from "./units";

export interface DwellResult {
  allowed: boolean;
  /** The dwell to use, in minutes; null when the temperature does not allow the test. */
  dwellMinutes: number | null;
  /** The shortest dwell allowed (below the specified one only between 100 and 120 °F). */
  shortestMinutes: number | null;
  /** About half the dwell (TM 1-1500-204-23-7). */
  developmentMinutes: number | null;
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
export function penetrantDwell({ specifiedMinutes, temperature, unit = "°F", serviceInduced = false }: { specifiedMinutes: number; temperature: number; unit?: string; serviceInduced?: boolean }): DwellResult {
  if (!(specifiedMinutes > 0)) throw new RangeError("The specified dwell must be more than zero minutes.");
  const t = convert(temperature, unit, "°F");
  const warnings: string[] = [];
  const blocked = (rule: string): DwellResult => ({ allowed: false, dwellMinutes: null, shortestMinutes: null, developmentMinutes: null, temperatureF: t, rule, warnings: [rule] });
  if (t < 40) return blocked("No penetrant inspection below 40 °F (T.O. 33B-1-1). Warm the part or move it into the shop.");
  if (t > 120) return blocked("Above 120 °F the penetrant dries in the flaws: cool the part, or follow the penetrant maker's data.");
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
  return { allowed: true, dwellMinutes: dwell, shortestMinutes: shortest, developmentMinutes: dwell / 2, temperatureF: t, rule, warnings };
}

export interface CoilShot {
  ratio: number;
  amperes: number;
  warnings: string[];
}

/** I = 45,000 / ((L / D) × N) for a part in a coil (T.O. 33B-1-1); L/D of 3 or less needs pole pieces. */
export function coilShotCurrent({ length, diameter, turns }: { length: number; diameter: number; turns: number }): CoilShot {
  if (!(length > 0) || !(diameter > 0)) throw new RangeError("Length and diameter must be more than zero.");
  if (!Number.isInteger(turns) || turns < 1) throw new RangeError("The coil has a whole number of turns, one or more.");
  const ratio = length / diameter;
  const warnings: string[] = [];
  if (ratio <= 3) warnings.push("L/D is 3 or less: add pole pieces (steel bars of the same diameter) to lengthen the part before using this formula (T.O. 33B-1-1).");
  return { ratio, amperes: 45_000 / (ratio * turns), warnings };
}
