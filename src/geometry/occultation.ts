/**
 * Occultation by the Moon: is the line of sight from a station to a spacecraft cut by
 * the Moon's sphere?
 *
 * Model: the segment station -> spacecraft against a sphere of radius R + margin around
 * the Moon's centre (R the mean radius, the grazing margin a stated height for terrain
 * and the ray's own clearance). With d = spacecraft - station and m = Moon - station,
 * the closest point of the segment to the Moon's centre is at s* = clamp(m.d / d.d, 0, 1),
 * at distance D = |m - s* d|. The margin of sight, as an angle seen from the station,
 *   g = (D - (R + margin)) / |m|   (rad, returned in deg; > 0: clear, <= 0: occulted),
 * is continuous in time (the clamp keeps it so), so the contact search can find its
 * zeros like any mask crossing. Geometric (straight rays, no light-time difference
 * between the Moon's and the craft's positions: both at the craft's transmit time).
 * Units: km in, degrees out.
 */
const RAD_TO_DEG = 180 / Math.PI;

export function moonSightMarginDeg(
  stationEcefKm: ArrayLike<number>,
  craftEcefKm: ArrayLike<number>,
  moonEcefKm: ArrayLike<number>,
  radiusKm: number,
): number {
  const sx = stationEcefKm[0]!;
  const sy = stationEcefKm[1]!;
  const sz = stationEcefKm[2]!;
  const dx = craftEcefKm[0]! - sx;
  const dy = craftEcefKm[1]! - sy;
  const dz = craftEcefKm[2]! - sz;
  const mx = moonEcefKm[0]! - sx;
  const my = moonEcefKm[1]! - sy;
  const mz = moonEcefKm[2]! - sz;
  const dd = dx * dx + dy * dy + dz * dz;
  let s = (mx * dx + my * dy + mz * dz) / dd;
  if (s < 0) s = 0;
  else if (s > 1) s = 1;
  const ex = mx - s * dx;
  const ey = my - s * dy;
  const ez = mz - s * dz;
  const closestKm = Math.sqrt(ex * ex + ey * ey + ez * ez);
  return ((closestKm - radiusKm) / Math.sqrt(mx * mx + my * my + mz * mz)) * RAD_TO_DEG;
}
