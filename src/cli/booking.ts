/**
 * `plan --booking FILE`: books track periods by the file's rules instead of
 * whole windows (src/plan/booking). The plan command calls `readBooking`
 * before the work (a bad file exits 2 with no output) and `runBooking` after
 * the contacts are found; a missed hard requirement makes the exit code 1.
 */
import { loadBooking } from '../scenario/booking.js';
import type { Scenario } from '../scenario/types.js';
import { bookNetwork, type BookingResult } from '../plan/booking/solve.js';
import { bookedPlan } from '../plan/booking/booked-plan.js';
import type { BookingRules } from '../plan/booking/types.js';
import type { RecorderResult } from '../plan/recorder.js';
import type { PlanResult } from '../plan/types.js';
import { bookingJson, renderBookingCsv, renderBookingTable, renderRequirementsCsv } from '../report/booking.js';

export const BOOKING_OUTPUTS = ['booking.csv', 'requirements.csv'];

export function readBooking(file: string | undefined, scenario: Scenario): BookingRules | undefined {
  return file === undefined ? undefined : loadBooking(file, scenario);
}

export interface BookingRun {
  booking: BookingResult;
  plan: PlanResult;
  recorders: RecorderResult;
  json: Record<string, unknown>;
  table: (zone?: string) => string;
  files: { name: string; content: string }[];
  exitCode: 0 | 1;
}

export async function runBooking(unscheduled: PlanResult, scenario: Scenario, rules: BookingRules): Promise<BookingRun> {
  const booking = await bookNetwork(unscheduled, scenario, rules);
  const { plan, recorders } = bookedPlan(unscheduled, booking, scenario.spacecraft);
  return {
    booking,
    plan,
    recorders,
    json: bookingJson(booking, recorders),
    table: (zone) => renderBookingTable(unscheduled, booking, zone, recorders),
    files: [
      { name: 'booking.csv', content: renderBookingCsv(booking, recorders) },
      { name: 'requirements.csv', content: renderRequirementsCsv(booking) },
    ],
    exitCode: booking.missedHard > 0 ? 1 : 0,
  };
}
