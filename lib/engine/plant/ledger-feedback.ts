/**
 * The plant's fan and defrost heat added to a room ledger computed without them, exactly as
 * the ledger itself adds its `evaporatorFans` and `defrost` lines (lib/engine/loads/ledger.ts:
 * fans q = P·h/24 spread evenly over the day, defrost q = P·(min/60)·n·share/24 spread evenly,
 * then the sums, the safety factor and the run time). This lets the fan/defrost fixed point
 * call the ledger once per room instead of once per trial. `ledger-feedback.test.ts` checks
 * the result against the ledger's own computation field by field, so a change to the
 * ledger's treatment of these two lines cannot pass unnoticed.
 */
import type { LoadComponent, RoomLoadResult } from "../loads";
import type { RoomFeedback } from "./evaporator";

const HANDBOOK = "ASHRAE Handbook—Refrigeration, refrigerated-facility loads chapter";

/** The ledger inputs that make the room's fan and defrost lines zero. */
export const NO_FEEDBACK: RoomFeedback = {
  evaporatorFans: { powerW: 0, hoursPerDay: 24 },
  defrost: { heaterW: 0, minutesPerDefrost: 0, defrostsPerDay: 0, fractionToRoom: 0 },
};

/**
 * `base` (the room computed with {@link NO_FEEDBACK}) plus the fan and defrost lines of `fb`:
 * the same result the ledger gives for the room with `fb` in its fields.
 */
export function withFeedback(base: RoomLoadResult, fb: RoomFeedback): RoomLoadResult {
  const components: LoadComponent[] = base.components.slice();
  const hourly = base.hourly.slice();
  const fans = fb.evaporatorFans;
  if (fans.powerW > 0) {
    const energyWh = fans.powerW * fans.hoursPerDay;
    components.push(line("evaporatorFans", "evaporator fans", energyWh / 24, {
      method: "Evaporator fan motor heat (all input inside the room)",
      source: HANDBOOK,
      inputs: { powerW: fans.powerW, hoursPerDay: fans.hoursPerDay },
      formula: "q = P·h/24",
    }));
    spreadDay(hourly, energyWh);
  }
  const d = fb.defrost;
  const defrostWh = d.heaterW * (d.minutesPerDefrost / 60) * d.defrostsPerDay * d.fractionToRoom;
  if (defrostWh > 0) {
    components.push(line("defrost", "defrost", defrostWh / 24, {
      method: "Defrost heat reaching the room",
      source: `${HANDBOOK}; share to room a third to a half (common practice)`,
      inputs: { heaterW: d.heaterW, minutesPerDefrost: d.minutesPerDefrost, defrostsPerDay: d.defrostsPerDay, fractionToRoom: d.fractionToRoom },
      formula: "q = P·(min/60)·n·share / 24",
    }));
    spreadDay(hourly, defrostWh);
  }
  let averageLoadW = 0;
  let latentW = 0;
  for (const c of components) {
    averageLoadW += c.powerW;
    latentW += c.latentW;
  }
  const sensibleW = averageLoadW - latentW;
  let peakHour = 0;
  for (let h = 1; h < 24; h++) if (hourly[h] > hourly[peakHour]) peakHour = h;
  const sf = base.safetyFactor;
  const totalEnergyKWhPerDay = (averageLoadW * 24) / 1000;
  const requiredCapacityW = (averageLoadW * 24 * (1 + sf)) / base.runHoursPerDay;
  const requiredPeakCapacityW = hourly[peakHour] * (1 + sf);
  return {
    ...base,
    components,
    totalEnergyKWhPerDay,
    averageLoadW,
    requiredCapacityW,
    sensibleW,
    latentW,
    sensibleHeatRatio: averageLoadW > 0 ? sensibleW / averageLoadW : 1,
    hourly,
    peakHourW: hourly[peakHour],
    peakHour,
    requiredPeakCapacityW,
    designCapacityW: Math.max(requiredCapacityW, requiredPeakCapacityW),
    capacityTrace: {
      ...base.capacityTrace,
      inputs: { ...base.capacityTrace.inputs, totalEnergyKWhPerDay, peakHour, peakHourW: hourly[peakHour] },
    },
  };
}

/**
 * The design capacity alone for `fb` (what the fixed point iterates on): the same sums as
 * {@link withFeedback} without building the result.
 */
export function designCapacityWithFeedback(base: RoomLoadResult, fb: RoomFeedback): number {
  const fans = fb.evaporatorFans;
  const fanW = fans.powerW > 0 ? (fans.powerW * fans.hoursPerDay) / 24 : 0;
  const d = fb.defrost;
  const defW = Math.max(0, (d.heaterW * (d.minutesPerDefrost / 60) * d.defrostsPerDay * d.fractionToRoom) / 24);
  const extra = fanW + defW;
  let peak = 0;
  for (let h = 0; h < 24; h++) peak = Math.max(peak, base.hourly[h] + extra);
  const sf = base.safetyFactor;
  return Math.max(((base.averageLoadW + extra) * 24 * (1 + sf)) / base.runHoursPerDay, peak * (1 + sf));
}

function line(kind: LoadComponent["kind"], label: string, powerW: number, trace: LoadComponent["trace"]): LoadComponent {
  return { kind, label, powerW, energyKWhPerDay: (powerW * 24) / 1000, sensibleW: powerW, latentW: 0, trace };
}

/** Even spread over the day, as the ledger's spreadPeriodic(…, 0, 24). */
function spreadDay(hourly: number[], energyWh: number): void {
  const each = energyWh / 24;
  for (let h = 0; h < 24; h++) hourly[h] += each;
}
