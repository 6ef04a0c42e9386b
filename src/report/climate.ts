/** Renders the climate inputs of each station with where each came from (file or ITU-R map). */
import type { ClimateInput, StationClimate } from '../link/climate/station.js';
import { renderTable } from './table.js';

export interface StationClimateReport {
  id: string;
  name: string;
  latitudeDeg: number;
  longitudeDeg: number;
  heightKm: number;
  climate: StationClimate;
}

function decimals(unit: string): number {
  return unit === 'K' || unit === 'hPa' || unit === 'N-units' ? 2 : unit === 'kg/m2' || unit === 'km' ? 4 : 3;
}

export function renderClimateInputs(inputs: ClimateInput[]): string {
  const rows = inputs.map((i) => [i.label, i.value.toFixed(decimals(i.unit)), i.unit, i.source]);
  return renderTable([{ header: 'climate input' }, { header: 'value', align: 'right' }, { header: 'unit' }, { header: 'source' }], rows);
}

export function climateHeading(exceedancePercent: number, gasCloudPercent: number): string {
  return `Climate inputs for a link at ${Number((100 - exceedancePercent).toPrecision(12))} % availability (p = ${exceedancePercent} %; gas and cloud at ${gasCloudPercent} %, ITU-R P.618-14 §2.5)`;
}

export function renderClimateTable(stations: StationClimateReport[], exceedancePercent: number): string {
  const gas = stations[0]?.climate.gasCloudExceedancePercent ?? exceedancePercent;
  const parts = [climateHeading(exceedancePercent, gas), ''];
  for (const s of stations) {
    const lat = `${Math.abs(s.latitudeDeg).toFixed(3)} ${s.latitudeDeg < 0 ? 'S' : 'N'}`;
    const lon = `${Math.abs(s.longitudeDeg).toFixed(3)} ${s.longitudeDeg < 0 ? 'W' : 'E'}`;
    parts.push(`${s.id}  ${s.name}  (${lat}, ${lon}, ${(s.heightKm * 1000).toFixed(0)} m)`, renderClimateInputs(s.climate.inputs), '');
  }
  return parts.join('\n');
}

export function renderClimateJson(stations: StationClimateReport[], exceedancePercent: number): string {
  const doc = {
    exceedance_percent: exceedancePercent,
    stations: stations.map((s) => ({
      id: s.id,
      latitude_deg: s.latitudeDeg,
      longitude_deg: s.longitudeDeg,
      height_km: s.heightKm,
      gas_cloud_exceedance_percent: s.climate.gasCloudExceedancePercent,
      inputs: s.climate.inputs.map((i) => ({ field: i.fileField, name: i.label, value: Number(i.value.toPrecision(10)), unit: i.unit, source: i.source })),
    })),
  };
  return JSON.stringify(doc, null, 2) + '\n';
}
