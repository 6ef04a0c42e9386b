/**
 * `plan --booking FILE`: books track periods by the file's rules instead of
 * whole windows (src/plan/booking). The plan command calls `readBooking`
 * before the work (a bad file exits 2 with no output) and `runBooking` after
 * the contacts are found; a missed hard requirement makes the exit code 1.
 */
import type { Scenario } from '../scenario/types.js';
import type { BookingResult } from '../plan/booking/solve.js';
import type { BookingRules } from '../plan/booking/types.js';
import type { RecorderResult } from '../plan/recorder.js';
import type { PlanResult } from '../plan/types.js';

// The booking modules load only when --booking is given (plan's start-up stays as it was).

export const BOOKING_OUTPUTS = ['booking.csv', 'requirements.csv'];

export async function readBooking(file: string | undefined, scenario: Scenario): Promise<BookingRules | undefined> {
  if (file === undefined) return undefined;
  const { loadBooking } = await import('../scenario/booking.js');
  return loadBooking(file, scenario);
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
  const { bookNetwork } = await import('../plan/booking/solve.js');
  const { bookedPlan } = await import('../plan/booking/booked-plan.js');
  const { bookingJson, renderBookingCsv, renderBookingTable, renderRequirementsCsv } = await import('../report/booking.js');
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
