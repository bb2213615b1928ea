/**
 * The plant's fan and defrost heat added to a room ledger computed without them, through the
 * ledger's own `withEvaporatorHeat`, so the fan/defrost fixed point calls the full ledger once
 * per room instead of once per trial. `designCapacityWithFeedback` is the arithmetic fast
 * path of the trials (fans q = P·h/24 and defrost q = P·(min/60)·n·share/24, both spread
 * evenly); `ledger-feedback.test.ts` checks both against the ledger's own computation.
 */
import { withEvaporatorHeat, type RoomLoadResult } from "../loads";
import type { RoomFeedback } from "./evaporator";

/** The ledger inputs that make the room's fan and defrost lines zero. */
export const NO_FEEDBACK: RoomFeedback = {
  evaporatorFans: { powerW: 0, hoursPerDay: 24 },
  defrost: { heaterW: 0, minutesPerDefrost: 0, defrostsPerDay: 0, fractionToRoom: 0 },
};

/**
 * `base` (the room computed with {@link NO_FEEDBACK}) plus the fan and defrost lines of `fb`,
 * by the ledger's own function: the same result the ledger gives for the room with `fb` in
 * its fields.
 */
export function withFeedback(base: RoomLoadResult, fb: RoomFeedback): RoomLoadResult {
  return withEvaporatorHeat(base, fb.evaporatorFans, fb.defrost);
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
