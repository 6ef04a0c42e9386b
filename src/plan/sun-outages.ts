/**
 * Sun outages of a plan: for every contact with a data link, the periods when the Sun
 * is within SUN_OUTAGE_BEAMWIDTHS half-power beamwidths (limb) of the station's
 * boresight (geometry/sun-outage.ts), with the noise the Sun adds at the closest point
 * (link/body-noise.ts). Their effect is already in the volumes: every link sample
 * carries the Sun's noise (plan/link.ts).
 */
import { SunOutageSearch } from '../geometry/sun-outage.js';
import { SUN_RADIUS_KM } from '../geometry/sky-bodies.js';
import { discAntennaTempK } from '../link/body-noise.js';
import type { Geometry } from './contacts.js';
import { linkKey, type LinkSetup } from './link.js';
import type { Contact, SunOutage } from './types.js';
import type { PreparedLink } from '../link/types.js';
import type { Site } from '../geometry/types.js';

export function findSunOutages(contacts: readonly Contact[], geometry: Geometry, setup: LinkSetup): SunOutage[] {
  const out: SunOutage[] = [];
  const siteOf = new Map(geometry.sites.map((s) => [s.stationId, s]));
  const searches = new Map<string, SunOutageSearch>();
  // each pair's link and site, found on its first contact (by spacecraft, then station)
  const pairs = new Map<string, Map<string, { link: PreparedLink; site: Site } | null>>();
  for (const c of contacts) {
    let bySt = pairs.get(c.spacecraftId);
    if (!bySt) {
      bySt = new Map();
      pairs.set(c.spacecraftId, bySt);
    }
    let pair = bySt.get(c.stationId);
    if (pair === undefined) {
      const link = setup.links.get(linkKey(c.spacecraftId, c.stationId));
      const site = siteOf.get(c.stationId);
      pair = link && site ? { link, site } : null;
      bySt.set(c.stationId, pair);
    }
    if (pair === null) continue;
    const { link, site } = pair;
    const target = geometry.targets.get(c.spacecraftId);
    if (!target || !(link.rxBeamwidthDeg > 0)) continue;
    let search = searches.get(c.spacecraftId);
    if (!search) {
      search = new SunOutageSearch(target, geometry.sky);
      searches.set(c.spacecraftId, search);
    }
    for (const w of search.find(site, c.aosMs, c.losMs, link.rxBeamwidthDeg, c.maxElevationDeg)) {
      geometry.sky.at(w.minAtMs);
      const sunRadiusDeg = Math.asin(SUN_RADIUS_KM / Math.hypot(geometry.sky.sunEcefKm[0]! - site.ecefKm[0], geometry.sky.sunEcefKm[1]! - site.ecefKm[1], geometry.sky.sunEcefKm[2]! - site.ecefKm[2])) * (180 / Math.PI);
      out.push({
        stationId: c.stationId,
        spacecraftId: c.spacecraftId,
        startMs: w.startMs,
        endMs: w.endMs,
        minOffsetDeg: w.minOffsetDeg,
        minAtMs: w.minAtMs,
        beamwidthDeg: link.rxBeamwidthDeg,
        peakSunNoiseK: discAntennaTempK(link.sunBrightnessK, sunRadiusDeg, w.minOffsetDeg, link.rxBeamwidthDeg),
      });
    }
  }
  return out;
}
