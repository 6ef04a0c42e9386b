/**
 * First-order (non-relativistic) Doppler shift of a downlink carrier.
 *
 * Source: classical Doppler relation f_r = f (1 - v_r / c) to first order in v_r / c
 * (any propagation text; relativistic terms are of order (v/c)^2 ~ 1e-9 for LEO and
 * are neglected). v_r is the range rate, positive when the spacecraft recedes.
 *   dopplerHz = -f v_r / c
 * Units in: freqHz (Hz), rangeRateKmS (km/s). Out: Hz. Valid for |v_r| << c.
 */
import { SPEED_OF_LIGHT_M_S } from './units.js';

/** Received-minus-transmitted frequency, Hz: -freqHz * rangeRate / c. */
export function dopplerShiftHz(freqHz: number, rangeRateKmS: number): number {
  return (-freqHz * rangeRateKmS * 1000) / SPEED_OF_LIGHT_M_S;
}
