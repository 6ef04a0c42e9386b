/**
 * Total attenuation on an Earth-space path: Rec. ITU-R P.618-14 (08/2023), §2.5, Eq. (64):
 *   AT(p) = AG(p) + sqrt((AR(p) + AC(p))^2 + AS(p)^2)
 * §2.5 also says AC(p) and AG(p) are to be taken at p = 5 % when p < 5 % (clouds and gas
 * are correlated with rain). We take the gas attenuation from the instantaneous surface
 * conditions and the cloud attenuation from a single integrated-liquid-water value given
 * by the caller: whatever exceedance those inputs represent is what is combined. A station's
 * climate read from the ITU-R maps takes them at max(p, 5 %) (src/link/climate/station.ts).
 * Units: dB in, dB out.
 */

export function totalAttenuationDb(gasDb: number, rainDb: number, cloudDb: number, scintillationDb: number): number {
  const rc = rainDb + cloudDb;
  return gasDb + Math.sqrt(rc * rc + scintillationDb * scintillationDb);
}
